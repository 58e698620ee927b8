import "server-only";
import { AppError } from "@/lib/errors";
import { MeasurementSet, getSequelize } from "@/models";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetDetail } from "@/lib/domain/measurements";

/** One set of the caller's organization with its plot-ready curves; another organization's is not found. */
export async function getMeasurementSet(opts: { organizationId: number; setId: number }): Promise<MeasurementSetDetail> {
  getSequelize();
  const [summary] = await loadMeasurementSets({ id: opts.setId, organizationId: opts.organizationId });
  if (!summary) throw new AppError("not-found", "No such measurement set in your organization.");
  const row = await MeasurementSet.unscoped().findOne({ where: { id: opts.setId, organizationId: opts.organizationId }, attributes: ["curves"] });
  return { ...summary, curves: row?.curves ?? [] };
}
