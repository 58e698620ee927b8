/**
 * The compare page's curves: for each chart that two or more of the compared sheets carry (the same
 * template chart), the typical curve of every sheet on the same axes, one panel per series, through
 * the review's overlay (lib/sheet/curve-overlay.ts) and so through the one spec builder. Each sheet
 * keeps its colour, dash and point shape on every panel (its place in the selection). Where the
 * sheets drew their curves under different conditions, the chart says so with each sheet's own.
 */
import { overlayChartSources, type OverlayPanel } from "../sheet/curve-overlay";
import type { ChartSpec, SheetModel } from "../sheet/types";

export interface CompareChartSource {
  label: string;
  /** "1 GHz in, 25 °C": where the sheet drew this chart (from its caption), or null when it has no such chart. */
  drawnAt: string | null;
}

export interface CompareChart {
  chartId: string;
  title: string;
  /** One per compared sheet, in the selection's order. */
  sources: CompareChartSource[];
  /** True when the sheets that have the chart drew it under different conditions. */
  conditionsDiffer: boolean;
  /** Panels with the typical curves of two or more sheets. */
  panels: (OverlayPanel & { coincide: boolean })[];
  /** Series only one sheet has on this chart (a port or path the others lack), with that sheet: named, not drawn. */
  unmatched: { series: string; label: string }[];
}

export interface CompareCharts {
  charts: CompareChart[];
  /** Charts only one sheet carries: named, not drawn (there is nothing to compare them with). */
  single: { label: string; titles: string[] }[];
}

export function buildCompareCharts(inputs: readonly { label: string; model: Pick<SheetModel, "charts"> }[], look: { width: number | "container"; height?: number }): CompareCharts {
  const ids: string[] = [];
  for (const { model } of inputs) for (const chart of model.charts) if (!ids.includes(chart.id)) ids.push(chart.id);
  const charts: CompareChart[] = [];
  const single = new Map<string, string[]>();
  for (const id of ids) {
    const found = inputs.map(({ model }) => model.charts.find((c) => c.id === id) ?? null);
    const present = found.filter((c): c is ChartSpec => c !== null);
    if (present.length < 2) {
      const at = found.findIndex((c) => c !== null);
      single.set(inputs[at].label, [...(single.get(inputs[at].label) ?? []), present[0].title]);
      continue;
    }
    const sources = inputs.map(({ label }, i) => ({ label, drawnAt: found[i] ? drawnAt(found[i]!) : null }));
    const stated = sources.filter((s) => s.drawnAt !== null).map((s) => s.drawnAt);
    const overlaid = overlayChartSources(present[0], inputs.map(({ label }, i) => ({ label, chart: found[i] })), look);
    // A panel of one sheet's curve compares nothing, and would draw that sheet in another sheet's style (lib/charts draws a lone series in ink).
    const drawn = (panel: OverlayPanel) => panel.traces.filter((t) => t.typical.length > 0);
    const panels = overlaid.filter((p) => drawn(p).length >= 2).map((p) => ({ ...p, coincide: coincide(drawn(p).map((t) => t.typical)) }));
    const unmatched = overlaid.filter((p) => drawn(p).length === 1).map((p) => ({ series: p.series ?? p.title, label: drawn(p)[0].label }));
    if (!panels.length) continue;
    charts.push({ chartId: id, title: present[0].title, sources, conditionsDiffer: new Set(stated).size > 1, panels, unmatched });
  }
  return { charts, single: [...single.entries()].map(([label, titles]) => ({ label, titles })) };
}

/**
 * Where a chart was drawn, as its caption states it (lib/sheet/charts.ts writes "… 4 units drawn at
 * 1 GHz in, 25 °C." with an optional "(first 12 of 14 by serial)"); the caption itself when it
 * does not say.
 */
export function drawnAt(chart: Pick<ChartSpec, "caption">): string {
  const match = / drawn at (.+?)(?: \(first \d+ of \d+ by serial\))?\.(?:\s|$)/.exec(chart.caption);
  return match ? match[1] : chart.caption;
}

/** True when every typical curve is the same as the first to the plotted precision (six figures, as lib/charts plots): one line hides the others. */
function coincide(curves: [number, number][][]): boolean {
  const plotted = (curve: [number, number][]) => JSON.stringify(curve.map(([x, y]) => [Number(x.toPrecision(6)), Number(y.toPrecision(6))]));
  return curves.every((c) => plotted(c) === plotted(curves[0]));
}
