import "server-only";
import type { Instrument } from "@/models";
import type { InstrumentSummary } from "@/lib/domain/instruments";

export type { InstrumentSummary };

export function toInstrumentSummary(i: Instrument, today = new Date().toISOString().slice(0, 10)): InstrumentSummary {
  return {
    id: i.id,
    kind: i.kind,
    model: i.model,
    serial: i.serial,
    calibratedOn: i.calibratedOn,
    calibrationDueOn: i.calibrationDueOn,
    calibrationOverdue: today > i.calibrationDueOn,
    uncertainty: i.uncertainty,
  };
}
