import { AppError } from "@/lib/errors";
import { tokenRoute } from "@/lib/server/auth/guard";
import { authenticateBenchToken } from "@/lib/server/bench-tokens/authenticate-bench-token";
import { getBenchMeasurementSet } from "@/lib/server/measurements/get-bench-measurement-set";
import { parseRecordId } from "@/lib/schemas/decimal";
import type { MeasurementSetResponse } from "@/lib/schemas/api-v1";

/**
 * A bench reads back one measurement set of its organization (`Authorization: Bearer <bench token>`):
 * `{ measurementSet, tables }`, the upload's own answer, in whatever state the set is now.
 */
export const GET = tokenRoute(async (request, context) => {
  const { organizationId } = await authenticateBenchToken(request);
  const raw = (await context?.params)?.id;
  const setId = parseRecordId(typeof raw === "string" ? raw : undefined);
  if (setId === undefined) throw new AppError("not-found", "No such measurement set in this bench token's organization.");
  return Response.json((await getBenchMeasurementSet({ organizationId, setId })) satisfies MeasurementSetResponse);
});
