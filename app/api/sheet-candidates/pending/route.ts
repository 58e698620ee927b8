import { route } from "@/lib/server/auth/guard";
import { listPendingCandidates } from "@/lib/server/reviews/list-pending-candidates";

/** The sheet review queue: candidates in review the viewer did not submit and has not signed. */
export const GET = route({ resource: "sheet-review" }, async ({ user }) => ({ candidates: await listPendingCandidates(user) }));
