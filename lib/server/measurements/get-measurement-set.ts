import "server-only";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetDetail } from "@/lib/domain/measurements";

/**
 * One set of the viewer's organization with its plot-ready curves; another organization's is not
 * found, and so is a set asked for under another device than its own (`deviceId`, as the page's
 * address names it).
 */
export async function getMeasurementSet(opts: { viewer: SessionUser; setId: number; deviceId?: number }): Promise<MeasurementSetDetail> {
  const { MeasurementSet } = db();
  const { organizationId } = authorize(opts.viewer, "devices");
  const [summary] = await loadMeasurementSets({ id: opts.setId, organizationId, ...(opts.deviceId === undefined ? {} : { deviceId: opts.deviceId }) });
  if (!summary) throw new AppError("not-found", "No such measurement set in your organization.");
  const row = await MeasurementSet.unscoped().findOne({ where: { id: opts.setId, organizationId }, attributes: ["curves"] });
  return { ...summary, curves: row?.curves ?? [] };
}
