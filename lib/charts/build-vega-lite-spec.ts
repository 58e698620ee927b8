/**
 * The one Vega-Lite spec builder: a measurement set's curves in the workspace and the sheet's charts
 * (web SVG and PDF raster) are all drawn from here. Pure: no React, no DOM, no server.
 *
 * A chart is one or more traces, each a series of one unit; a series keeps its colour, dash and point
 * shape wherever it is drawn (styles.ts); several units of one series share its look and are separate
 * lines (Vega-Lite `detail`). Axis titles carry units; a frequency axis reads in the prefix its largest
 * value needs (lib/format); on screen every point has a tooltip with its value and unit.
 */
import { decimateSeries } from "../analysis/curves";
import { chooseScale, formatQuantity } from "../format/quantity";
import { tokens } from "../design/tokens";
import {
  CHART_FONTS,
  chartConfig,
  chartSizes,
  MARKER_STYLE,
  RULE_STYLE,
  SERIES_STYLES,
  seriesLabel,
  seriesStyle,
  type ChartFonts,
  type ChartMedium,
} from "./styles";

export interface ChartAxis {
  label: string;
  unit: string;
  scale?: "linear" | "log";
  /** The axis counts (unit 1, 2, 3… of a control chart): whole-number ticks only. */
  counting?: boolean;
}

export interface ChartTrace {
  /** The engine's series name ("order 2", "insertion loss S21"). */
  series: string;
  /** The unit (serial) the trace was measured on; traces of one series on several units are separate lines. */
  unit?: string;
  points: readonly (readonly [number, number])[];
}

export interface ChartMarker {
  x: number;
  y: number;
  label: string;
  unit?: string;
  /** False: not named in the plot's corner on screen (the page lists them beside the chart). */
  inCorner?: boolean;
}

/** A horizontal reference line with its label (the thermal phase-noise floor). */
export interface ChartRule {
  y: number;
  label: string;
  /** Decimals of the value in the label (one unless given). */
  decimals?: number;
}

export interface ChartData {
  title: string;
  x: ChartAxis;
  y: ChartAxis;
  /** Every series of the curve, in the engine's order: fixes each series' style (styles.ts). */
  seriesNames: readonly string[];
  traces: readonly ChartTrace[];
  markers?: readonly ChartMarker[];
  rules?: readonly ChartRule[];
}

export interface ChartLook {
  medium: ChartMedium;
  /** Pixels, or "container" to follow the element's width (screen). */
  width: number | "container";
  height: number;
  fonts?: ChartFonts;
  /** A point at every datum: "auto" sizes them by density; true for a few discrete x values. */
  points?: boolean | "auto";
  /** Min/max decimation per trace beyond this many points (lib/analysis decimateSeries). */
  maxPointsPerTrace?: number;
}

export interface BuiltChart {
  vegaLite: Record<string, unknown>;
  xTitle: string;
  yTitle: string;
  /** Series labels in legend order. */
  seriesLabels: string[];
  unitCount: number;
  markerCount: number;
  yMin: number;
  yMax: number;
}

/** Six significant figures: plenty for a plot, and the JSON stays small and stable. */
function plotValue(value: number): number {
  const rounded = Number(value.toPrecision(6));
  return Object.is(rounded, -0) ? 0 : rounded;
}

function axisTitle(label: string, unit: string): string {
  if (!unit || unit === ":1") return label;
  return `${label} (${unit === "deg" ? "°" : unit})`;
}

/** One grid line and label per decade on a log axis: the minor lines crowd a printed chart. */
function decades(xs: number[]): number[] {
  const low = Math.floor(Math.log10(Math.min(...xs)) + 1e-9);
  const high = Math.ceil(Math.log10(Math.max(...xs)) - 1e-9);
  const out: number[] = [];
  for (let e = low; e <= high; e++) out.push(10 ** e);
  return out;
}

