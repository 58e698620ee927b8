import { route } from "@/lib/server/auth/guard";
import { getCandidate } from "@/lib/server/reviews/get-candidate";
import { readIdParam } from "@/lib/server/route-params";

/** A candidate as reviewed: its frozen model, the last release's model, signatures and comments. */
export const GET = route({ resource: "sheet-comments" }, async ({ user, params }) => ({
  candidate: await getCandidate({ viewer: user, candidateId: readIdParam(params.id, "sheet candidate") }),
}));
