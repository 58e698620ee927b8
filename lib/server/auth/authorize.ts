import "server-only";
import { AppError } from "@/lib/errors";
import { allows, type Resource } from "@/lib/access/matrix";
import type { SessionUser } from "./session-user";

/**
 * The one permission check: may this person use the resource (lib/access/matrix.ts)? 401 when
 * signed out, 403 when the role may not. Route handlers, pages and every resource function in
 * lib/server ask through here, so a page and its API route cannot disagree.
 */
export function authorize(user: SessionUser | null, resource: Resource): SessionUser {
  if (!user) throw new AppError("unauthenticated", "Sign in to continue.");
  if (!allows(user.role, resource)) throw new AppError("forbidden", "Your role does not allow this.");
  return user;
}