/** What every layer of one chart shares: the look, the axes' scales and the value formats. */
interface ChartContext {
  data: ChartData;
  look: ChartLook;
  screen: boolean;
  size: ReturnType<typeof chartSizes>;
  fonts: ChartFonts;
  logX: boolean;
  logY: boolean;
  /** The x axis' prefixed unit and the factor from the data's unit to it. */
  xScale: { unit: string; factor: number };
  xText: (x: number) => string;
  yText: (y: number) => string;
}

export function buildVegaLiteSpec(data: ChartData, look: ChartLook): BuiltChart | null {
  const context = chartContext(data, look);
  const xTitle = axisTitle(data.x.label, context.xScale.unit);
  const yTitle = axisTitle(data.y.label, data.y.unit);
  const plotted = plotTraces(context);
  if (plotted.values.length === 0) return null;

  const series = seriesEncodings(data, plotted.present);
  const axes = axisEncodings(context, plotted.values, xTitle, yTitle);
  const markers = (data.markers ?? []).filter((m) => Number.isFinite(m.x) && Number.isFinite(m.y) && !(context.logX && m.x <= 0));
  const layers = [
    ...traceLayers(context, axes, series, plotted),
    ...markerLayers(context, axes, markers),
    ...ruleLayers(context),
  ];

  const { labels } = series;
  const description = `${data.title}: ${yTitle} against ${xTitle}${labels.length > 1 ? `, traces ${labels.join(", ")}` : ""}.`;
  const vegaLite = {
    $schema: "https://vega.github.io/schema/vega-lite/v6.json",
    description,
    width: look.width,
    height: look.height,
    background: context.screen ? "transparent" : tokens.colors["paper-bright"],
    padding: context.screen ? { left: 4, right: 12, top: 8, bottom: 4 } : 6,
    data: { values: plotted.values },
    layer: layers,
    resolve: { scale: { color: "shared", strokeDash: "shared", shape: "shared" } },
    config: chartConfig(look.medium, context.fonts),
  };
  const { yMin, yMax, units } = plotted;
  return { vegaLite, xTitle, yTitle, seriesLabels: labels, unitCount: units.size, markerCount: markers.length, yMin, yMax };
}

function chartContext(data: ChartData, look: ChartLook): ChartContext {
  const logX = data.x.scale === "log";
  let maxX = 0;
  for (const trace of data.traces) for (const [x] of trace.points) if (Number.isFinite(x)) maxX = Math.max(maxX, Math.abs(x));
  const xScale = logX ? { unit: data.x.unit, factor: 1 } : chooseScale(maxX, data.x.unit);
  return {
    data,
    look,
    screen: look.medium === "screen",
    size: chartSizes(look.medium),
    fonts: look.fonts ?? CHART_FONTS,
    logX,
    logY: data.y.scale === "log",
    xScale,
    xText: (x) => formatQuantity(x, xScale.unit, { digits: { maxDecimals: 4 }, prefix: false }),
    yText: (y) => formatQuantity(y, data.y.unit, { digits: { maxDecimals: 2 }, prefix: false }),
  };
}

interface PlottedTraces {
  values: Record<string, string | number>[];
  /** The series names that have at least one point drawn. */
  present: Set<string>;
  units: Set<string>;
  yMin: number;
  yMax: number;
  /** The most points any one trace draws (after decimation). */
  densest: number;
}

