import { compareStrings } from "./compare";
import { formatNumber, formatQuantity } from "../format/quantity";
import { formatTemperature } from "./format";
import type { ApprovedSetInput, SheetModel } from "./types";

/** The sets and instruments behind the sheet, with a calibration lapse raised as an issue. */
export function buildTraceability(sets: ApprovedSetInput[], issues: SheetModel["issues"]): SheetModel["traceability"] {
  const instruments = new Map<string, SheetModel["traceability"]["instruments"][number]>();
  for (const set of sets) {
    for (const instrument of set.instruments) {
      const key = [instrument.kind, instrument.model, instrument.serial, instrument.calibratedOn].join("|");
      const lapsed = set.measuredOn > instrument.calibrationDueOn || set.measuredOn < instrument.calibratedOn;
      if (lapsed) {
        issues.push({
          code: "calibration-lapsed",
          message: `Set ${String(set.id)} (${set.serial}) was measured on ${set.measuredOn}, outside the calibration interval of ${instrument.model} ${instrument.serial} (${instrument.calibratedOn} to ${instrument.calibrationDueOn}).`,
        });
      }
      const existing = instruments.get(key);
      if (existing) {
        existing.setCount++;
        existing.calibrationLapsed ||= lapsed;
        continue;
      }
      instruments.set(key, {
        kind: instrument.kind,
        model: instrument.model,
        serial: instrument.serial,
        calibratedOn: instrument.calibratedOn,
        calibrationDueOn: instrument.calibrationDueOn,
        uncertainty: [...instrument.uncertainty]
          .sort((a, b) => compareStrings(a.quantity, b.quantity))
          .map((u) => `${u.quantity}: ±${formatQuantity(u.value, u.unit, { digits: { maxDecimals: 4 } })} (k = ${formatNumber(u.coverageFactor, { digits: { maxDecimals: 2 } })})`),
        setCount: 1,
        calibrationLapsed: lapsed,
      });
    }
  }
  return {
    measurementSets: sets.map((set) => ({
      id: String(set.id),
      kind: set.kind,
      serial: set.serial,
      lot: set.lot ?? null,
      temperature: set.temperatureC === undefined ? "" : formatTemperature(set.temperatureC),
      measuredOn: set.measuredOn,
    })),
    instruments: [...instruments.values()].sort(
      (a, b) => compareStrings(a.kind, b.kind) || compareStrings(a.model, b.model) || compareStrings(a.serial, b.serial) || compareStrings(a.calibratedOn, b.calibratedOn),
    ),
    statements: [
      "Results refer only to the units listed, measured on the dates shown with the instruments listed (ISO/IEC 17025:2017 §7.8.2.1).",
      "Calibration dates and stated uncertainties are those on record for each instrument when the sheet was built.",
      "Only measurement sets approved by a second engineer contribute to the statistics.",
    ],
  };
}
