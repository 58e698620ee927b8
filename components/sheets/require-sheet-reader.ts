import "server-only";
import { can } from "@/lib/server/auth/permissions";
import type { SessionUser } from "@/lib/server/auth/session";
import { requirePageUser } from "@/components/workspace/require-page-user";

export type SheetPageAccess = { allowed: true; user: SessionUser; canEdit: boolean } | { allowed: false; user: SessionUser };

/**
 * Sheet drafts are written by engineers and read by reviewers; other roles are refused.
 * (Signed out → the sign-in page, back here afterwards.)
 */
export async function requireSheetReader(path: string): Promise<SheetPageAccess> {
  const access = await requirePageUser({ permission: "device:read", path });
  const { user } = access;
  const canEdit = can(user.role, "sheet:write");
  if (!access.allowed || !(canEdit || can(user.role, "sheet:review"))) return { allowed: false, user };
  return { allowed: true, user, canEdit };
}
