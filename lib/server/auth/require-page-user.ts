import "server-only";
import { forbidden, redirect } from "next/navigation";
import { getSessionUser, type SessionUser } from "./session";
import { canAny, type Permission } from "@/lib/domain/permissions";

/**
 * Every workspace page asks for itself (a layout is not re-run on client navigation):
 * signed out → the sign-in page, coming back here afterwards; signed in with a role that
 * holds none of the permissions → HTTP 403 and app/forbidden.tsx.
 */
export async function requirePageUser(options: { permission: Permission | readonly Permission[]; path: string }): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) redirect(`/sign-in?next=${encodeURIComponent(options.path)}`);
  if (!canAny(user.role, options.permission)) forbidden();
  return user;
}
