/**
 * Where a design point sits on the released curves: for each chart the calculator read, the typical
 * curve of each figure (with the units' lowest and highest values around a lone figure) and an open
 * circle at the design, drawn by the one spec builder (lib/charts) for the screen.
 */
import { buildVegaLiteSpec } from "../charts/build-vega-lite-spec";
import { formatQuantity } from "../format/quantity";
import { quantityText, readDesignInCurves, type DesignInAnswer } from "./design-in";
import type { SheetModel } from "./types";

type Point = [number, number];

export interface DesignInChart {
  id: string;
  title: string;
  /** Words for screen readers: what is drawn and where the design sits. */
  description: string;
  vegaLite: Record<string, unknown>;
}

const WIDTH = 520;
const HEIGHT = 240;

export function buildDesignInCharts(model: SheetModel, answer: DesignInAnswer): DesignInChart[] {
  const read = readDesignInCurves(model);
  if (!read.ok) return [];
  const { curves, swept } = read.curves;
  const x = answer.swept.value;
  const charts: DesignInChart[] = [];
  for (const chart of model.charts) {
    const readings = answer.readings.filter((r) => r.chartId === chart.id);
    if (readings.length === 0) continue;
    const lone = readings.length === 1;
    const traces: { series: string; unit?: string; points: Point[] }[] = [];
    const seriesNames: string[] = [];
    for (const reading of readings) {
      const curve = curves.find((c) => c.id === reading.id)!;
      // A harmonic keeps its look of every chart (lib/charts: order n takes style n − 1).
      const order = /\(×(\d+)\)$/.exec(reading.series)?.[1];
      const typicalName = lone ? `typical (median of ${curve.units.size} units)` : order ? `order ${order}` : reading.series;
      seriesNames.push(typicalName);
      traces.push({ series: typicalName, points: curve.typical });
      if (lone && curve.units.size > 1) {
        const [low, high] = envelope(curve.typical, [...curve.units.values()]);
        seriesNames.push("lowest unit", "highest unit");
        traces.push({ series: "lowest unit", points: low }, { series: "highest unit", points: high });
      }
    }
    const yUnit = readings[0].unit;
    const yLabel = lone ? readings[0].label : chart.title.startsWith("Suppression") ? "Suppression" : readings[0].label;
    const title = `${lone ? readings[0].label : chart.title.replace(/ vs .*$/, "")} at your design`;
    const built = buildVegaLiteSpec(
      {
        title,
        x: { label: swept.label, unit: swept.unit, scale: swept.scale },
        y: { label: yLabel, unit: yUnit },
        seriesNames,
        traces,
        markers: readings.map((r) => ({ x, y: r.typical, label: lone ? "your design" : r.series })),
      },
      { medium: "screen", width: WIDTH, height: HEIGHT, points: false },
    );
    if (!built) continue;
    const at = quantityText(x, swept.unit);
    charts.push({
      id: chart.id,
      title,
      description:
        `${title}: ${built.yTitle} against ${built.xTitle}, the typical curve${lone ? " with the lowest and highest unit" : "s"} at ${answer.conditionsLabel}; ` +
        readings.map((r) => `${r.label} ${formatQuantity(r.typical, r.unit, { digits: { decimals: 2 } })}`).join(", ") +
        ` at ${at}, marked by an open circle.`,
      vegaLite: built.vegaLite,
    });
  }
  return charts;
}

/** At every x of the typical curve, the lowest and the highest of the units measured there. */
function envelope(typical: Point[], units: Point[][]): [Point[], Point[]] {
  const low: Point[] = [];
  const high: Point[] = [];
  for (const [x] of typical) {
    const values = units.flatMap((points) => points.filter((p) => p[0] === x).map((p) => p[1]));
    if (values.length === 0) continue;
    low.push([x, Math.min(...values)]);
    high.push([x, Math.max(...values)]);
  }
  return [low, high];
}
