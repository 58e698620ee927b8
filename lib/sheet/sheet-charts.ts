import type { SheetTemplate, TrendTemplate } from "../../templates/types";
import { buildChartSpec, type ChartSource } from "./charts";
import { specRowName } from "../domain/parameter-names";
import { compareStrings } from "./compare";
import { formatQuantity, formatRange } from "../format/quantity";
import { lowerFirst } from "../format/text";
import { formatConditionCell, makeConditionsKey, parseConditionsKey, type Conditions } from "./conditions";
import { formatTemperature, formatTemperatureRange } from "./format";
import type { ApprovedSetInput, ChartSpec, SheetModel } from "./types";
import { readAtStatedDrive } from "./stated-drive";

/**
 * A chart draws one curve per unit under one set of conditions: the sets are grouped by
 * their frequency and temperature, and the group with the most units is drawn, named in
 * the caption. Among equals: the temperature nearest 25 °C, then the middle frequency
 * (the lower of two middles), so a band is shown at its centre rather than at an edge.
 */
export function buildCharts(template: SheetTemplate, sets: ApprovedSetInput[]): SheetModel["charts"] {
  const charts: SheetModel["charts"] = [];
  for (const curveTemplate of template.curves) {
    const groups = new Map<string, { label: string; frequencyHz: number; temperatureC: number; sources: ChartSource[] }>();
    for (const set of sets) {
      for (const curve of set.curves) {
        if (curve.id !== curveTemplate.curveId) continue;
        const label = describeSetConditions(set);
        let group = groups.get(label);
        if (!group) groups.set(label, (group = { label, frequencyHz: setFrequencyHz(set), temperatureC: set.temperatureC ?? 25, sources: [] }));
        group.sources.push({ serial: set.serial, curve });
      }
    }
    const unitCount = (g: { sources: ChartSource[] }) => new Set(g.sources.map((s) => s.serial)).size;
    const most = Math.max(0, ...[...groups.values()].map(unitCount));
    const candidates = [...groups.values()].filter((g) => unitCount(g) === most);
    const nearestRoom = Math.min(...candidates.map((g) => Math.abs(g.temperatureC - 25)));
    const atRoom = candidates
      .filter((g) => Math.abs(g.temperatureC - 25) === nearestRoom)
      .sort((a, b) => a.frequencyHz - b.frequencyHz || compareStrings(a.label, b.label));
    const best = atRoom[Math.floor((atRoom.length - 1) / 2)];
    const chart = best ? buildChartSpec(curveTemplate, best.sources, { conditionsLabel: best.label }) : null;
    if (chart) charts.push(chart);
  }
  for (const trend of template.trends ?? []) {
    const chart = trend.x.key === "temperatureC" ? buildTemperatureTrendChart(template, trend, sets) : buildTrendChart(trend, sets);
    if (chart) charts.push(chart);
  }
  return charts;
}

/**
 * A trend chart: each unit's values of one parameter against one condition, at the
 * temperature with the most units. Drawn only when there are two or more x values.
 */
/** A trend's y axis and series are named as a row of the same parameter, match and qualifiers is on the sheet. */
function trendAxisName(trend: TrendTemplate): string {
  return specRowName({ parameter: trend.parameter, match: trend.match, qualifiers: trend.y.qualifiers });
}

function buildTrendChart(trend: TrendTemplate, sets: ApprovedSetInput[]): ChartSpec | null {
  // temperature label → serial → x → value (the latest set wins, as in the statistics)
  const byTemperature = new Map<string, Map<string, Map<number, { value: number; order: string }>>>();
  for (const set of sets) {
    for (const parameter of trend.atStatedDrive ? readAtStatedDrive(trend, set).parameters : set.parameters) {
      if (parameter.name !== trend.parameter || parameter.value === null || !Number.isFinite(parameter.value)) continue;
      if (trend.match && !Object.entries(trend.match).every(([k, v]) => parameter.conditions[k] === v)) continue;
      const x = parameter.conditions[trend.x.key];
      if (typeof x !== "number" || !Number.isFinite(x)) continue;
      const temperature = set.temperatureC !== undefined ? formatTemperature(set.temperatureC) : "";
      let units = byTemperature.get(temperature);
      if (!units) byTemperature.set(temperature, (units = new Map()));
      let points = units.get(set.serial);
      if (!points) units.set(set.serial, (points = new Map()));
      const order = `${set.measuredOn}|${String(set.id).padStart(12, "0")}`;
      const current = points.get(x);
      if (!current || order > current.order) points.set(x, { value: parameter.value, order });
    }
  }
  let best: [string, Map<string, Map<number, { value: number }>>] | null = null;
  for (const entry of [...byTemperature.entries()].sort((a, b) => compareStrings(a[0], b[0]))) {
    if (!best || entry[1].size > best[1].size) best = entry;
  }
  if (!best) return null;
  const xs = new Set<number>();
  for (const points of best[1].values()) for (const x of points.keys()) xs.add(x);
  if (xs.size < 2) return null;
  const trendName = trendAxisName(trend);
  const sources: ChartSource[] = [...best[1].entries()].map(([serial, points]) => ({
    serial,
    curve: {
      id: trend.id,
      title: trend.title,
      x: { label: trend.x.label, unit: trend.x.unit, scale: "linear" },
      y: { label: trendName, unit: trend.y.unit },
      series: [{ name: trendName, points: [...points.entries()].sort((a, b) => a[0] - b[0]).map(([x, p]) => [x, p.value] as [number, number]) }],
    },
  }));
  return buildChartSpec(trend, sources, { conditionsLabel: best[0], points: true });
}

