/**
 * Measurement kinds, the states of a measurement set and where a set came from: the lists the
 * parsers, the models, the upload schemas and the tables derive from, with their words and the
 * summary types the pages hand to components. Pure: server code and client components import it.
 */
import type { DerivedParameter } from "../analysis/types";
import type { ValueTable } from "../analysis/tables";
import type { MeasurementConditions } from "../ingest/upload-conditions";

/** Every bench-file kind the engine reads (fixtures/FORMATS.md). */
export const measurementKinds = ["drive-sweep", "frequency-sweep", "two-tone", "phase-noise", "touchstone"] as const;
export type MeasurementKind = (typeof measurementKinds)[number];

/** Kinds a foreign CSV can be mapped onto: every CSV kind (a Touchstone file has fixed columns). */
export type MappableKind = Exclude<MeasurementKind, "touchstone">;
export const mappableKinds = measurementKinds.filter((k): k is MappableKind => k !== "touchstone");

export const measurementKindLabels: Record<MeasurementKind, string> = {
  "drive-sweep": "Drive sweep",
  "frequency-sweep": "Frequency sweep",
  "two-tone": "Two-tone",
  "phase-noise": "Phase noise",
  touchstone: "S-parameters",
};

export function isMeasurementKind(value: unknown): value is MeasurementKind {
  return typeof value === "string" && (measurementKinds as readonly string[]).includes(value);
}

/** A stored kind in words; a name the code does not know is shown as stored. */
export function kindLabel(kind: string): string {
  return isMeasurementKind(kind) ? measurementKindLabels[kind] : kind;
}

/** A measurement set is reviewed once: approved or rejected. */
export const measurementSetStates = ["submitted", "approved", "rejected"] as const;
export type MeasurementSetState = (typeof measurementSetStates)[number];

export const measurementSetStateLabels: Record<MeasurementSetState, string> = {
  submitted: "Awaiting review",
  approved: "Approved",
  rejected: "Rejected",
};

/** Uploaded through the browser form or by a bench script with a token. */
export const measurementSources = ["browser", "bench-api"] as const;
export type MeasurementSource = (typeof measurementSources)[number];

export type { DerivedParameter, MeasurementConditions };

export type InstrumentUse = { id: number; kind: string; model: string; serial: string; calibrationDueOn: string; calibrationLapsed: boolean };

/** One measurement set as pages and the API show it. */
export type MeasurementSetSummary = {
  id: number;
  deviceId: number;
  partNumber: string;
  kind: string;
  state: MeasurementSetState;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  conditions: MeasurementConditions;
  measuredOn: string | null;
  parameters: DerivedParameter[];
  warnings: string[];
  source: MeasurementSource;
  uploadedBy: string | null;
  uploadedById: number | null;
  /** The bench token's name for a bench-API upload (who posted it), else null. */
  benchTokenName: string | null;
  reviewedBy: string | null;
  reviewedAt: string | null;
  rejectionReason: string | null;
  supersedesId: number | null;
  supersededById: number | null;
  instruments: InstrumentUse[];
  createdAt: string;
};

/** A set with its plot-ready curves (the set's own page). */
export type MeasurementSetDetail = MeasurementSetSummary & { curves: unknown; tables: ValueTable[] };
