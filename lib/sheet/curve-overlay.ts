/**
 * Typical curves of several sheets on the same axes: the review's overlay of two revisions
 * (diff-charts.ts) and the catalog's compare of two to four released sheets both draw through here.
 * A frozen model keeps each chart only as its Vega-Lite spec with the data inlined, so the curves
 * are read back from the spec, reduced to one typical curve per sheet (the median of its units) and
 * drawn by the one spec builder (lib/charts), each sheet a series of its own: a colour, a dash and a
 * point shape (lib/charts/styles.ts), so traces are never told apart by colour alone.
 */
import { buildVegaLiteSpec, type ChartAxis } from "../charts/build-vega-lite-spec";
import { seriesLabel } from "../charts/styles";
import { splitPrefixedUnit } from "../format/quantity";
import { computeMedian } from "../stats/descriptive";
import type { ChartSpec } from "./types";

const OVERLAY_HEIGHT = 260;
/** Enough to follow a curve's shape, few enough that each point's shape stays legible. */
const OVERLAY_MAX_POINTS = 100;

export type Point = [number, number];

/** One sheet's chart read back: its axes (in the data's own units) and each series' points per unit. */
export interface ChartReading {
  x: ChartAxis;
  y: ChartAxis;
  /** Series label → unit serial → points, x in the axis' unit. */
  series: Map<string, Map<string, Point[]>>;
}

/** One side of an overlay: how its traces are named in the legend, and its chart (null when it has none). */
export interface OverlaySource {
  label: string;
  chart: Pick<ChartSpec, "vegaLite"> | null;
}

/** What one source put on (or could not put on) one panel. */
export interface OverlaySourceTrace {
  label: string;
  /** Units behind the typical curve; 0 when the source has no such series. */
  unitCount: number;
  /** The typical curve, x in the axis' base unit (Hz, not GHz). */
  typical: Point[];
  /** Why the source is left off this panel although it has the series (its axes differ), else null. */
  leftOut: string | null;
}

export interface OverlayPanel {
  /** The chart id, with the series when a chart is split by series. */
  id: string;
  /** The series label when the chart has several ("2nd harmonic (×2)"), else null. */
  series: string | null;
  title: string;
  /** Words for screen readers: what is drawn, from how many units. */
  description: string;
  traces: OverlaySourceTrace[];
  xTitle: string;
  yTitle: string;
  /** A complete Vega-Lite 6 specification from lib/charts, data inlined. */
  vegaLite: Record<string, unknown>;
}

export interface OverlayOptions {
  /** Pixels, or "container" for a chart drawn in the browser. Default "container". */
  width?: number | "container";
  height?: number;
  /** The source whose series come first and whose axes the panel takes when it has the series (default the first). */
  lead?: number;
}

/**
 * One chart (by id and title) of several sources overlaid: one panel per series of the chart (a
 * chart of harmonic orders gives a panel per order, each with one trace per source). The axes are
 * those of the lead source when it has the series, else of the first that has it; a source whose chart reads on other axes (another
 * unit, or a log axis against a linear one) is left off that panel and says why.
 */
export function overlayChartSources(chart: { id: string; title: string }, sources: readonly OverlaySource[], options: OverlayOptions = {}): OverlayPanel[] {
  const readings = sources.map((s) => (s.chart ? readChart(s.chart) : null));
  const lead = options.lead ?? 0;
  const ordered = [readings[lead], ...readings.filter((_, i) => i !== lead)];
  const seriesLabels: string[] = [];
  for (const reading of ordered) for (const name of reading?.series.keys() ?? []) if (!seriesLabels.includes(name)) seriesLabels.push(name);
  const split = seriesLabels.length > 1;
  const labels = sources.map((s) => s.label);
  const panels: OverlayPanel[] = [];
  for (const series of seriesLabels) {
    const axes = ordered.find((r) => r?.series.has(series))!;
    const traces: OverlaySourceTrace[] = sources.map((source, i) => {
      const reading = readings[i];
      const units = reading?.series.get(series);
      if (!reading || !units) return { label: source.label, unitCount: 0, typical: [], leftOut: null };
      const mismatch = axesMismatch(axes, reading);
      if (mismatch) return { label: source.label, unitCount: units.size, typical: [], leftOut: mismatch };
      return { label: source.label, unitCount: units.size, typical: typicalCurve([...units.values()], reading.x.scale === "log"), leftOut: null };
    });
    const title = split ? `${chart.title}: ${series}` : chart.title;
    const built = buildVegaLiteSpec(
      {
        title,
        x: axes.x,
        y: axes.y,
        seriesNames: labels,
        traces: traces.map((t) => ({ series: t.label, points: t.typical })),
      },
      { medium: "screen", width: options.width ?? "container", height: options.height ?? OVERLAY_HEIGHT, points: "auto", maxPointsPerTrace: OVERLAY_MAX_POINTS },
    );
    if (!built) continue;
    const drawn = traces.filter((t) => t.unitCount > 0 && !t.leftOut).map((t) => `${t.label} (${unitWords(t.unitCount)})`);
    panels.push({
      id: split ? `${chart.id}--${series}` : chart.id,
      series: split ? series : null,
      title,
      description: `${title}: the typical curve (the median of the units at each point) of ${listWords(drawn)}; ${built.yTitle} against ${built.xTitle}.`,
      traces,
      xTitle: built.xTitle,
      yTitle: built.yTitle,
      vegaLite: built.vegaLite,
    });
  }
  return panels;
}

/** Why a reading cannot share the first reading's axes, or null when it can. */
function axesMismatch(first: ChartReading, other: ChartReading): string | null {
  const differs = (a: ChartAxis, b: ChartAxis) => a.unit !== b.unit || (a.scale ?? "linear") !== (b.scale ?? "linear");
  if (differs(first.x, other.x)) return `its x axis is ${axisWords(other.x)}, not ${axisWords(first.x)}`;
  if (differs(first.y, other.y)) return `its y axis is ${axisWords(other.y)}, not ${axisWords(first.y)}`;
  return null;
}

function axisWords(axis: ChartAxis): string {
  return `${axis.label}${axis.unit ? ` in ${axis.unit}` : ""}${axis.scale === "log" ? " (log)" : ""}`;
}

function unitWords(n: number): string {
  return `${n} ${n === 1 ? "unit" : "units"}`;
}

/** "a", "a and b", "a, b and c". */
function listWords(items: string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
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
    // Read as today's legend words: a model frozen before them carries the engine's ("insertion loss S21", "LO-RF"),
    // so two releases either side of that change still meet on one panel.
    const name = typeof row.series === "string" ? seriesLabel(row.series) : "";
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
