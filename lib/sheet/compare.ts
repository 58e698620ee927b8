import type { ApprovedSetInput } from "./types";

/** Code-unit order, the same on every machine (no locale). */
export function compareStrings(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Sets by unit, kind, date, then id: the order every section lists them in. */
export function compareSets(a: ApprovedSetInput, b: ApprovedSetInput): number {
  return (
    compareStrings(a.serial, b.serial) ||
    compareStrings(a.kind, b.kind) ||
    compareStrings(a.measuredOn, b.measuredOn) ||
    compareStrings(String(a.id), String(b.id))
  );
}
