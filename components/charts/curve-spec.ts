/**
 * Vega-Lite specs from the engine's plot-ready curves (lib/analysis Curve). Pure: no React,
 * no DOM, so the web page and the sheet renderer (vega → SVG → PDF) draw the same chart.
 *
 * Traces are told apart by stroke dash and point shape as well as colour (WCAG 1.4.1);
 * axis titles carry units; tooltips show each value with its unit.
 */
import type { TopLevelSpec } from "vega-lite";
import type { Curve, CurveSeries, DerivedParameter } from "@/lib/analysis/types";
import { formatQuantity } from "@/lib/format";
import { tokens } from "@/lib/design/tokens";

export type ChartFonts = { text: string; figures: string };

export type CurveSpecOptions = {
  /** Pixels, or "container" to follow the element's width (web). */
  width?: number | "container";
  height?: number;
  fonts?: ChartFonts;
  /** The thermal phase-noise floor kT − 3.01 dB − P_carrier, dBc/Hz, drawn on phase-noise plots. */
  thermalFloorDbcHz?: number;
};

const c = tokens.colors;
/** Ink first, the accent second, then warm greys: readable on paper, distinct in print. */
export const seriesColours = [c.ink, c.signal, c["trace-slate"], c["trace-umber"], c["ink-muted"], c["trace-pine"]];
export const seriesDashes: number[][] = [[], [7, 3], [2, 2], [9, 3, 2, 3], [4, 4], [12, 4]];
export const seriesShapes = ["circle", "square", "triangle-up", "diamond", "cross", "triangle-down"];

export const defaultChartFonts: ChartFonts = { text: tokens.fonts.sans, figures: tokens.fonts.mono };

const frequencyScales = [
  { unit: "GHz", scale: 1e9 },
  { unit: "MHz", scale: 1e6 },
  { unit: "kHz", scale: 1e3 },
  { unit: "Hz", scale: 1 },
];

/** Units as the trade writes them. */
export function displayUnit(unit: string): string {
  if (unit === "deg") return "°";
  return unit;
}

function withUnit(value: number, unit: string, maxDecimals = 3): string {
  return formatQuantity(value, unit, { digits: { maxDecimals }, prefix: false });
}

/** "order 2" → "2nd harmonic"; order 1 is the fundamental. */
export function seriesLabel(name: string): string {
  const m = /^order (\d+)$/.exec(name);
  if (!m) return name;
  const n = Number(m[1]);
  if (n === 1) return "fundamental (×1)";
  const suffix = n % 10 === 2 && n % 100 !== 12 ? "nd" : n % 10 === 3 && n % 100 !== 13 ? "rd" : "th";
  return `${n}${suffix} harmonic (×${n})`;
}

/** A frequency axis in Hz is shown in the unit its largest value reads best in; a log axis stays in Hz. */
function xPresentation(curve: Curve): { unit: string; scale: number } {
  if (curve.x.unit !== "Hz" || curve.x.scale === "log") return { unit: curve.x.unit, scale: 1 };
  let max = 0;
  for (const s of curve.series) for (const [x] of s.points) max = Math.max(max, Math.abs(x));
  const pick = frequencyScales.find((f) => max >= f.scale) ?? frequencyScales[frequencyScales.length - 1];
  return pick;
}

/** Return loss (dB) → VSWR: |Γ| = 10^(−RL/20), VSWR = (1+|Γ|)/(1−|Γ|) (Pozar §2.3). */
export function vswrCurveFromReturnLoss(curve: Curve): Curve {
  const toVswr = (rl: number) => {
    const gamma = 10 ** (-rl / 20);
    return gamma >= 1 ? Number.POSITIVE_INFINITY : (1 + gamma) / (1 - gamma);
  };
  return {
    id: "vswr",
    title: "VSWR vs frequency",
    x: curve.x,
    y: { label: "VSWR", unit: ":1" },
    series: curve.series.map((s) => ({ name: s.name, points: s.points.filter(([, rl]) => rl > 0).map(([x, rl]) => [x, toVswr(rl)] as [number, number]) })),
  };
}

