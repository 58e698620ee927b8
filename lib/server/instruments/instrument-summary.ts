import "server-only";
import type { Instrument } from "@/models";
import type { InstrumentUncertainty } from "@/models/instrument";

export type InstrumentSummary = {
  id: number;
  kind: string;
  model: string;
  serial: string;
  calibratedOn: string;
  calibrationDueOn: string;
  /** Due date already passed today. */
  calibrationOverdue: boolean;
  uncertainty: InstrumentUncertainty[];
};

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
