import { withdrawBodySchema } from "@/lib/schemas/reviews";
import { route } from "@/lib/server/auth/guard";
import { withdrawRevision } from "@/lib/server/reviews/withdraw-revision";
import { readIdParam } from "@/lib/server/route-params";

/** Withdraws a released revision with a reason; it stays downloadable with the notice. */
export const POST = route({ resource: "revision-withdrawal", body: withdrawBodySchema }, async ({ user, params, body }) => ({
  revision: await withdrawRevision({ actor: user, revisionId: readIdParam(params.id, "revision"), body }),
}));
