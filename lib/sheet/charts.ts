import { decimateSeries } from "../analysis/curves";
import type { Curve } from "../analysis/types";
import type { CurveTemplate } from "../../templates/types";
import { tokens } from "../design/tokens";
import { chooseScale, formatNumber } from "../format/quantity";
import { roundStable } from "./format";
import type { ChartSpec } from "./types";

/** Lines per chart beyond which more units add ink, not information. */
export const MAX_UNITS_PER_CHART = 12;
const MAX_POINTS_PER_SERIES = 300;
export const CHART_WIDTH = 470;
export const CHART_HEIGHT = 210;

/** Traces differ by dash pattern first, colour second (DESIGN.md: never colour alone). */
const SERIES_COLOURS = [tokens.colors.ink, tokens.colors.signal, tokens.colors["ink-muted"], tokens.colors["rule-strong"]];
const SERIES_DASHES = [[1, 0], [6, 3], [2, 2], [8, 3, 2, 3], [4, 2], [1, 3]];

export interface ChartSource {
  serial: string;
  curve: Curve;
}

export interface ChartOptions {
  /** Conditions shared by everything drawn, named in the caption ("2 GHz in, 25 °C"). */
  conditionsLabel?: string;
  /** Draw a dot at every point as well as the line (few, discrete x values). */
  points?: boolean;
}

interface AxisScaling {
  title: string;
  factor: number;
  log: boolean;
}

function axisScaling(axis: { label: string; unit: string; scale?: "linear" | "log" }, maxAbs: number): AxisScaling {
  const log = axis.scale === "log";
  if (axis.unit === "Hz" && !log) {
    const { unit, factor } = chooseScale(maxAbs, axis.unit);
    return { title: `${axis.label} (${unit})`, factor, log };
  }
  return { title: axis.unit ? `${axis.label} (${axis.unit === "deg" ? "°" : axis.unit})` : axis.label, factor: 1, log };
}

/**
 * One Vega-Lite 6 line chart from the same curve of many units: each unit is a
 * line (detail), each series of the curve a dash pattern and colour with a legend.
 */
