import { submitCandidateBodySchema } from "@/lib/schemas/reviews";
import { route } from "@/lib/server/auth/guard";
import { submitSheet } from "@/lib/server/reviews/submit-sheet";
import { readIdParam } from "@/lib/server/route-params";

/** Submits the device's draft sheet for review: freezes it as a candidate (201). */
export const POST = route({ resource: "sheet-release", body: submitCandidateBodySchema }, async ({ user, params, body }) =>
  Response.json({ candidate: await submitSheet({ engineer: user, deviceId: readIdParam(params.id, "device"), body }) }, { status: 201 }),
);
