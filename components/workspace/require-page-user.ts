import "server-only";
import { redirect } from "next/navigation";
import { getSessionUser, type SessionUser } from "@/lib/server/auth/session";
import { can, type Permission } from "@/lib/server/auth/permissions";

export type PageAccess = { allowed: true; user: SessionUser } | { allowed: false; user: SessionUser };

/**
 * Every workspace page asks for itself (a layout is not re-run on client navigation):
 * signed out → the sign-in page, coming back here afterwards; wrong role → a refusal the page renders.
 */
export async function requirePageUser(options: { permission: Permission; path: string }): Promise<PageAccess> {
  const user = await getSessionUser();
  if (!user) redirect(`/sign-in?next=${encodeURIComponent(options.path)}`);
  return can(user.role, options.permission) ? { allowed: true, user } : { allowed: false, user };
}