/** The thermal floor on L(f) from the engine's "noise-floor-above-kt" parameter: kT − 10·log10(2) − P_carrier. */
export function thermalFloorFromParameters(parameters: DerivedParameter[]): number | undefined {
  const p = parameters.find((q) => q.name === "noise-floor-above-kt");
  const kt = Number(p?.conditions.ktDbmHz);
  const carrier = Number(p?.conditions.carrierPowerDbm);
  if (!p || !Number.isFinite(kt) || !Number.isFinite(carrier)) return undefined;
  // Half of additive thermal noise appears as PM: L = Sφ/2 (IEEE Std 1139).
  return kt - 10 * Math.log10(2) - carrier;
}

/** Curves to draw for a set: the engine's, plus VSWR beside return loss. */
export function curvesForDisplay(curves: Curve[]): Curve[] {
  const out: Curve[] = [];
  for (const curve of curves) {
    out.push(curve);
    if (curve.id === "return-loss") out.push(vswrCurveFromReturnLoss(curve));
  }
  return out;
}

type Datum = { series: string; x: number; y: number; xText: string; yText: string };

function seriesData(series: CurveSeries[], x: { unit: string; scale: number }, yUnit: string): Datum[] {
  const rows: Datum[] = [];
  for (const s of series) {
    const label = seriesLabel(s.name);
    for (const [xRaw, y] of s.points) {
      if (!Number.isFinite(xRaw) || !Number.isFinite(y)) continue;
      const xv = xRaw / x.scale;
      rows.push({ series: label, x: xv, y, xText: withUnit(xv, x.unit, 4), yText: withUnit(y, yUnit, 2) });
    }
  }
  return rows;
}

function axisTitle(label: string, unit: string): string {
  if (!unit || unit === ":1") return label;
  return `${label} (${displayUnit(unit)})`;
}

