/**
 * The review's chart overlays: for each chart of either revision, both revisions' typical curves
 * on the same axes, drawn by the one spec builder (lib/charts). A revision's frozen model keeps its
 * charts only as Vega-Lite specs with their data inlined, so the curves are read back from there.
 */
import { buildVegaLiteSpec, type ChartAxis } from "../charts/build-vega-lite-spec";
import { splitPrefixedUnit } from "../format/quantity";
import { computeMedian } from "../stats/descriptive";
import { diffChartAnchorId } from "./diff-anchors";
import type { ChartOverlay, ChartOverlayPanel } from "./diff-types";
import type { ChartSpec, SheetModel } from "./types";

const OVERLAY_HEIGHT = 260;
/** Enough to follow a curve's shape, few enough that each point's shape stays legible. */
const OVERLAY_MAX_POINTS = 100;

type Point = [number, number];

/** One revision's chart read back: its axes (in the data's own units) and each series' points per unit. */
export interface ChartReading {
  x: ChartAxis;
  y: ChartAxis;
  /** Series label → unit serial → points, x in the axis' unit. */
  series: Map<string, Map<string, Point[]>>;
}

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
  const oldReading = previous ? readChart(previous) : null;
  const newReading = next ? readChart(next) : null;
  const seriesLabels = [...(newReading?.series.keys() ?? []), ...[...(oldReading?.series.keys() ?? [])].filter((s) => !newReading?.series.has(s))];
  const split = seriesLabels.length > 1;
  const panels: ChartOverlayPanel[] = [];
  for (const series of seriesLabels) {
    const oldUnits = oldReading?.series.get(series);
    const newUnits = newReading?.series.get(series);
    const oldTypical = oldUnits ? typicalCurve([...oldUnits.values()], oldReading!.x.scale === "log") : [];
    const newTypical = newUnits ? typicalCurve([...newUnits.values()], newReading!.x.scale === "log") : [];
    const axes = (newReading ?? oldReading)!;
    const title = split ? `${chart.title}: ${series}` : chart.title;
    const built = buildVegaLiteSpec(
      {
        title,
        x: axes.x,
        y: axes.y,
        seriesNames: [labels.previousLabel, labels.nextLabel],
        traces: [
          { series: labels.previousLabel, points: oldTypical },
          { series: labels.nextLabel, points: newTypical },
        ],
      },
      { medium: "screen", width: "container", height: OVERLAY_HEIGHT, points: "auto", maxPointsPerTrace: OVERLAY_MAX_POINTS },
    );
    if (!built) continue;
    const previousUnitCount = oldUnits?.size ?? 0;
    const nextUnitCount = newUnits?.size ?? 0;
    const drawn = [
      previousUnitCount > 0 ? `${labels.previousLabel} (${unitWords(previousUnitCount)})` : "",
      nextUnitCount > 0 ? `${labels.nextLabel} (${unitWords(nextUnitCount)})` : "",
    ].filter(Boolean);
    const id = split ? `${chart.id}--${series}` : chart.id;
    panels.push({
      id,
      anchorId: diffChartAnchorId(id),
      series: split ? series : null,
      title,
      description: `${title}: the typical curve (the median of the units at each point) of ${drawn.join(" and ")}; ${built.yTitle} against ${built.xTitle}.`,
      previousUnitCount,
      nextUnitCount,
      changed: JSON.stringify(plotted(oldTypical)) !== JSON.stringify(plotted(newTypical)),
      vegaLite: built.vegaLite,
    });
  }
  return { chartId: chart.id, title: chart.title, presence: previous && next ? "both" : previous ? "previous-only" : "next-only", panels };
}

function unitWords(n: number): string {
  return `${n} ${n === 1 ? "unit" : "units"}`;
}

/** Six significant figures, as lib/charts plots them: finer differences do not show. */
function plotted(points: Point[]): Point[] {
  return points.map(([x, y]) => [Number(x.toPrecision(6)), Number(y.toPrecision(6))]);
}

/**
 * A chart's curves read back from its spec: `data.values` rows of { x, y, series, unit } and the
 * first layer's axis titles "Label (unit)". The x values were scaled to the axis' prefix ("GHz"),
 * so they are scaled back to the base unit for lib/charts to choose the prefix again.
 */
