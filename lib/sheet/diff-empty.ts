import type { SheetDiff } from "./diff-types";

/**
 * True when the two models differ in nothing the diff reports (a first release is never empty).
 * Apart from diff.ts so a view can ask without loading the diff's machinery.
 */
export function diffIsEmpty(diff: SheetDiff): boolean {
  return (
    !diff.firstRelease &&
    diff.rows.length === 0 &&
    diff.basisChanges.length === 0 &&
    diff.prose.length === 0 &&
    diff.ratings.length === 0 &&
    diff.cautions.added.length === 0 &&
    diff.cautions.removed.length === 0 &&
    diff.measurementSets.added.length === 0 &&
    diff.measurementSets.removed.length === 0 &&
    diff.details.length === 0 &&
    diff.charts.every((chart) => chart.presence === "both" && chart.panels.every((panel) => !panel.changed))
  );
}
