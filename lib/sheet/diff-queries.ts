/**
 * Questions asked of a finished diff, by the view as well as the release notes: apart from diff.ts
 * so a client component can ask them without loading the diff's machinery (jsdiff, lib/charts).
 */
import type { SheetDiff, SpecRowChange } from "./diff-types";

/** True when the two models differ in nothing the diff reports (a first release is never empty). */
export function diffIsEmpty(diff: SheetDiff): boolean {
  return (
    !diff.firstRelease &&
    diff.rows.length === 0 &&
    diff.basisChanges.length === 0 &&
    diff.prose.length === 0 &&
    diff.ratings.length === 0 &&
    diff.designIn.length === 0 &&
    diff.cautions.added.length === 0 &&
    diff.cautions.removed.length === 0 &&
    diff.measurementSets.added.length === 0 &&
    diff.measurementSets.removed.length === 0 &&
    diff.details.length === 0 &&
    diff.charts.every((chart) => chart.presence === "both" && chart.panels.every((panel) => !panel.changed))
  );
}

/**
 * A row whose only change is a typ that is the measured mean on both sides: it moved with the data,
 * nobody decided it. The release notes count such rows and the view folds them away.
 */
export function rowMovedWithDataOnly(row: SpecRowChange): boolean {
  return row.kind === "changed" && row.fields.every((f) => f.field === "typ" && f.measuredMean);
}
