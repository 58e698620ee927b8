import "server-only";
import { Op } from "sequelize";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetSummary } from "./measurement-set-summary";

/**
 * The reviewer's queue: submitted sets of the organization, oldest first. Four eyes: the
 * viewer's own uploads are left out in the query (a bench upload has no uploader and stays in);
 * reviewMeasurementSet refuses them again on the locked row.
 */
export async function listPendingMeasurementSets(viewer: SessionUser): Promise<MeasurementSetSummary[]> {
  const { organizationId, id: viewerId } = authorize(viewer, "measurement-review");
  const sets = await loadMeasurementSets({
    organizationId,
    state: "submitted",
    [Op.or]: [{ uploadedById: null }, { uploadedById: { [Op.ne]: viewerId } }],
  });
  return sets.reverse();
}
