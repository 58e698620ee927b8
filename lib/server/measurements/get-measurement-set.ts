import "server-only";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetDetail } from "@/lib/domain/measurements";
import { tabulateValues, type ValueTable } from "@/lib/analysis/tables";
import type { ParsedMeasurement } from "@/lib/ingest/types";
import type { MeasurementSet } from "@/models";

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
  const row = await MeasurementSet.unscoped().findOne({ where: { id: opts.setId, organizationId }, attributes: ["curves", "kind", "parsed", "conditions"] });
  return { ...summary, curves: row?.curves ?? [], tables: row ? tabulateStoredSet(row) : [] };
}

/**
 * Every value at each point (frequency or drive step) from the stored parse: S-parameter magnitude and
 * phase, mismatch loss, power as dBm, Vrms and dBµV (lib/analysis/tables.ts). Computed when asked, not stored.
 * Power readings are referred to the impedance the upload stored in the set's conditions (the file's
 * `# impedance:` line, else the upload's field), else 50 Ω; a Touchstone file's own reference impedance.
 */
export function tabulateStoredSet(row: Pick<MeasurementSet, "kind" | "parsed" | "conditions">): ValueTable[] {
  const parsed = { kind: row.kind, data: row.parsed, warnings: [] } as ParsedMeasurement;
  const stated = row.conditions?.impedanceOhm;
  if (parsed.kind === "touchstone" || stated === undefined) return tabulateValues(parsed);
  return tabulateValues(parsed, { impedanceOhm: stated, impedanceSource: parsed.data.impedanceOhm !== undefined ? "file" : "upload" });
}
