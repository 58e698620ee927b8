import { AppError } from "../errors";
import { isCalendarDate } from "../schemas/calendar-date";
import type { UploadFields } from "../schemas/measurements";
import type { ParsedMeasurement } from "./types";
import { conditionFieldIds, conditionFieldPairs, conditionFields, type ConditionFieldId } from "../domain/measurement-conditions";
import {
  findNamedIntegrationBand,
  impedanceProblem,
  spurBandwidthKinds,
  spurBandwidthKindWords,
  spurBandwidthProblem,
  type StatedAnalysisSettings,
} from "../domain/analysis-settings";

/** The conditions a measurement set is filed under: the unit, and what it was measured at. */
export type MeasurementConditions = {
  serial: string;
  lot?: string;
  temperatureC?: number;
  inputFrequencyHz?: number;
  driveLevelDbm?: number;
  splitterExcessLossDb?: number;
  cableLossDb?: number;
  /** A mixer's: the file's `# lo_frequency:`, `# if_frequency:`, `# lo_power:` or what the upload stated. */
  rfFrequencyHz?: number;
  loFrequencyHz?: number;
  ifFrequencyHz?: number;
  loDriveDbm?: number;
  /** A hybrid's or splitter's band as the upload stated it. */
  bandStartHz?: number;
  bandStopHz?: number;
  notes?: string;
  /** The impedance the power readings are referred to, Ω, when the file or the upload stated one (lib/analysis/settings.ts decides which). */
  impedanceOhm?: number;
};

/** Conditions from the file's own metadata, filled in (never overridden) by what the engineer stated. */
export function mergeUploadConditions(parsed: ParsedMeasurement, fields: UploadFields, warnings: string[]): MeasurementConditions {
  const fromFile: Partial<MeasurementConditions> = {};
  if (parsed.kind !== "touchstone") {
    const d = parsed.data;
    if (d.serial) fromFile.serial = d.serial;
    if (d.lot) fromFile.lot = d.lot;
    if (d.temperatureC !== undefined) fromFile.temperatureC = d.temperatureC;
    if (parsed.kind === "drive-sweep") {
      fromFile.inputFrequencyHz = parsed.data.inputFrequencyHz;
      fromFile.splitterExcessLossDb = parsed.data.splitterExcessLossDb;
      fromFile.cableLossDb = parsed.data.cableLossDb;
    }
    if (parsed.kind === "frequency-sweep" || parsed.kind === "two-tone") {
      if (parsed.data.loPowerDbm !== undefined) fromFile.loDriveDbm = parsed.data.loPowerDbm;
      if (parsed.kind === "frequency-sweep") {
        if (parsed.data.loFrequencyHz !== undefined) fromFile.loFrequencyHz = parsed.data.loFrequencyHz;
        if (parsed.data.ifFrequencyHz !== undefined) fromFile.ifFrequencyHz = parsed.data.ifFrequencyHz;
      }
    }
  }
  const stated: Partial<MeasurementConditions> = {
    serial: fields.serial || undefined,
    lot: fields.lot || undefined,
    temperatureC: fields.temperatureC,
    inputFrequencyHz: fields.inputFrequencyHz,
    driveLevelDbm: fields.driveLevelDbm,
    splitterExcessLossDb: fields.splitterExcessLossDb,
    cableLossDb: fields.cableLossDb,
    rfFrequencyHz: fields.rfFrequencyHz,
    loFrequencyHz: fields.loFrequencyHz,
    ifFrequencyHz: fields.ifFrequencyHz,
    loDriveDbm: fields.loDriveDbm,
    bandStartHz: fields.bandStartHz,
    bandStopHz: fields.bandStopHz,
    notes: fields.notes || undefined,
  };
  const merged: Record<string, unknown> = {};
  for (const key of Object.keys(stated) as (keyof MeasurementConditions)[]) {
    const f = fromFile[key];
    const s = stated[key];
    if (f !== undefined && s !== undefined && String(f) !== String(s)) {
      warnings.push(`${key}: the file says ${f}, the form said ${s}; the file's value is kept`);
    }
    merged[key] = f ?? s;
  }
  for (const key of Object.keys(fromFile) as (keyof MeasurementConditions)[]) merged[key] ??= fromFile[key];
  if (!merged.serial) {
    throw new AppError("invalid", 'State the unit serial: the file has no "# serial:" line and the form gave none.', { field: "serial" });
  }
  return Object.fromEntries(Object.entries(merged).filter(([, v]) => v !== undefined)) as MeasurementConditions;
}

/**
 * The class's own conditions only: a condition field of another class (a splitter's excess loss on a
 * hybrid) is refused, naming the field and the conditions this class states; a band is stated whole,
 * its start below its stop. 422 through AppError("invalid") with `details.field`.
 */
export function checkClassConditions(opts: { classLabel: string; allowed: readonly ConditionFieldId[]; fields: Partial<Record<ConditionFieldId, number>> }): void {
  const { classLabel, allowed, fields } = opts;
  for (const id of conditionFieldIds) {
    if (fields[id] === undefined || allowed.includes(id)) continue;
    const asks = allowed.length ? allowed.map((a) => `${conditionFields[a].label.replace(/^(?!RF|LO|IF)./, (c) => c.toLowerCase())} (${a})`).join(", ") : "none beyond the unit and temperature";
    throw new AppError("invalid", `${conditionFields[id].label} (${id}) is not a condition of a ${classLabel.toLowerCase()}; this class states: ${asks}.`, { field: id });
  }
  for (const [startId, stopId] of conditionFieldPairs) {
    const start = fields[startId];
    const stop = fields[stopId];
    if ((start === undefined) !== (stop === undefined)) {
      const missing = start === undefined ? startId : stopId;
      throw new AppError("invalid", `State both ends: ${conditionFields[startId].label.toLowerCase()} and ${conditionFields[stopId].label.toLowerCase()}.`, { field: missing });
    }
    if (start !== undefined && stop !== undefined && !(stop > start)) {
      throw new AppError("invalid", `The ${conditionFields[stopId].label.toLowerCase()} must lie above the ${conditionFields[startId].label.toLowerCase()}.`, { field: stopId });
    }
  }
}

