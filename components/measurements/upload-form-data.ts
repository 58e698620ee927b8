import type { IngestDetail, MappingDetail } from "./upload-request";
import type { FrequencyUnit } from "@/components/devices/frequency-units";
import { toHz } from "@/components/devices/frequency-units";
import { parseDecimalText } from "@/lib/ingest/number";
import { formatNumber } from "@/lib/format";
import { impedanceProblem, spurBandwidthKindWords, spurBandwidthProblem, type SpurBandwidthKind } from "@/lib/domain/analysis-settings";
import { classConditionField, conditionFieldPairs, conditionFields, type ClassConditionWords, type ConditionField, type ConditionFieldId } from "@/lib/domain/measurement-conditions";

/** What the upload form holds for a batch: strings as typed, converted when the form is sent. */
export type SupersedableSet = { id: number; kind: string; fileName: string; serial?: string };

export type RowState =
  | { phase: "ready" }
  | { phase: "uploading"; loaded: number; total: number }
  | { phase: "processing" }
  | { phase: "done"; setId: number; warnings: number }
  | { phase: "failed"; status: number; message: string; ingest?: IngestDetail; existingSetId?: number }
  | { phase: "needs-mapping"; status: number; message: string; mapping: MappingDetail; mappingOpen: boolean };

export type Row = { key: string; file: File; state: RowState };

export type UploadConditions = {
  serial: string;
  lot: string;
  temperatureC: string;
  /** The device class's own condition fields (templates/<class>/conditions.ts), in the form's order. */
  classFields: readonly ConditionFieldId[];
  /** The class's own words for some of them ("Drive level, per port"): read through fieldOf. */
  classWords?: ClassConditionWords;
  /** Each condition as typed; a frequency in the unit beside it. */
  values: Partial<Record<ConditionFieldId, string>>;
  units: Partial<Record<ConditionFieldId, FrequencyUnit>>;
  measuredOn: string;
  notes: string;
  kind: string;
  instrumentIds: number[];
  supersedesId: string;
  /** "" (the class's default), a named band's id, or "custom" (the two ends below). */
  integrationBand: string;
  integrationStart: string;
  integrationStartUnit: FrequencyUnit;
  integrationStop: string;
  integrationStopUnit: FrequencyUnit;
  compressionReferenceDbm: string;
  impedanceOhm: string;
  /** The phase-noise trace's analyzer bandwidth, for spurs in dBc: as typed, in its unit, and which bandwidth it is. */
  spurBandwidth: string;
  spurBandwidthUnit: FrequencyUnit;
  spurBandwidthKind: SpurBandwidthKind;
};

export const initialConditions = (classFields: readonly ConditionFieldId[], classWords?: ClassConditionWords): UploadConditions => ({
  serial: "",
  lot: "",
  temperatureC: "",
  classFields,
  ...(classWords ? { classWords } : {}),
  values: {},
  units: {},
  measuredOn: "",
  notes: "",
  kind: "",
  instrumentIds: [],
  supersedesId: "",
  integrationBand: "",
  integrationStart: "",
  integrationStartUnit: "kHz",
  integrationStop: "",
  integrationStopUnit: "MHz",
  compressionReferenceDbm: "",
  impedanceOhm: "",
  spurBandwidth: "",
  spurBandwidthUnit: "Hz",
  spurBandwidthKind: "resolution",
});

/** A frequency field's unit until the engineer picks another. */
export function unitOf(c: UploadConditions, id: ConditionFieldId): FrequencyUnit {
  return c.units[id] ?? (id === "ifFrequencyHz" ? "MHz" : "GHz");
}

/** A class field's value as the API takes it (Hz for frequencies); undefined when blank. */
function classFieldValue(c: UploadConditions, id: ConditionFieldId): string | undefined {
  const typed = (c.values[id] ?? "").trim().replace("\u2212", "-");
  if (typed === "") return undefined;
  if (conditionFields[id].kind !== "frequency") return typed;
  const hz = toHz(typed, unitOf(c, id));
  return hz === undefined || Number.isNaN(hz) ? typed : String(hz);
}

