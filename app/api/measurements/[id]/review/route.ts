import { reviewMeasurementBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { reviewMeasurementSet } from "@/lib/server/measurements/review-measurement-set";
import { readIdParam } from "@/lib/server/route-params";

export const POST = route({ resource: "measurement-review", body: reviewMeasurementBodySchema }, async ({ user, params, body }) => ({
  measurementSet: await reviewMeasurementSet({ reviewer: user, setId: readIdParam(params.id, "measurement set"), body }),
}));
