import "server-only";
import type { MeasurementSet } from "@/models";
import type { DerivedParameter, MeasurementConditions, MeasurementSetState } from "@/models/measurement-set";

export type InstrumentUse = { id: number; kind: string; model: string; serial: string; calibrationDueOn: string; calibrationLapsed: boolean };

export type MeasurementSetSummary = {
  id: number;
  deviceId: number;
  kind: string;
  state: MeasurementSetState;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  conditions: MeasurementConditions;
  measuredOn: string | null;
  parameters: DerivedParameter[];
  warnings: string[];
  source: "browser" | "bench-api";
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

type Loaded = MeasurementSet & {
  StoredFile?: { originalName: string; sizeBytes: number };
  uploadedBy?: { name: string } | null;
  benchToken?: { name: string } | null;
  reviewedBy?: { name: string } | null;
  Instruments?: { id: number; kind: string; model: string; serial: string; calibrationDueOn: string; MeasurementSetInstrument?: { calibrationLapsed: boolean } }[];
};

export function toMeasurementSetSummary(row: MeasurementSet): MeasurementSetSummary {
  const r = row as Loaded;
  return {
    id: r.id,
    deviceId: r.deviceId,
    kind: r.kind,
    state: r.state,
    fileName: r.StoredFile?.originalName ?? "",
    sizeBytes: r.StoredFile?.sizeBytes ?? 0,
    sha256: r.sha256,
    conditions: r.conditions,
    measuredOn: r.measuredOn,
    parameters: r.parameters,
    warnings: r.warnings,
    source: r.source,
    uploadedBy: r.uploadedBy?.name ?? null,
    uploadedById: r.uploadedById,
    benchTokenName: r.benchToken?.name ?? null,
    reviewedBy: r.reviewedBy?.name ?? null,
    reviewedAt: r.reviewedAt ? r.reviewedAt.toISOString() : null,
    rejectionReason: r.rejectionReason ?? null,
    supersedesId: r.supersedesId,
    supersededById: r.supersededById ?? null,
    instruments: (r.Instruments ?? []).map((i) => ({
      id: i.id,
      kind: i.kind,
      model: i.model,
      serial: i.serial,
      calibrationDueOn: i.calibrationDueOn,
      calibrationLapsed: Boolean(i.MeasurementSetInstrument?.calibrationLapsed),
    })),
    createdAt: r.createdAt.toISOString(),
  };
}
