import type { Curve } from "../analysis/types";
import { buildVegaLiteSpec } from "../charts/build-vega-lite-spec";
import { formatNumber } from "../format/quantity";
import { parameterName } from "../domain/parameter-names";
import type { CurveTemplate } from "../../templates/types";
import type { ChartSpec } from "./types";

/** Lines per chart beyond which more units add ink, not information. */
export const MAX_UNITS_PER_CHART = 12;
const MAX_POINTS_PER_SERIES = 300;
/**
 * The plot area of a sheet chart, in points: the PDF prints a chart at the size Vega draws it (one
 * unit one point), two figures a row on an A4 page, so its type prints at the sizes lib/charts
 * states for print (7.5 pt and up) and never smaller than 7 pt (lib/sheet/print-figure.ts).
 */
export const CHART_WIDTH = 168;
export const CHART_HEIGHT = 118;

export interface ChartSource {
  serial: string;
  curve: Curve;
}

export interface ChartOptions {
  /** Conditions shared by everything drawn, named in the caption ("2 GHz in, 25 °C"). */
  conditionsLabel?: string;
  /** Draw a dot at every point as well as the line (few, discrete x values). */
  points?: boolean;
  /** A sentence after the caption and the description, e.g. the lowest and highest value drawn. */
  note?: string;
}

/**
 * One chart of the same curve from many units, for print: each unit a line, each series of the
 * curve the look it has everywhere (lib/charts), with a legend when there is more than one series.
 */
export function buildChartSpec(
  template: Pick<CurveTemplate, "id" | "title" | "caption" | "selectSeries" | "yParameter">,
  sources: ChartSource[],
  options: ChartOptions = {},
): ChartSpec | null {
  const { conditionsLabel = "", points: drawPoints = false, note } = options;
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
  const seriesNames: string[] = [];
  for (const { curve } of drawn) for (const s of curve.series) if (!seriesNames.includes(s.name)) seriesNames.push(s.name);
  const built = buildVegaLiteSpec(
    {
      title: template.title,
      x: first.x,
      y: template.yParameter ? { ...first.y, label: parameterName(template.yParameter) } : first.y,
      seriesNames,
      traces: drawn.flatMap(({ serial, curve }) =>
        curve.series.filter((s) => !template.selectSeries || template.selectSeries(s.name)).map((s) => ({ series: s.name, unit: serial, points: s.points })),
      ),
      markers: drawn.flatMap(({ serial, curve }) => (curve.markers ?? []).map((m) => ({ ...m, unit: serial }))),
    },
    { medium: "print", width: CHART_WIDTH, height: CHART_HEIGHT, points: drawPoints, maxPointsPerTrace: MAX_POINTS_PER_SERIES },
  );
  if (!built) return null;
  const markerLabels = [...new Set(drawn.flatMap(({ curve }) => (curve.markers ?? []).map((m) => m.label)))].sort();
  const names = built.seriesLabels;
  const multiSeries = names.length > 1;

  const unitWord = drawn.length === 1 ? "unit" : "units";
  const omitted = chosen.length - drawn.length;
  const at = conditionsLabel ? ` at ${conditionsLabel}` : "";
  const markerText = markerLabels.length > 0 ? ` Open circles: ${markerLabels.join(", ")} (${built.markerCount}).` : "";
  const caption =
    `${template.caption} ${drawn.length} ${unitWord} drawn${at}` +
    (omitted > 0 ? ` (first ${drawn.length} of ${chosen.length} by serial).` : ".") +
    markerText +
    (note ? ` ${note}` : "");
  const description =
    `${template.title}${at}: ${drawn.length} ${unitWord}` +
    (multiSeries ? `, series ${names.join(", ")}` : "") +
    `; ${built.yTitle} from ${formatNumber(built.yMin, { digits: { maxDecimals: 2 } })} to ${formatNumber(built.yMax, { digits: { maxDecimals: 2 } })}.` +
    markerText +
    (note ? ` ${note}` : "");
  return { id: template.id, title: template.title, caption, description, unitCount: drawn.length, vegaLite: built.vegaLite };
}
