import "server-only";
import type { MeasurementSet } from "@/models";
import type { MeasurementSetSummary } from "@/lib/domain/measurements";

export type { MeasurementSetSummary };

type Loaded = MeasurementSet & {
  Device?: { partNumber: string };
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
    partNumber: r.Device?.partNumber ?? "",
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