export function readChart(chart: Pick<ChartSpec, "vegaLite">): ChartReading | null {
  const spec = chart.vegaLite as {
    data?: { values?: unknown };
    layer?: { encoding?: { x?: { title?: unknown; scale?: { type?: unknown } }; y?: { title?: unknown; scale?: { type?: unknown } } } }[];
  };
  const values = spec.data?.values;
  const encoding = spec.layer?.[0]?.encoding;
  if (!Array.isArray(values) || !encoding?.x || !encoding.y) return null;
  const xAxis = parseAxisTitle(encoding.x.title, encoding.x.scale?.type === "log");
  const yAxis = parseAxisTitle(encoding.y.title, encoding.y.scale?.type === "log");
  const prefixed = xAxis.scale === "log" ? null : splitPrefixedUnit(xAxis.unit);
  const xFactor = prefixed?.factor ?? 1;
  const x: ChartAxis = { ...xAxis, unit: prefixed?.base ?? xAxis.unit };

  const series = new Map<string, Map<string, Point[]>>();
  for (const row of values as Record<string, unknown>[]) {
    const { x: px, y: py } = row;
    if (typeof px !== "number" || typeof py !== "number" || !Number.isFinite(px) || !Number.isFinite(py)) continue;
    const name = typeof row.series === "string" ? row.series : "";
    const unit = typeof row.unit === "string" ? row.unit : "";
    let units = series.get(name);
    if (!units) series.set(name, (units = new Map()));
    let points = units.get(unit);
    if (!points) units.set(unit, (points = []));
    points.push([px * xFactor, py]);
  }
  return { x, y: yAxis, series };
}

/** "Input frequency (GHz)" → label and unit; a title without a unit in brackets has none ("VSWR"). */
function parseAxisTitle(title: unknown, log: boolean): ChartAxis {
  const text = typeof title === "string" ? title : "";
  const match = /^(.*) \(([^()]*)\)$/.exec(text);
  const scale = log ? "log" : "linear";
  return match ? { label: match[1], unit: match[2], scale } : { label: text, unit: "", scale };
}

/**
 * The typical curve of several units: at every x any unit was measured at, the median of the units
 * whose sweep covers that x, each read off its own curve by linear interpolation between its two
 * nearest points (in log10 x on a log axis). Units measured on one grid need no interpolation.
 */
export function typicalCurve(units: Point[][], logX: boolean): Point[] {
  const toAxis = (x: number) => (logX ? Math.log10(x) : x);
  const curves = units
    .map((points) => mergeRepeatedX(points.filter(([x]) => !logX || x > 0)))
    .filter((points) => points.length > 0);
  const xs = [...new Set(curves.flatMap((points) => points.map(([x]) => x)))].sort((a, b) => a - b);
  const out: Point[] = [];
  for (const x of xs) {
    const readings: number[] = [];
    for (const points of curves) {
      const y = interpolate(points, x, toAxis);
      if (y !== null) readings.push(y);
    }
    if (readings.length > 0) out.push([x, computeMedian(readings)]);
  }
  return out;
}

/** Points sorted by x; two readings at one x (a decimated trace keeps a min and a max) become their mean. */
export function mergeRepeatedX(points: Point[]): Point[] {
  const sorted = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const out: Point[] = [];
  let count = 0;
  for (const [x, y] of sorted) {
    const last = out[out.length - 1];
    if (last && last[0] === x) {
      count += 1;
      last[1] += (y - last[1]) / count;
    } else {
      out.push([x, y]);
      count = 1;
    }
  }
  return out;
}

/** y at x on a sorted curve by linear interpolation, y = y0 + (y1 − y0)(x − x0)/(x1 − x0); null outside the curve's span. */
export function interpolate(points: Point[], x: number, toAxis: (x: number) => number): number | null {
  if (x < points[0][0] || x > points[points.length - 1][0]) return null;
  let low = 0;
  let high = points.length - 1;
  while (high - low > 1) {
    const mid = (low + high) >> 1;
    if (points[mid][0] <= x) low = mid;
    else high = mid;
  }
  const [x0, y0] = points[low];
  if (x0 === x) return y0;
  const [x1, y1] = points[high];
  if (x1 === x) return y1;
  const t = (toAxis(x) - toAxis(x0)) / (toAxis(x1) - toAxis(x0));
  return y0 + (y1 - y0) * t;
}