/** Every drawable point of every trace, decimated and scaled; a log axis drops values at or below zero. */
function plotTraces({ data, look, screen, logX, logY, xScale, xText, yText }: ChartContext): PlottedTraces {
  const plotted: PlottedTraces = { values: [], present: new Set(), units: new Set(), yMin: Infinity, yMax: -Infinity, densest: 0 };
  for (const trace of data.traces) {
    const xs = trace.points.map((p) => p[0]);
    const ys = trace.points.map((p) => p[1]);
    const points = look.maxPointsPerTrace ? decimateSeries(xs, ys, { maxPoints: look.maxPointsPerTrace, logX }) : trace.points;
    plotted.densest = Math.max(plotted.densest, points.length);
    const label = seriesLabel(trace.series);
    const unit = trace.unit ?? "";
    for (const [xRaw, yRaw] of points) {
      if (!Number.isFinite(xRaw) || !Number.isFinite(yRaw) || (logX && xRaw <= 0) || (logY && yRaw <= 0)) continue;
      const x = plotValue(xRaw * xScale.factor);
      const y = plotValue(yRaw);
      // Tooltips print the value itself, not the plotted one: rounding twice can move a last digit.
      plotted.values.push(screen ? { x, y, series: label, unit, xText: xText(xRaw * xScale.factor), yText: yText(yRaw) } : { x, y, series: label, unit });
      plotted.present.add(trace.series);
      plotted.units.add(unit);
      plotted.yMin = Math.min(plotted.yMin, y);
      plotted.yMax = Math.max(plotted.yMax, y);
    }
  }
  return plotted;
}

type SeriesStyle = (typeof SERIES_STYLES)[number];

/** The legend's labels in order, and an encoding of one style property (colour, dash, shape) per series. */
function seriesEncodings(data: ChartData, present: Set<string>) {
  // Legend order: the engine's series order, then anything it did not list.
  const ordered = [...data.seriesNames.filter((n) => present.has(n)), ...[...present].filter((n) => !data.seriesNames.includes(n)).sort()];
  const labels = ordered.map(seriesLabel);
  // A lone series has nothing to be told apart from: it is drawn in ink, and the accent stays free for markers.
  const styles = ordered.length === 1 ? [SERIES_STYLES[0]] : ordered.map((name) => seriesStyle(name, data.seriesNames));
  const legend = labels.length > 1 ? {} : null;
  const byStyle = <T,>(pick: (s: SeriesStyle) => T) => ({
    field: "series",
    type: "nominal" as const,
    scale: { domain: labels, range: styles.map(pick) },
    legend,
  });
  return { labels, byStyle };
}

/** The x and y encodings every layer shares, so the layers share scales, axes and titles. */
function axisEncodings({ data, screen, logX, logY }: ChartContext, values: PlottedTraces["values"], xTitle: string, yTitle: string) {
  const x = {
    field: "x",
    type: "quantitative" as const,
    title: xTitle,
    // A counting axis keeps its first and last point off the frame (a control chart's points are the news).
    scale: logX ? { type: "log" as const, nice: false } : data.x.counting ? { zero: false, nice: false, padding: 16 } : { zero: false, nice: screen },
    axis: logX ? { format: "~s", values: decades(values.map((v) => v.x as number)), grid: true } : data.x.counting ? { grid: true, tickMinStep: 1, format: "d" } : { grid: true },
  };
  const y = {
    field: "y",
    type: "quantitative" as const,
    title: yTitle,
    scale: { zero: false, nice: true, ...(logY ? { type: "log" as const } : {}), ...(data.x.counting ? { padding: 12 } : {}) },
  };
  return { x, y };
}

type Axes = ReturnType<typeof axisEncodings>;

/** The traces' lines, and their points when the look asks for them (with the screen's tooltips). */
function traceLayers(
  { data, look, screen, size }: ChartContext,
  { x, y }: Axes,
  { labels, byStyle }: ReturnType<typeof seriesEncodings>,
  { units, densest }: PlottedTraces,
): Record<string, unknown>[] {
  const tooltip = [
    ...(labels.length > 1 ? [{ field: "series", type: "nominal", title: "Trace" }] : []),
    ...(units.size > 1 ? [{ field: "unit", type: "nominal", title: "Unit" }] : []),
    { field: "xText", type: "nominal", title: data.x.label },
    { field: "yText", type: "nominal", title: data.y.label },
  ];
  const layers: Record<string, unknown>[] = [
    {
      mark: { type: "line", clip: true, interpolate: "linear", strokeWidth: size.strokeWidth, opacity: units.size > 1 ? 0.8 : 1 },
      encoding: { x, y, color: byStyle((s) => s.colour), strokeDash: byStyle((s) => s.dash), detail: { field: "unit", type: "nominal" } },
    },
  ];
  const points = look.points ?? false;
  if (points) {
    // Dense traces (phase noise, VNA sweeps) get small points so the line stays legible.
    const pointSize = points === "auto" ? (densest > 120 ? 4 : densest > 40 ? 14 : 30) : 16;
    layers.push({
      mark: { type: "point", filled: true, clip: true, size: pointSize, opacity: 0.95 },
      encoding: { x, y, color: byStyle((s) => s.colour), shape: byStyle((s) => s.shape), ...(screen ? { tooltip } : {}) },
    });
  }
  return layers;
}

