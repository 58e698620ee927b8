import type { Role } from "@/lib/domain/permissions";

declare module "next-auth" {
  interface Session {
    user: { id: number; email: string; name: string; role: Role; organizationId: number; tokenVersion: number; sessionId: string; sessionStartedAt: number };
  }
  interface User {
    id: string;
    email: string;
    name: string;
    role: Role;
    organizationId: number;
    tokenVersion: number;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    userId?: number;
    role?: Role;
    organizationId?: number;
    tokenVersion?: number;
    /** One id per sign-in; sign-out lists it in revoked_sessions. */
    sessionId?: string;
    /** Sign-in time (Unix seconds): the session ends sessionMaxAgeSeconds later, however often the cookie is renewed. */
    sessionStartedAt?: number;
  }
}