/**
 * A mixer's figures carry what they were measured at: the LO drive, LO and IF frequencies (and, for a
 * spot figure, the RF) the file or the upload stated, where the engine found none in the file itself,
 * so the sheet's rows state them (templates/double-balanced-mixer). Returns new parameters.
 */
export function stampStatedConditions<P extends { conditions: Record<string, string | number> }>(parameters: P[], conditions: MeasurementConditions): P[] {
  const stamps: [string, number | undefined][] = [
    ["loPowerDbm", conditions.loDriveDbm],
    ["loFrequencyHz", conditions.loFrequencyHz],
    ["ifFrequencyHz", conditions.ifFrequencyHz],
  ];
  if (stamps.every(([, v]) => v === undefined) && conditions.rfFrequencyHz === undefined) return parameters;
  return parameters.map((p) => {
    const added: Record<string, number> = {};
    for (const [key, value] of stamps) if (value !== undefined && p.conditions[key] === undefined) added[key] = value;
    // A band figure's RF is its band; a spot figure (IIP3, P1dB) takes the stated RF.
    if (conditions.rfFrequencyHz !== undefined && p.conditions.rfFrequencyHz === undefined && p.conditions.startHz === undefined) added.rfFrequencyHz = conditions.rfFrequencyHz;
    return Object.keys(added).length ? { ...p, conditions: { ...p.conditions, ...added } } : p;
  });
}

/** The measurement date an upload states, else the file's own `# date:` line (YYYY-MM-DD); null if neither. */
export function uploadMeasuredOn(parsed: ParsedMeasurement, fields: Pick<UploadFields, "measuredOn">): string | null {
  if (fields.measuredOn) return fields.measuredOn;
  const date = parsed.kind !== "touchstone" ? parsed.data.metadata?.date?.trim() : undefined;
  // The parser refused an impossible `# date:` already; this only keeps a non-date out of the database.
  return date && isCalendarDate(date) ? date : null;
}

/**
 * The measurement settings an upload states (form or bench API): a named band or both ends of one,
 * the compression reference drive, the impedance of power readings and the phase-noise trace's noise or
 * resolution bandwidth. Half a band, a stop not above its start, a name and ends that disagree, or both
 * bandwidths are refused (422 naming the field).
 */
export function uploadAnalysisSettings(
  fields: Pick<UploadFields, "integrationBand" | "integrationStartHz" | "integrationStopHz" | "compressionReferenceDbm" | "impedanceOhm" | "noiseBandwidthHz" | "resolutionBandwidthHz">,
): StatedAnalysisSettings {
  const out: StatedAnalysisSettings = {};
  const { integrationStartHz: startHz, integrationStopHz: stopHz } = fields;
  if ((startHz === undefined) !== (stopHz === undefined)) {
    const field = startHz === undefined ? "integrationStartHz" : "integrationStopHz";
    throw new AppError("invalid", "State both ends of the integration band (start and stop offset), or choose a named band.", { field });
  }
  if (startHz !== undefined && stopHz !== undefined) {
    if (!(stopHz > startHz)) throw new AppError("invalid", "The integration band's stop offset must lie above its start.", { field: "integrationStopHz" });
    out.integrationBandHz = { startHz, stopHz };
  }
  if (fields.integrationBand) {
    const named = findNamedIntegrationBand(fields.integrationBand)!;
    if (out.integrationBandHz && (out.integrationBandHz.startHz !== named.startHz || out.integrationBandHz.stopHz !== named.stopHz)) {
      throw new AppError("invalid", `The named band ${named.label} and the stated ends disagree; give one or the other.`, { field: "integrationBand" });
    }
    out.integrationBandHz = { startHz: named.startHz, stopHz: named.stopHz };
  }
  if (fields.compressionReferenceDbm !== undefined) out.compressionReferenceDbm = fields.compressionReferenceDbm;
  if (fields.impedanceOhm !== undefined) {
    const problem = impedanceProblem(fields.impedanceOhm);
    if (problem) throw new AppError("invalid", `The ${problem}.`, { field: "impedanceOhm" });
    out.impedanceOhm = fields.impedanceOhm;
  }
  if (fields.noiseBandwidthHz !== undefined && fields.resolutionBandwidthHz !== undefined) {
    throw new AppError("invalid", "State the noise bandwidth or the resolution bandwidth of the phase-noise trace, not both.", { field: "resolutionBandwidthHz" });
  }
  for (const kind of spurBandwidthKinds) {
    const hz = kind === "noise" ? fields.noiseBandwidthHz : fields.resolutionBandwidthHz;
    if (hz === undefined) continue;
    const problem = spurBandwidthProblem(hz);
    if (problem) throw new AppError("invalid", `The ${spurBandwidthKindWords[kind]}: ${problem}.`, { field: kind === "noise" ? "noiseBandwidthHz" : "resolutionBandwidthHz" });
    out.spurBandwidth = { kind, hz };
  }
  return out;
}