/**
 * A chart against temperature: each unit's value at each temperature it was measured at, the
 * temperature being the set's own (the file's temperature line or the upload's field, as the
 * statistics read it). Lines group by the trend's groupBy conditions; the group with the most units
 * is drawn (among equals the first by its conditions) and named in the caption, which also states
 * the lowest and highest value drawn over the span of temperatures. Drawn only over two or more
 * temperatures.
 */
function buildTemperatureTrendChart(template: SheetTemplate, trend: TrendTemplate, sets: ApprovedSetInput[]): ChartSpec | null {
  // conditions key → serial → temperature → value (the latest set wins, as in the statistics)
  const byGroup = new Map<string, Map<string, Map<number, { value: number; order: string }>>>();
  for (const set of sets) {
    if (set.temperatureC === undefined || !Number.isFinite(set.temperatureC)) continue;
    for (const parameter of trend.atStatedDrive ? readAtStatedDrive(trend, set).parameters : set.parameters) {
      if (parameter.name !== trend.parameter || parameter.value === null || !Number.isFinite(parameter.value)) continue;
      if (trend.match && !Object.entries(trend.match).every(([k, v]) => parameter.conditions[k] === v)) continue;
      const grouped: Conditions = { ...trend.match };
      for (const key of trend.groupBy ?? []) if (parameter.conditions[key] !== undefined) grouped[key] = parameter.conditions[key];
      const key = makeConditionsKey(grouped);
      let units = byGroup.get(key);
      if (!units) byGroup.set(key, (units = new Map()));
      let points = units.get(set.serial);
      if (!points) units.set(set.serial, (points = new Map()));
      const order = `${set.measuredOn}|${String(set.id).padStart(12, "0")}`;
      const current = points.get(set.temperatureC);
      if (!current || order > current.order) points.set(set.temperatureC, { value: parameter.value, order });
    }
  }
  let best: [string, Map<string, Map<number, { value: number }>>] | null = null;
  for (const entry of [...byGroup.entries()].sort((a, b) => compareStrings(a[0], b[0]))) {
    if (!best || entry[1].size > best[1].size) best = entry;
  }
  if (!best) return null;
  const temperatures: number[] = [];
  const values: number[] = [];
  for (const points of best[1].values()) {
    for (const [t, p] of points) {
      temperatures.push(t);
      values.push(p.value);
    }
  }
  if (new Set(temperatures).size < 2) return null;
  const trendName = trendAxisName(trend);
  const sources: ChartSource[] = [...best[1].entries()].map(([serial, points]) => ({
    serial,
    curve: {
      id: trend.id,
      title: trend.title,
      x: { label: trend.x.label, unit: trend.x.unit, scale: "linear" },
      y: { label: trendName, unit: trend.y.unit },
      series: [{ name: trendName, points: [...points.entries()].sort((a, b) => a[0] - b[0]).map(([t, p]) => [t, p.value] as [number, number]) }],
    },
  }));
  const conditions = parseConditionsKey(best[0]);
  const conditionsLabel = template.specifications.conditionColumns
    .filter((column) => column.sources.every((source) => !source.key.startsWith("temperature")))
    .map((column) => {
      const cell = formatConditionCell(column, conditions);
      return cell ? `${lowerFirst(column.label)} ${cell}` : ""; // inside the caption's sentence: "drive +10 dBm per port", "LO drive +7 dBm"
    })
    .filter(Boolean)
    .join(", ");
  const digits = { digits: { maxDecimals: 2 } };
  const note =
    `Over ${formatTemperatureRange(Math.min(...temperatures), Math.max(...temperatures))}: ` +
    `lowest ${formatQuantity(Math.min(...values), trend.y.unit, digits)}, highest ${formatQuantity(Math.max(...values), trend.y.unit, digits)}.`;
  return buildChartSpec(trend, sources, { conditionsLabel, points: true, note });
}

/**
 * A condition of the set as its parameters carry it. Not every parameter carries every key, and
 * band parameters carry their own start and stop: the smallest value (the largest for "max"),
 * so the order of the parameters cannot matter.
 */
function setCondition(set: ApprovedSetInput, key: string, pick: "min" | "max" = "min"): number | undefined {
  let found: number | undefined;
  for (const parameter of set.parameters) {
    const value = parameter.conditions[key];
    if (typeof value !== "number") continue;
    if (found === undefined || (pick === "min" ? value < found : value > found)) found = value;
  }
  return found;
}

/** The frequency a set was measured at (input, carrier or band start), for ordering; 0 if none. */
function setFrequencyHz(set: ApprovedSetInput): number {
  return setCondition(set, "inputFrequencyHz") ?? setCondition(set, "carrierFrequencyHz") ?? setCondition(set, "startHz") ?? 0;
}

function describeSetConditions(set: ApprovedSetInput): string {
  const parts: string[] = [];
  const input = setCondition(set, "inputFrequencyHz");
  const carrier = setCondition(set, "carrierFrequencyHz");
  const start = setCondition(set, "startHz");
  const stop = setCondition(set, "stopHz", "max");
  if (input !== undefined) parts.push(`${formatQuantity(input, "Hz")} in`);
  else if (carrier !== undefined) parts.push(`${formatQuantity(carrier, "Hz")} out`);
  else if (start !== undefined && stop !== undefined) parts.push(formatRange(start, stop, "Hz"));
  if (set.temperatureC !== undefined) parts.push(formatTemperature(set.temperatureC));
  return parts.join(", ");
}