export function buildChartSpec(
  template: Pick<CurveTemplate, "id" | "title" | "caption" | "selectSeries">,
  sources: ChartSource[],
  options: ChartOptions = {},
): ChartSpec | null {
  const { conditionsLabel = "", points: drawPoints = false } = options;
  const sorted = [...sources].sort((a, b) => (a.serial < b.serial ? -1 : a.serial > b.serial ? 1 : 0));
  const seenSerials = new Set<string>();
  const chosen: ChartSource[] = [];
  for (const source of sorted) {
    if (seenSerials.has(source.serial)) continue;
    seenSerials.add(source.serial);
    chosen.push(source);
  }
  const drawn = chosen.slice(0, MAX_UNITS_PER_CHART);
  if (drawn.length === 0) return null;

  const first = drawn[0].curve;
  let maxX = 0;
  for (const { curve } of drawn) for (const s of curve.series) for (const [x] of s.points) maxX = Math.max(maxX, Math.abs(x));
  const xScaling = axisScaling(first.x, maxX);
  const yScaling = axisScaling(first.y, 0);

  const seriesNames = new Set<string>();
  const values: { x: number; y: number; series: string; unit: string }[] = [];
  let yMin = Infinity;
  let yMax = -Infinity;
  for (const { serial, curve } of drawn) {
    for (const series of curve.series) {
      if (template.selectSeries && !template.selectSeries(series.name)) continue;
      seriesNames.add(series.name);
      const xs = series.points.map((p) => p[0]);
      const ys = series.points.map((p) => p[1]);
      const points = decimateSeries(xs, ys, { maxPoints: MAX_POINTS_PER_SERIES, logX: xScaling.log });
      for (const [x, y] of points) {
        if (!Number.isFinite(x) || !Number.isFinite(y) || (xScaling.log && x <= 0)) continue;
        const yValue = roundStable(Number((y * yScaling.factor).toPrecision(6)));
        values.push({ x: roundStable(Number((x * xScaling.factor).toPrecision(6))), y: yValue, series: series.name, unit: serial });
        yMin = Math.min(yMin, yValue);
        yMax = Math.max(yMax, yValue);
      }
    }
  }
  if (values.length === 0) return null;

  // Markers the engine put on a curve (each unit's optimum drive, a spur), drawn as open circles.
  const markers: { x: number; y: number; label: string; unit: string }[] = [];
  for (const { serial, curve } of drawn) {
    for (const marker of curve.markers ?? []) {
      if (!Number.isFinite(marker.x) || !Number.isFinite(marker.y) || (xScaling.log && marker.x <= 0)) continue;
      markers.push({
        x: roundStable(Number((marker.x * xScaling.factor).toPrecision(6))),
        y: roundStable(Number((marker.y * yScaling.factor).toPrecision(6))),
        label: marker.label,
        unit: serial,
      });
    }
  }
  const markerLabels = [...new Set(markers.map((m) => m.label))].sort();
  const names = [...seriesNames].sort();
  const multiSeries = names.length > 1;

  const encoding: Record<string, unknown> = {
    x: {
      field: "x",
      type: "quantitative",
      title: xScaling.title,
      scale: xScaling.log ? { type: "log" } : { zero: false, nice: false },
      // Log axes: a label and grid line per decade only; the minor lines crowd a printed chart.
      axis: xScaling.log ? { format: "~s", values: decades(values.map((v) => v.x)) } : {},
    },
    y: { field: "y", type: "quantitative", title: yScaling.title, scale: { zero: false, nice: true } },
    detail: { field: "unit", type: "nominal" },
  };
  if (multiSeries) {
    encoding.color = {
      field: "series",
      type: "nominal",
      title: null,
      scale: { domain: names, range: names.map((_, i) => SERIES_COLOURS[i % SERIES_COLOURS.length]) },
    };
    encoding.strokeDash = {
      field: "series",
      type: "nominal",
      title: null,
      scale: { domain: names, range: names.map((_, i) => SERIES_DASHES[i % SERIES_DASHES.length]) },
    };
  }

  const lineLayer = {
    mark: {
      type: "line",
      clip: true,
      strokeWidth: multiSeries ? 1.25 : 1,
      color: tokens.colors.ink,
      opacity: multiSeries ? 0.9 : 0.6,
      ...(drawPoints ? { point: { filled: true, size: 16 } } : {}),
    },
    encoding,
  };
  const markerLayer = {
    data: { values: markers },
    mark: { type: "point", shape: "circle", filled: false, size: 42, strokeWidth: 1.2, color: tokens.colors.signal, clip: true },
    // The line layer's own x and y definitions, so the layers share scales, axes and titles.
    encoding: { x: encoding.x, y: encoding.y },
  };
  const vegaLite: Record<string, unknown> = {
    $schema: "https://vega.github.io/schema/vega-lite/v6.json",
    description: template.title,
    width: CHART_WIDTH,
    height: CHART_HEIGHT,
    background: tokens.colors["paper-bright"],
    padding: 6,
    data: { values },
    ...(markers.length > 0 ? { layer: [lineLayer, markerLayer] } : lineLayer),
    config: chartConfig(),
  };

  const unitWord = drawn.length === 1 ? "unit" : "units";
  const omitted = chosen.length - drawn.length;
  const at = conditionsLabel ? ` at ${conditionsLabel}` : "";
  const markerText = markerLabels.length > 0 ? ` Open circles: ${markerLabels.join(", ")} (${markers.length}).` : "";
  const caption =
    `${template.caption} ${drawn.length} ${unitWord} drawn${at}` +
    (omitted > 0 ? ` (first ${drawn.length} of ${chosen.length} by serial).` : ".") +
    markerText;
  const description =
    `${template.title}${at}: ${drawn.length} ${unitWord}` +
    (multiSeries ? `, series ${names.join(", ")}` : "") +
    `; ${yScaling.title} from ${formatNumber(yMin, { digits: { maxDecimals: 2 } })} to ${formatNumber(yMax, { digits: { maxDecimals: 2 } })}.` +
    markerText;
  return { id: template.id, title: template.title, caption, description, unitCount: drawn.length, vegaLite };
}

function decades(xs: number[]): number[] {
  const low = Math.floor(Math.log10(Math.min(...xs)) + 1e-9);
  const high = Math.ceil(Math.log10(Math.max(...xs)) - 1e-9);
  const out: number[] = [];
  for (let e = low; e <= high; e++) out.push(10 ** e);
  return out;
}

/** The typographic voice of the sheet, in Vega-Lite config: figures in Source Code Pro, words in Source Sans 3. */
function chartConfig(): Record<string, unknown> {
  const { colors, fonts } = tokens;
  return {
    font: fonts.sans,
    view: { stroke: colors["rule-strong"], strokeWidth: 0.75 },
    axis: {
      labelFont: fonts.mono,
      labelFontSize: 9,
      labelColor: colors.ink,
      titleFont: fonts.sans,
      titleFontSize: 10,
      titleFontWeight: 600,
      titleColor: colors.ink,
      gridColor: colors.rule,
      gridWidth: 0.5,
      domainColor: colors["rule-strong"],
      tickColor: colors["rule-strong"],
    },
    legend: {
      orient: "bottom",
      direction: "horizontal",
      labelFont: fonts.sans,
      labelFontSize: 10,
      labelColor: colors.ink,
      symbolType: "stroke",
      symbolStrokeWidth: 1.5,
      symbolSize: 220,
    },
  };
}
