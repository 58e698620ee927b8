import type { Role } from "@/lib/domain/permissions";

declare module "next-auth" {
  interface Session {
    user: { id: number; email: string; name: string; role: Role; organizationId: number; tokenVersion: number };
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
  }
}
