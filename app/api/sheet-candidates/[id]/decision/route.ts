import { candidateDecisionBodySchema } from "@/lib/schemas/reviews";
import { route } from "@/lib/server/auth/guard";
import { clientAddress } from "@/lib/server/auth/rate-limit";
import { decideCandidate } from "@/lib/server/reviews/decide-candidate";
import { readIdParam } from "@/lib/server/route-params";

/** Changes requested (with a reason), or approval signed with the reviewer's password and a stated meaning. */
export const POST = route({ resource: "sheet-review", body: candidateDecisionBodySchema }, async ({ user, params, body, request }) => ({
  candidate: await decideCandidate({
    reviewer: user,
    candidateId: readIdParam(params.id, "sheet candidate"),
    body,
    clientAddress: clientAddress(request.headers),
  }),
}));
