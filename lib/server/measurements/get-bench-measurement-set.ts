import "server-only";
import { AppError } from "@/lib/errors";
import type { MeasurementSetResponse } from "@/lib/schemas/api-v1";
import { loadMeasurementSets } from "./load-measurement-sets";
import { loadSetTables } from "./load-set-tables";

/**
 * One measurement set of the token's organization, with its per-point tables: the same answer as the
 * bench upload's. Another organization's set is not found, exactly like an unknown id.
 */
export async function getBenchMeasurementSet(opts: { organizationId: number; setId: number }): Promise<MeasurementSetResponse> {
  const [measurementSet] = await loadMeasurementSets({ id: opts.setId, organizationId: opts.organizationId });
  if (!measurementSet) throw new AppError("not-found", "No such measurement set in this bench token's organization.");
  return { measurementSet, tables: await loadSetTables(opts) };
}
