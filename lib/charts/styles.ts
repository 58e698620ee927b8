/**
 * The one look of every chart: a palette, stroke dashes and point shapes per series kind, and the
 * axis and legend voice. The workspace charts and the sheet charts (web and PDF) take it from here.
 *
 * Traces are told apart by dash and point shape as well as colour (WCAG 2.x 1.4.1, use of colour);
 * the colours are design tokens (lib/design/tokens.ts), so they follow the page.
 */
import { tokens } from "../design/tokens";
import { harmonicOrderName, parameterName } from "../domain/parameter-names";

export type PointShape = "circle" | "square" | "triangle-up" | "diamond" | "cross" | "triangle-down";

export interface SeriesStyle {
  colour: string;
  /** Vega stroke dash: [] is solid. */
  dash: number[];
  shape: PointShape;
}

const c = tokens.colors;

/** Ink first, the accent second, then the trace colours: readable on paper, distinct in print and in grey. */
export const SERIES_STYLES: readonly SeriesStyle[] = [
  { colour: c.ink, dash: [], shape: "circle" },
  { colour: c.signal, dash: [7, 3], shape: "square" },
  { colour: c["trace-slate"], dash: [2, 2], shape: "triangle-up" },
  { colour: c["trace-umber"], dash: [9, 3, 2, 3], shape: "diamond" },
  { colour: c["ink-muted"], dash: [4, 4], shape: "cross" },
  { colour: c["trace-pine"], dash: [12, 4], shape: "triangle-down" },
];

/** Engine markers (a unit's optimum drive, a spur): an open circle in the accent. */
export const MARKER_STYLE = { shape: "circle", colour: c.signal, labelColour: c["signal-deep"], strokeWidth: 1.5 } as const;

/** A reference line drawn across the plot (the thermal phase-noise floor). */
export const RULE_STYLE = { colour: c["ink-muted"], dash: [2, 3], strokeWidth: 1.25 } as const;

/**
 * A numbered series keeps its look wherever it is drawn, whatever else is on the plot: harmonic order
 * n and port n take style n − 1 (the 2nd harmonic is always the dashed accent). Other series take
 * their place among the curve's series as the engine lists them. A chart of one series draws it in
 * the first style (buildVegaLiteSpec): nothing to tell apart, and the accent stays free for markers.
 */
export function seriesStyleIndex(name: string, curveSeriesNames: readonly string[]): number {
  const numbered = /^(?:order|port) (\d+)$/.exec(name);
  if (numbered) return Math.max(0, Number(numbered[1]) - 1);
  return Math.max(0, curveSeriesNames.indexOf(name));
}

export function seriesStyle(name: string, curveSeriesNames: readonly string[]): SeriesStyle {
  return SERIES_STYLES[seriesStyleIndex(name, curveSeriesNames) % SERIES_STYLES.length];
}

/**
 * A series' legend words, from the names of lib/domain/parameter-names.ts: "order 2" → "2nd harmonic (×2)"
 * (order 1 is the fundamental); "insertion loss S21" → "Insertion loss S21"; a mixer's path "LO-RF" →
 * "LO–RF". Other names as the engine gives them.
 */
export function seriesLabel(name: string): string {
  const order = /^order (\d+)$/.exec(name);
  if (order) {
    const n = Number(order[1]);
    return `${harmonicOrderName(n)} (×${n})`;
  }
  const sPath = /^(insertion loss|isolation) (S\d\d)$/.exec(name);
  if (sPath) return `${parameterName(sPath[1].replace(" ", "-"))} ${sPath[2]}`;
  if (/^(LO|RF|IF)-(LO|RF|IF)$/.test(name)) return name.replace("-", "\u2013");
  return name;
}

export type ChartFonts = { text: string; figures: string };

/** Words in Source Sans 3, figures in Source Code Pro, as on the page and the sheet. */
export const CHART_FONTS: ChartFonts = { text: tokens.fonts.sans, figures: tokens.fonts.mono };

/** Where a chart is read: on screen (interactive, larger type) or printed on the sheet. */
export type ChartMedium = "screen" | "print";

const SIZES = {
  screen: { axisLabel: 11, axisTitle: 12.5, legendLabel: 12, annotation: 11.5, strokeWidth: 1.5, viewStroke: 1 },
  // In points: a printed chart is drawn at its printed size (two figures a row on A4), no type below 7 pt.
  print: { axisLabel: 7.5, axisTitle: 8, legendLabel: 7.5, annotation: 7.5, strokeWidth: 1, viewStroke: 0.6 },
} as const;

export function chartSizes(medium: ChartMedium) {
  return SIZES[medium];
}

/** The Vega-Lite config every chart shares: a true minus on axis labels, the token colours, the fonts. */
export function chartConfig(medium: ChartMedium, fonts: ChartFonts = CHART_FONTS): Record<string, unknown> {
  const size = SIZES[medium];
  return {
    // d3-format's locale with U+2212 for the minus, as the tables print it (lib/format).
    locale: { number: { decimal: ".", thousands: "", grouping: [3], currency: ["", ""], minus: "\u2212" } },
    font: fonts.text,
    view: { stroke: c["rule-strong"], strokeWidth: size.viewStroke },
    axis: {
      domainColor: c["rule-strong"],
      tickColor: c["rule-strong"],
      gridColor: c.rule,
      gridWidth: medium === "print" ? 0.5 : 1,
      gridOpacity: medium === "print" ? 1 : 0.7,
      labelColor: c.ink,
      labelFont: fonts.figures,
      labelFontSize: size.axisLabel,
      titleColor: c.ink,
      titleFont: fonts.text,
      titleFontSize: size.axisTitle,
      titleFontWeight: 600,
      titlePadding: medium === "print" ? 6 : 8,
    },
    legend: {
      orient: "bottom",
      direction: "horizontal",
      title: null,
      labelFont: fonts.text,
      labelFontSize: size.legendLabel,
      labelColor: c.ink,
      labelLimit: medium === "print" ? 110 : 260,
      // Printed charts are narrow: one entry a row, so a long legend grows down instead of widening the figure.
      ...(medium === "print" ? { columns: 1 } : {}),
      symbolType: "stroke",
      symbolStrokeWidth: 1.5,
      symbolSize: medium === "print" ? 140 : 160,
    },
    text: { font: fonts.text, color: c.ink },
  };
}
