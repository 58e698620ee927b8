import "server-only";
import type { SheetModel } from "@/lib/sheet";

/** What differs between two sheet models, in short plain lines (for a stale candidate's reason). */
export function describeSheetChange(before: SheetModel, after: SheetModel): string[] {
  const lines: string[] = [];
  const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
  if (!same(before.specifications, after.specifications) || !same(before.statistics, after.statistics)) lines.push("the specifications or their statistics");
  if (!same(before.traceability.measurementSets, after.traceability.measurementSets)) lines.push("the measurement sets");
  if (!same(before.prose, after.prose)) lines.push("the prose");
  if (!same(before.absoluteMaximumRatings, after.absoluteMaximumRatings)) lines.push("the absolute maximum ratings");
  if (!same(before.header, after.header) || !same(before.keyFacts, after.keyFacts)) lines.push("the device's header or key facts");
  return lines.length ? lines : ["details of the sheet"];
}
