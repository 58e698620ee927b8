import { releaseBodySchema } from "@/lib/schemas/reviews";
import { route } from "@/lib/server/auth/guard";
import { releaseCandidate } from "@/lib/server/reviews/release-candidate";
import { readIdParam } from "@/lib/server/route-params";

/** Releases an approved candidate as the device's next revision (201); a second request gets 409. */
export const POST = route({ resource: "sheet-release", body: releaseBodySchema }, async ({ user, params, body }) =>
  Response.json({ revision: await releaseCandidate({ engineer: user, candidateId: readIdParam(params.id, "sheet candidate"), body }) }, { status: 201 }),
);
