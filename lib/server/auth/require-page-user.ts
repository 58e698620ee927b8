import "server-only";
import { forbidden, notFound, redirect } from "next/navigation";
import { isAppError } from "@/lib/errors";
import type { Resource } from "@/lib/access/matrix";
import { allows } from "@/lib/access/matrix";
import { getSessionUser, type SessionUser } from "./session";

/**
 * Every workspace page asks for itself (a layout is not re-run on client navigation), by the
 * resource its row in lib/access/matrix.ts names: signed out → the sign-in page, coming back
 * here afterwards; signed in with a role the resource does not admit → HTTP 403 and
 * app/forbidden.tsx.
 */
export async function requirePageUser(options: { resource: Resource; path: string }): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) redirect(`/sign-in?next=${encodeURIComponent(options.path)}`);
  if (!allows(user.role, options.resource)) forbidden();
  return user;
}

/**
 * A page's data through its resource function: the AppErrors that function throws become the
 * page's status (not-found → 404, forbidden → 403); anything else is the error page's.
 */
export async function loadForPage<T>(load: () => Promise<T>): Promise<T> {
  try {
    return await load();
  } catch (error) {
    if (isAppError(error) && error.code === "not-found") notFound();
    if (isAppError(error) && error.code === "forbidden") forbidden();
    throw error;
  }
}
