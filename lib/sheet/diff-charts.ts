/**
 * The review's chart overlays: for each chart of either revision, both revisions' typical curves
 * on the same axes, drawn through the overlay of several sheets (curve-overlay.ts), the previous
 * revision first.
 */
import { diffChartAnchorId } from "./diff-anchors";
import type { ChartOverlay, ChartOverlayPanel } from "./diff-types";
import { overlayChartSources, type Point } from "./curve-overlay";
import type { ChartSpec, SheetModel } from "./types";

export { readChart, typicalCurve, type ChartReading } from "./curve-overlay";

export function overlayCharts(
  previous: SheetModel,
  next: SheetModel,
  labels: { previousLabel: string; nextLabel: string },
): ChartOverlay[] {
  const before = new Map(previous.charts.map((c) => [c.id, c]));
  const after = new Map(next.charts.map((c) => [c.id, c]));
  const ids = [...after.keys(), ...[...before.keys()].filter((id) => !after.has(id))];
  return ids.map((id) => overlayChart(before.get(id) ?? null, after.get(id) ?? null, labels));
}

function overlayChart(previous: ChartSpec | null, next: ChartSpec | null, labels: { previousLabel: string; nextLabel: string }): ChartOverlay {
  const chart = (next ?? previous)!;
  // The next revision's series come first, as its chart is the one under review.
  const sources = [
    { label: labels.previousLabel, chart: previous },
    { label: labels.nextLabel, chart: next },
  ];
  const panels: ChartOverlayPanel[] = overlayChartSources(chart, sources, { lead: 1 }).map((panel) => {
    const [old, now] = panel.traces;
    return {
      id: panel.id,
      anchorId: diffChartAnchorId(panel.id),
      series: panel.series,
      title: panel.title,
      description: panel.description,
      previousUnitCount: old.unitCount,
      nextUnitCount: now.unitCount,
      changed: JSON.stringify(plotted(old.typical)) !== JSON.stringify(plotted(now.typical)),
      vegaLite: panel.vegaLite,
    };
  });
  return { chartId: chart.id, title: chart.title, presence: previous && next ? "both" : previous ? "previous-only" : "next-only", panels };
}

/** Six significant figures, as lib/charts plots them: finer differences do not show. */
function plotted(points: Point[]): Point[] {
  return points.map(([x, y]) => [Number(x.toPrecision(6)), Number(y.toPrecision(6))]);
}
