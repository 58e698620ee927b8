import "server-only";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetSummary } from "./measurement-set-summary";

/** The reviewer's queue: submitted sets of the organization, oldest decisions first in line. */
export async function listPendingMeasurementSets(organizationId: number): Promise<MeasurementSetSummary[]> {
  const sets = await loadMeasurementSets({ organizationId, state: "submitted" });
  return sets.reverse();
}