/** The form fields the upload routes read (lib/schemas/measurements uploadFieldsSchema). */
export function buildForm(file: File, c: UploadConditions): FormData {
  const form = new FormData();
  form.append("file", file, file.name);
  const text: [string, string][] = [
    ["serial", c.serial],
    ["lot", c.lot],
    ["temperatureC", c.temperatureC],
    ["measuredOn", c.measuredOn],
    ["notes", c.notes],
    ["kind", c.kind],
    ["supersedesId", c.supersedesId],
    ["compressionReferenceDbm", c.compressionReferenceDbm],
    ["impedanceOhm", c.impedanceOhm],
  ];
  for (const [key, value] of text) if (value.trim() !== "") form.append(key, value.trim().replace("\u2212", "-"));
  for (const id of c.classFields) {
    const value = classFieldValue(c, id);
    if (value !== undefined) form.append(id, value);
  }
  if (c.instrumentIds.length) form.append("instrumentIds", c.instrumentIds.join(","));
  const bandwidthHz = toHz(c.spurBandwidth, c.spurBandwidthUnit);
  if (bandwidthHz !== undefined) form.append(c.spurBandwidthKind === "noise" ? "noiseBandwidthHz" : "resolutionBandwidthHz", String(bandwidthHz));
  if (c.integrationBand === "custom") {
    const startHz = toHz(c.integrationStart, c.integrationStartUnit);
    const stopHz = toHz(c.integrationStop, c.integrationStopUnit);
    if (startHz !== undefined) form.append("integrationStartHz", String(startHz));
    if (stopHz !== undefined) form.append("integrationStopHz", String(stopHz));
  } else if (c.integrationBand !== "") {
    form.append("integrationBand", c.integrationBand);
  }
  return form;
}

/** A condition field as the device's class words it (lib/domain/measurement-conditions.ts classConditionField). */
export function fieldOf(c: Pick<UploadConditions, "classWords">, id: ConditionFieldId): ConditionField {
  return classConditionField(c.classWords, id);
}

export function checkConditions(c: UploadConditions, fileCount: number): string | null {
  const numbers: [string, string][] = [
    ["Temperature", c.temperatureC],
    ...c.classFields.map((id): [string, string] => [fieldOf(c, id).label, c.values[id] ?? ""]),
    ["Compression reference drive", c.compressionReferenceDbm],
    ["Impedance", c.impedanceOhm],
  ];
  for (const [label, value] of numbers) {
    if (Number.isNaN(parseDecimalText(value))) return `${label} must be a decimal number.`;
  }
  const ohm = parseDecimalText(c.impedanceOhm);
  if (ohm !== undefined && impedanceProblem(ohm)) return `The ${impedanceProblem(ohm)}.`;
  for (const id of c.classFields) {
    const field = fieldOf(c, id);
    const typed = c.values[id] ?? "";
    if (field.kind === "frequency") {
      const hz = toHz(typed, unitOf(c, id));
      if (hz !== undefined && !(hz > 0)) return `${field.label} must be a number above 0.`;
    } else {
      const x = parseDecimalText(typed);
      if (x !== undefined && (x < field.min || x > field.max)) return `${field.label} must lie between ${formatNumber(field.min)} and ${formatNumber(field.max)} ${field.unit}.`;
    }
  }
  for (const [startId, stopId] of conditionFieldPairs) {
    if (!c.classFields.includes(startId)) continue;
    const start = toHz(c.values[startId] ?? "", unitOf(c, startId));
    const stop = toHz(c.values[stopId] ?? "", unitOf(c, stopId));
    if ((start === undefined) !== (stop === undefined)) return `State both ends: ${fieldOf(c, startId).label.toLowerCase()} and ${fieldOf(c, stopId).label.toLowerCase()}.`;
    if (start !== undefined && stop !== undefined && !(stop > start)) return `The ${fieldOf(c, stopId).label.toLowerCase()} must lie above the ${fieldOf(c, startId).label.toLowerCase()}.`;
  }
  if (c.integrationBand === "custom") {
    const startHz = toHz(c.integrationStart, c.integrationStartUnit);
    const stopHz = toHz(c.integrationStop, c.integrationStopUnit);
    if (startHz === undefined || stopHz === undefined) return "State both ends of the integration band, or choose a named band.";
    if (!(startHz > 0 && stopHz > startHz)) return "The integration band's stop offset must lie above its start, both above 0.";
  }
  const bandwidthHz = toHz(c.spurBandwidth, c.spurBandwidthUnit);
  if (bandwidthHz !== undefined && spurBandwidthProblem(bandwidthHz)) return `The ${spurBandwidthKindWords[c.spurBandwidthKind]}: ${spurBandwidthProblem(bandwidthHz)}.`;
  if (c.supersedesId && fileCount > 1) return "A correction replaces one set: choose one file when a set is superseded.";
  return null;
}
