import type { IngestDetail, MappingDetail } from "./upload-request";
import type { FrequencyUnit } from "@/components/devices/frequency-units";
import { toHz } from "@/components/devices/frequency-units";
import { parseDecimalText } from "@/lib/ingest/number";
import { impedanceProblem } from "@/lib/domain/analysis-settings";

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
  inputFrequency: string;
  inputFrequencyUnit: FrequencyUnit;
  driveLevelDbm: string;
  splitterExcessLossDb: string;
  cableLossDb: string;
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
};

export const initialConditions: UploadConditions = {
  serial: "",
  lot: "",
  temperatureC: "",
  inputFrequency: "",
  inputFrequencyUnit: "GHz",
  driveLevelDbm: "",
  splitterExcessLossDb: "",
  cableLossDb: "",
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
};

/** The form fields the upload routes read (lib/schemas/measurements uploadFieldsSchema). */
export function buildForm(file: File, c: UploadConditions): FormData {
  const form = new FormData();
  form.append("file", file, file.name);
  const text: [string, string][] = [
    ["serial", c.serial],
    ["lot", c.lot],
    ["temperatureC", c.temperatureC],
    ["driveLevelDbm", c.driveLevelDbm],
    ["splitterExcessLossDb", c.splitterExcessLossDb],
    ["cableLossDb", c.cableLossDb],
    ["measuredOn", c.measuredOn],
    ["notes", c.notes],
    ["kind", c.kind],
    ["supersedesId", c.supersedesId],
    ["compressionReferenceDbm", c.compressionReferenceDbm],
    ["impedanceOhm", c.impedanceOhm],
  ];
  for (const [key, value] of text) if (value.trim() !== "") form.append(key, value.trim().replace("\u2212", "-"));
  const hz = toHz(c.inputFrequency, c.inputFrequencyUnit);
  if (hz !== undefined) form.append("inputFrequencyHz", String(hz));
  if (c.instrumentIds.length) form.append("instrumentIds", c.instrumentIds.join(","));
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

export function checkConditions(c: UploadConditions, fileCount: number): string | null {
  const numbers: [string, string][] = [
    ["Temperature", c.temperatureC],
    ["Drive level", c.driveLevelDbm],
    ["Splitter excess loss", c.splitterExcessLossDb],
    ["Cable loss", c.cableLossDb],
    ["Compression reference drive", c.compressionReferenceDbm],
    ["Impedance", c.impedanceOhm],
  ];
  for (const [label, value] of numbers) {
    if (Number.isNaN(parseDecimalText(value))) return `${label} must be a decimal number.`;
  }
  const ohm = parseDecimalText(c.impedanceOhm);
  if (ohm !== undefined && impedanceProblem(ohm)) return `The ${impedanceProblem(ohm)}.`;
  const hz = toHz(c.inputFrequency, c.inputFrequencyUnit);
  if (hz !== undefined && !(hz > 0)) return "Input frequency must be a number above 0.";
  if (c.integrationBand === "custom") {
    const startHz = toHz(c.integrationStart, c.integrationStartUnit);
    const stopHz = toHz(c.integrationStop, c.integrationStopUnit);
    if (startHz === undefined || stopHz === undefined) return "State both ends of the integration band, or choose a named band.";
    if (!(startHz > 0 && stopHz > startHz)) return "The integration band's stop offset must lie above its start, both above 0.";
  }
  if (c.supersedesId && fileCount > 1) return "A correction replaces one set: choose one file when a set is superseded.";
  return null;
}