/** Marked points (the optimum, spurs) as open circles; on screen, a labelled one is also named in the corner. */
function markerLayers({ data, screen, size, fonts, xScale, xText, yText }: ChartContext, { x, y }: Axes, markers: ChartMarker[]): Record<string, unknown>[] {
  if (markers.length === 0) return [];
  const markerValues = markers.map((m) => {
    const point = { x: plotValue(m.x * xScale.factor), y: plotValue(m.y), label: m.label, unit: m.unit ?? "" };
    return screen ? { ...point, xText: xText(m.x * xScale.factor), yText: yText(m.y) } : point;
  });
  const layers: Record<string, unknown>[] = [
    {
      data: { values: markerValues },
      mark: { type: "point", shape: MARKER_STYLE.shape, filled: false, size: screen ? 110 : 42, strokeWidth: MARKER_STYLE.strokeWidth, color: MARKER_STYLE.colour, clip: true },
      // The line layer's x and y definitions, so the layers share scales, axes and titles.
      encoding: {
        x,
        y,
        ...(screen
          ? {
              tooltip: [
                { field: "label", type: "nominal", title: "Marker" },
                { field: "xText", type: "nominal", title: data.x.label },
                { field: "yText", type: "nominal", title: data.y.label },
              ],
            }
          : {}),
      },
    },
  ];
  // On screen, a labelled marker (the optimum) is named in the plot's top-right corner, clear of its trace;
  // the printed sheet names markers in the caption.
  if (screen) {
    markers
      .filter((m) => m.label !== "spur" && m.inCorner !== false)
      .forEach((m, i) => {
        const at = formatQuantity(m.x * xScale.factor, xScale.unit, { digits: { maxDecimals: 2 }, prefix: false });
        layers.push({
          data: { values: [{ text: `\u25CB ${m.label}: ${at}, ${yText(m.y)}` }] },
          mark: { type: "text", align: "right", baseline: "top", x: "width", y: 8 + 16 * i, dx: -8, font: fonts.text, fontSize: size.legendLabel, color: MARKER_STYLE.labelColour, fontWeight: 600 },
          encoding: { text: { field: "text" } },
        });
      });
  }
  return layers;
}

/** Horizontal reference lines (the thermal floor), each with its label at the right. */
function ruleLayers({ data, screen, size, fonts }: ChartContext): Record<string, unknown>[] {
  const layers: Record<string, unknown>[] = [];
  for (const rule of data.rules ?? []) {
    if (!Number.isFinite(rule.y)) continue;
    const label = `${rule.label}: ${formatQuantity(rule.y, data.y.unit, { digits: { maxDecimals: rule.decimals ?? 1 } })}`;
    layers.push({
      data: { values: [{ y: rule.y, text: label }] },
      mark: { type: "rule", strokeDash: RULE_STYLE.dash, strokeWidth: RULE_STYLE.strokeWidth, color: RULE_STYLE.colour },
      encoding: { y: { field: "y", type: "quantitative" }, ...(screen ? { tooltip: { field: "text", type: "nominal" } } : {}) },
    });
    layers.push({
      data: { values: [{ y: rule.y, text: label }] },
      mark: { type: "text", align: "right", baseline: "bottom", x: "width", dx: -4, dy: -3, font: fonts.text, fontSize: size.annotation, color: RULE_STYLE.colour },
      encoding: { y: { field: "y", type: "quantitative" }, text: { field: "text" } },
    });
  }
  return layers;
}