export function buildCurveSpec(curve: Curve, options: CurveSpecOptions = {}): TopLevelSpec {
  const fonts = options.fonts ?? defaultChartFonts;
  const x = xPresentation(curve);
  const yUnit = curve.y.unit;
  const data = seriesData(curve.series, x, yUnit);
  const names = [...new Set(data.map((d) => d.series))];
  const logX = curve.x.scale === "log";
  const maxPoints = Math.max(0, ...curve.series.map((s) => s.points.length));
  const xTitle = axisTitle(curve.x.label, x.unit);
  const yTitle = axisTitle(curve.y.label, yUnit);

  // One look per harmonic order on every plot (the 2nd is always the dashed accent); other traces in turn.
  const styleIndex = (name: string, position: number) => {
    const original = curve.series.find((s) => seriesLabel(s.name) === name)?.name ?? name;
    const order = /^order (\d+)$/.exec(original);
    return order ? Number(order[1]) - 1 : position;
  };
  const styles = names.map((name, i) => styleIndex(name, i));
  const pick = <T,>(list: T[]) => styles.map((k) => list[k % list.length]);
  const seriesScale = { domain: names };
  const legend = names.length > 1 ? { title: null, orient: "bottom" as const, direction: "horizontal" as const, symbolStrokeWidth: 1.5, symbolSize: 120, labelFont: fonts.text, labelFontSize: 12, labelLimit: 260 } : null;
  const xEncoding = {
    field: "x",
    type: "quantitative" as const,
    title: xTitle,
    scale: logX ? { type: "log" as const, nice: false } : { zero: false, nice: true },
    axis: logX ? { format: "~s", grid: true, tickCount: 8 } : { grid: true },
  };
  const yEncoding = {
    field: "y",
    type: "quantitative" as const,
    title: yTitle,
    scale: { zero: false, nice: true, ...(curve.y.scale === "log" ? { type: "log" as const } : {}) },
  };
  const tooltip = [
    ...(names.length > 1 ? [{ field: "series", type: "nominal" as const, title: "Trace" }] : []),
    { field: "xText", type: "nominal" as const, title: curve.x.label },
    { field: "yText", type: "nominal" as const, title: curve.y.label },
  ];
  const colour = { field: "series", type: "nominal" as const, scale: { ...seriesScale, range: pick(seriesColours) }, legend };
  const dash = { field: "series", type: "nominal" as const, scale: { ...seriesScale, range: pick(seriesDashes) }, legend };
  const shape = { field: "series", type: "nominal" as const, scale: { ...seriesScale, range: pick(seriesShapes) }, legend };

  // Dense traces (phase noise, VNA sweeps) get small points so the line stays legible.
  const pointSize = maxPoints > 120 ? 4 : maxPoints > 40 ? 14 : 30;

  const layers: object[] = [
    {
      data: { values: data },
      mark: { type: "line", strokeWidth: 1.5, interpolate: "linear", clip: true },
      encoding: { x: xEncoding, y: yEncoding, color: colour, strokeDash: dash, detail: { field: "series" } },
    },
    {
      data: { values: data },
      mark: { type: "point", filled: true, clip: true, size: pointSize, opacity: 0.95 },
      encoding: { x: xEncoding, y: yEncoding, color: colour, shape, tooltip },
    },
  ];

  const markers = (curve.markers ?? []).filter((m) => Number.isFinite(m.x) && Number.isFinite(m.y));
  if (markers.length > 0) {
    const markerData = markers.map((m) => {
      const xv = m.x / x.scale;
      const text =
        m.label === "spur" ? "" : `${m.label}: ${withUnit(xv, x.unit, 2)}, ${withUnit(m.y, yUnit, 2)}`;
      return { label: m.label, x: xv, y: m.y, text, xText: withUnit(xv, x.unit, 4), yText: withUnit(m.y, yUnit, 2) };
    });
    layers.push({
      data: { values: markerData },
      mark: { type: "point", shape: "diamond", size: 110, filled: false, strokeWidth: 2, color: c.signal, clip: true },
      encoding: {
        x: { field: "x", type: "quantitative" },
        y: { field: "y", type: "quantitative" },
        tooltip: [
          { field: "label", type: "nominal", title: "Marker" },
          { field: "xText", type: "nominal", title: curve.x.label },
          { field: "yText", type: "nominal", title: curve.y.label },
        ],
      },
    });
    // Labelled markers (the optimum) are named in the plot's top-right corner, clear of the trace they sit on.
    const labelled = markerData.filter((m) => m.text);
    labelled.forEach((m, i) => {
      layers.push({
        data: { values: [{ text: `\u25C7 ${m.text}` }] },
        mark: { type: "text", align: "right", baseline: "top", x: "width", y: 8 + 16 * i, dx: -8, font: fonts.text, fontSize: 12, color: c["signal-deep"], fontWeight: 600 },
        encoding: { text: { field: "text" } },
      });
    });
  }

  if (options.thermalFloorDbcHz !== undefined && Number.isFinite(options.thermalFloorDbcHz)) {
    const floor = options.thermalFloorDbcHz;
    const label = `thermal floor (kT, 290 K): ${withUnit(floor, "dBc/Hz", 1)}`;
    layers.push({
      data: { values: [{ y: floor, text: label }] },
      mark: { type: "rule", strokeDash: [2, 3], strokeWidth: 1.25, color: c["ink-muted"] },
      encoding: { y: { field: "y", type: "quantitative" }, tooltip: { field: "text", type: "nominal" } },
    });
    layers.push({
      data: { values: [{ y: floor, text: label }] },
      mark: { type: "text", align: "right", baseline: "bottom", x: "width", dx: -4, dy: -3, font: fonts.text, fontSize: 11.5, color: c["ink-muted"] },
      encoding: { y: { field: "y", type: "quantitative" }, text: { field: "text" } },
    });
  }

  const description = `${curve.title}: ${yTitle} against ${xTitle}${names.length > 1 ? `, traces ${names.join(", ")}` : ""}.`;

  return {
    $schema: "https://vega.github.io/schema/vega-lite/v6.json",
    description,
    width: options.width ?? "container",
    height: options.height ?? 260,
    background: "transparent",
    padding: { left: 4, right: 12, top: 8, bottom: 4 },
    layer: layers,
    resolve: { scale: { color: "shared", strokeDash: "shared", shape: "shared" } },
    config: {
      // A true minus sign on every axis label, as in the tables (components/format-quantity).
      locale: { number: { decimal: ".", thousands: "", grouping: [3], currency: ["", ""], minus: "\u2212" } },
      font: fonts.text,
      view: { stroke: c["rule-strong"], strokeWidth: 1 },
      axis: {
        domainColor: c["rule-strong"],
        tickColor: c["rule-strong"],
        gridColor: c.rule,
        gridOpacity: 0.7,
        labelColor: c.ink,
        labelFont: fonts.figures,
        labelFontSize: 11,
        titleColor: c.ink,
        titleFont: fonts.text,
        titleFontSize: 12.5,
        titleFontWeight: 600,
        titlePadding: 8,
      },
      legend: { labelColor: c.ink, symbolType: "stroke" },
      text: { font: fonts.text, color: c.ink },
    },
  } as TopLevelSpec;
}
