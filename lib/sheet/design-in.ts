/**
 * The design-in calculator: a customer's own drive level and input frequency, read off a released
 * revision's typical curves. Pure: it reads the frozen sheet model only (the charts' inlined data,
 * the specification rows and the statistics groups), never live measurement data.
 *
 * What the model holds decides what can be answered. Each chart of a sheet draws one curve per unit
 * under one set of conditions (lib/sheet/sheet-charts.ts), so a multiplier's curves run over drive at
 * one input frequency and a mixer's over RF frequency at one LO drive: the calculator interpolates
 * along the swept axis and asks the other to be the one value the curves were measured at. It never
 * extrapolates: outside the range every drawn unit covers, it answers with that range instead.
 */
import { keyConditionField } from "../domain/measurement-conditions";
import { classConditions } from "../../templates/upload-conditions";
import { composeParameterName, parameterName } from "../domain/parameter-names";
import { readQuantity } from "../catalog/catalog-query";
import { formatQuantity, formatRange } from "../format/quantity";
import { lowerFirst, upperFirst } from "../format/text";
import { computeMean, computeSampleStandardDeviation } from "../stats/descriptive";
import { limitBasisWords, type LimitBasis } from "../domain/sheets";
import { parseConditionsKey, type Conditions } from "./conditions";
import { roundStable } from "./format";
import { interpolate, mergeRepeatedX, readChart, typicalCurve } from "./curve-overlay";
import type { SheetModel, SpecTableRow } from "./types";

type Point = [number, number];

/** The device classes whose sheets carry curves a design can be read from. */
export const designInDeviceClasses = ["frequency-multiplier", "double-balanced-mixer"] as const;
export type DesignInDeviceClass = (typeof designInDeviceClasses)[number];

export function isDesignInDeviceClass(value: string): value is DesignInDeviceClass {
  return (designInDeviceClasses as readonly string[]).includes(value);
}

/** Longest text read from a query field; more is refused, not cut. */
export const DESIGN_IN_FIELD_MAX_CHARS = 40;

export type DesignInField = "drive" | "frequency";

export interface DesignInQuery {
  driveDbm: number;
  frequencyHz: number;
}

export interface DesignInIssue {
  field: DesignInField | "sheet";
  message: string;
}

/**
 * The two fields as typed ("+10 dBm" or "10"; "1 GHz", "1000 MHz"), through the catalog's reader of
 * quantities: a frequency needs its unit, a drive defaults to dBm. Blank means not asked yet.
 */
export function readDesignInQuery(input: { drive?: string | null; frequency?: string | null }):
  | { ok: true; query: DesignInQuery }
  | { ok: false; issues: DesignInIssue[] }
  | { ok: "blank" } {
  const drive = (input.drive ?? "").trim();
  const frequency = (input.frequency ?? "").trim();
  if (!drive && !frequency) return { ok: "blank" };
  const issues: DesignInIssue[] = [];
  let driveDbm = Number.NaN;
  let frequencyHz = Number.NaN;
  if (!drive) issues.push({ field: "drive", message: "Drive level: enter your design's drive, such as +10 dBm." });
  else if (drive.length > DESIGN_IN_FIELD_MAX_CHARS) issues.push({ field: "drive", message: `Drive level: at most ${DESIGN_IN_FIELD_MAX_CHARS} characters.` });
  else if (!/\d/.test(drive)) issues.push({ field: "drive", message: `Drive level: "${drive}" is not a decimal number (such as 10, -3.5 or +13).` });
  else {
    const read = readQuantity(drive, "dBm", { unitRequired: false });
    if (read.ok) driveDbm = read.value;
    else issues.push({ field: "drive", message: `Drive level: ${read.message}` });
  }
  if (!frequency) issues.push({ field: "frequency", message: "Input frequency: enter your design's input frequency, such as 1 GHz." });
  else if (frequency.length > DESIGN_IN_FIELD_MAX_CHARS) issues.push({ field: "frequency", message: `Input frequency: at most ${DESIGN_IN_FIELD_MAX_CHARS} characters.` });
  else if (!/\d/.test(frequency)) issues.push({ field: "frequency", message: `Input frequency: "${frequency}" is not a frequency (such as 1 GHz or 2400 MHz).` });
  else {
    const read = readQuantity(frequency, "Hz", { unitRequired: true });
    if (!read.ok) issues.push({ field: "frequency", message: `Input frequency: ${read.message}` });
    else if (read.value <= 0) issues.push({ field: "frequency", message: "Input frequency: a frequency above zero, such as 1 GHz." });
    else frequencyHz = read.value;
  }
  return issues.length ? { ok: false, issues } : { ok: true, query: { driveDbm, frequencyHz } };
}

/* ---------- the curves a released model holds ---------- */

/** One figure the calculator reads: a curve of one series of one chart, per unit, with its typical curve. */
export interface DesignInCurve {
  /** "conversion-loss", "harmonic-suppression:fundamental (×1)", "isolation:LO-RF". */
  id: string;
  /** "Conversion loss", "Fundamental suppression", "Isolation LO–RF". */
  label: string;
  unit: string;
  chartId: string;
  /** The series as the chart's data names it. */
  series: string;
  /** The sheet's parameter and the conditions that single out its specification rows. */
  parameter: string;
  match: Conditions;
  /** Each unit's points (merged, sorted by x), by serial. */
  units: Map<string, Point[]>;
  /** The median of the units at every x a unit was measured at (the review's typical curve). */
  typical: Point[];
  /** The span every unit covers: [the largest first x, the smallest last x]. */
  range: { min: number; max: number } | null;
}

export interface DesignInAxis {
  field: DesignInField;
  /** As the chart's axis names it: "Per-port drive", "Frequency". */
  label: string;
  /** "dBm" or "Hz". */
  unit: string;
  scale: "linear" | "log";
}

export interface DesignInCurves {
  deviceClass: DesignInDeviceClass;
  /** The axis the curves run along. */
  swept: DesignInAxis;
  /** The other axis, at the one value the curves were measured at. */
  fixed: DesignInAxis & { value: number };
  /** The range every curve covers on the swept axis. */
  range: { min: number; max: number };
  /** The ambient temperature of the curves, °C, when their caption states it. */
  temperatureC: number | null;
  /** The curves' conditions as the sheet's caption words them ("1 GHz in, 25 °C"). */
  conditionsLabel: string;
  curves: DesignInCurve[];
}

export type DesignInRefusalCode = "device-class" | "no-curves" | "conditions-unknown" | "outside-range";

export interface DesignInRefusal {
  ok: false;
  code: DesignInRefusalCode;
  field: DesignInField | "sheet";
  message: string;
  /** The measured range of the field refused, in its unit, when the refusal is about a range. */
  range?: { min: number; max: number; unit: string; text: string };
}

/** Which charts feed which figures, per class: the chart ids and series names the templates give. */
const CLASS_CHARTS: Record<DesignInDeviceClass, { swept: DesignInField; sweptLabel: string; charts: { chartId: string; parameter: string; curve: (series: string) => Pick<DesignInCurve, "label" | "match"> }[] }> = {
  "frequency-multiplier": {
    swept: "drive",
    sweptLabel: "Per-port drive",
    charts: [
      { chartId: "conversion-loss-vs-drive", parameter: "conversion-loss", curve: () => ({ label: parameterName("conversion-loss"), match: {} }) },
      {
        chartId: "harmonic-suppression-vs-drive",
        parameter: "harmonic-suppression",
        curve: (series) => {
          const order = harmonicOrder(series);
          return order === null
            ? { label: parameterName("harmonic-suppression"), match: {} as Conditions }
            : { label: composeParameterName("harmonic-suppression", { order }), match: { order } };
        },
      },
    ],
  },
  "double-balanced-mixer": {
    swept: "frequency",
    sweptLabel: keyConditionField(classConditions["double-balanced-mixer"], "inputFrequency").label,
    charts: [
      { chartId: "conversion-loss-vs-frequency", parameter: "conversion-loss", curve: () => ({ label: parameterName("conversion-loss"), match: {} }) },
// The legend writes the path with an en dash (lib/charts seriesLabel); a model frozen before that, with the engine's hyphen.
      { chartId: "isolation-vs-frequency", parameter: "isolation", curve: (series) => ({ label: composeParameterName("isolation", { path: series }), match: { path: series.replace("\u2013", "-") } }) },
    ],
  },
};

/** "3rd harmonic (×3)" → 3, "fundamental (×1)" → 1. */
function harmonicOrder(series: string): number | null {
  const m = /\(×(\d+)\)$/.exec(series);
  return m ? Number(m[1]) : null;
}

/**
 * The curves of a released model the calculator can read, with the one value of the axis they were
 * not swept along: a multiplier's input frequency from its charts' conditions (matched to the
 * statistics groups' exact frequencies), a mixer's LO drive from its conversion-loss groups.
 */
export function readDesignInCurves(model: SheetModel): { ok: true; curves: DesignInCurves } | DesignInRefusal {
  const deviceClass = model.template.deviceClass;
  if (!isDesignInDeviceClass(deviceClass)) {
    return {
      ok: false,
      code: "device-class",
      field: "sheet",
      message: `The design-in calculator reads frequency multiplier and mixer sheets; ${model.header.partNumber} is a ${model.template.label.toLowerCase()}.`,
    };
  }
  const plan = CLASS_CHARTS[deviceClass];
  const curves: DesignInCurve[] = [];
  let sweptAxis: DesignInAxis | null = null;
  let conditionsLabel: string | null = null;
  for (const source of plan.charts) {
    const chart = model.charts.find((c) => c.id === source.chartId);
    const reading = chart ? readChart(chart) : null;
    if (!chart || !reading) continue;
    const label = chartConditionsLabel(chart.title, chart.description);
    if (conditionsLabel === null) conditionsLabel = label;
    else if (label !== conditionsLabel) continue; // drawn under other conditions than the first chart: not one design point
    sweptAxis ??= { field: plan.swept, label: plan.sweptLabel, unit: reading.x.unit, scale: reading.x.scale ?? "linear" };
    for (const [series, byUnit] of reading.series) {
      const units = new Map<string, Point[]>();
      for (const [serial, points] of byUnit) {
        const merged = mergeRepeatedX(points.filter(([x]) => reading.x.scale !== "log" || x > 0));
        if (merged.length >= 2) units.set(serial, merged);
      }
      if (units.size === 0) continue;
      const spans = [...units.values()].map((p) => ({ min: p[0][0], max: p[p.length - 1][0] }));
      const min = Math.max(...spans.map((s) => s.min));
      const max = Math.min(...spans.map((s) => s.max));
      curves.push({
        // An id is the same whether the legend wrote the mixer's path with the engine's hyphen or the en dash ("isolation:LO-RF").
        id: `${source.parameter}${reading.series.size > 1 || source.parameter !== "conversion-loss" ? `:${series.replace("\u2013", "-")}` : ""}`,
        ...source.curve(series),
        unit: reading.y.unit,
        chartId: chart.id,
        series,
        parameter: source.parameter,
        units,
        typical: typicalCurve([...units.values()], reading.x.scale === "log"),
        range: min <= max ? { min, max } : null,
      });
    }
  }
  if (!sweptAxis || curves.length === 0 || conditionsLabel === null) {
    return { ok: false, code: "no-curves", field: "sheet", message: `${model.header.partNumber} ${model.header.revisionText} has no released curves to read a design from.` };
  }
  const covered = curves.filter((c) => c.range !== null);
  if (covered.length === 0) {
    return { ok: false, code: "no-curves", field: "sheet", message: `The units of ${model.header.partNumber} were swept over ranges that do not overlap; no point is measured on all of them.` };
  }
  const range = { min: Math.max(...covered.map((c) => c.range!.min)), max: Math.min(...covered.map((c) => c.range!.max)) };
  const temperatureC = labelTemperature(conditionsLabel);
  const fixed = deviceClass === "frequency-multiplier" ? multiplierFrequency(model, conditionsLabel) : mixerLoDrive(model, temperatureC);
  if (!fixed.ok) return fixed;
  return {
    ok: true,
    curves: { deviceClass, swept: sweptAxis, fixed: fixed.axis, range, temperatureC, conditionsLabel, curves: covered },
  };
}

/** The conditions a chart was drawn at, from its description ("<title> at 1 GHz in, 25 °C: 4 units; …"). */
function chartConditionsLabel(title: string, description: string): string {
  const prefix = `${title} at `;
  if (!description.startsWith(prefix)) return "";
  const rest = description.slice(prefix.length);
  const end = rest.search(/: \d+ units?[;,]/);
  return end >= 0 ? rest.slice(0, end) : "";
}

/** "25 °C" in a conditions label, with the sheet's true minus; null when none. */
function labelTemperature(label: string): number | null {
  for (const part of label.split(", ")) {
    const m = /^([+\u2212-]?\d+(?:\.\d+)?)\u00a0?\s?°C$/.exec(part.trim());
    if (m) return Number(m[1].replace("\u2212", "-"));
  }
  return null;
}

type FixedAxisResult = { ok: true; axis: DesignInCurves["fixed"] } | DesignInRefusal;

/**
 * A multiplier's curves were drawn at one input frequency, named in their conditions ("1 GHz in").
 * The text is rounded as printed, so the exact value is the statistics group's frequency that prints
 * the same; a label that names none (an older layout) is read as it is.
 */
function multiplierFrequency(model: SheetModel, label: string): FixedAxisResult {
  const part = label.split(", ").find((p) => / in$/.test(p));
  const read = part ? readQuantity(part.replace(/ in$/, "").replace(/\u00a0/g, " "), "Hz", { unitRequired: true }) : null;
  if (!part || !read || !read.ok) {
    return { ok: false, code: "conditions-unknown", field: "frequency", message: `The released curves of ${model.header.partNumber} do not state the input frequency they were measured at, so no design point can be read from them.` };
  }
  const printed = part.replace(/ in$/, "");
  const exact = model.statistics.groups
    .map((g) => parseConditionsKey(g.conditionsKey).inputFrequencyHz)
    .find((f): f is number => typeof f === "number" && formatQuantity(f, "Hz") === printed);
  return { ok: true, axis: { field: "frequency", label: keyConditionField(classConditions["frequency-multiplier"], "inputFrequency").label, unit: "Hz", scale: "linear", value: exact ?? read.value } };
}

/**
 * A mixer's curves are drawn at the LO drive of its conversion-loss groups (the chart's conditions
 * name the band and temperature only). One drive is one curve; curves of several drives would be
 * drawn as one, so the calculator does not guess which.
 */
function mixerLoDrive(model: SheetModel, temperatureC: number | null): FixedAxisResult {
  const drives = new Set<number>();
  for (const group of model.statistics.groups) {
    if (group.parameter !== "conversion-loss") continue;
    const c = parseConditionsKey(group.conditionsKey);
    if (temperatureC !== null && typeof c.temperatureC === "number" && c.temperatureC !== temperatureC) continue;
    if (typeof c.loPowerDbm === "number") drives.add(c.loPowerDbm);
  }
  if (drives.size !== 1) {
    return {
      ok: false,
      code: "conditions-unknown",
      field: "drive",
      message:
        drives.size === 0
          ? `The released curves of ${model.header.partNumber} do not state the LO drive they were measured at, so no design point can be read from them.`
          : `The released curves of ${model.header.partNumber} hold more than one LO drive in one chart, so the calculator cannot tell which curve is which.`,
    };
  }
  return { ok: true, axis: { field: "drive", label: keyConditionField(classConditions["double-balanced-mixer"], "drive").label, unit: "dBm", scale: "linear", value: [...drives][0] } };
}

/* ---------- one design point ---------- */

export interface DesignInSpread {
  /** Units whose sweep covers the point (every drawn unit, inside the measured range). */
  n: number;
  mean: number;
  /** Sample standard deviation (n − 1); null for a single unit. */
  standardDeviation: number | null;
  min: number;
  max: number;
}

export interface DesignInLimit {
  rowId: string;
  label: string;
  /** The row's conditions as the statistics annex words them ("Frequency 1 GHz in, Drive +10 dBm per port, T_A 25 °C"). */
  conditionsText: string;
  min: number | null;
  typ: number | null;
  max: number | null;
  /** As printed on the sheet (U+2212 minus), "" when absent. */
  minText: string;
  typText: string;
  maxText: string;
  unit: string;
  basis: LimitBasis;
  basisMark: string;
  basisText: string;
  /** True when the row's limit is stated at another drive than the design's (the conditions text names it). */
  driveDiffers: boolean;
}

export interface DesignInReading {
  id: string;
  label: string;
  unit: string;
  chartId: string;
  series: string;
  /** On the typical curve, linear between its two nearest points. */
  typical: number;
  between: { x0: number; y0: number; x1: number; y1: number };
  spread: DesignInSpread;
  /** The sheet's specification rows for this figure at the design's conditions. */
  limits: DesignInLimit[];
}

export interface DesignInAnswer {
  ok: true;
  deviceClass: DesignInDeviceClass;
  query: DesignInQuery;
  swept: DesignInAxis & { value: number };
  fixed: DesignInCurves["fixed"];
  range: DesignInCurves["range"];
  temperatureC: number | null;
  conditionsLabel: string;
  /** How the figures were read, in words. */
  method: string;
  /** What the spread says and what it leaves out, in words. */
  uncertainty: string;
  readings: DesignInReading[];
}

/** Relative tolerance for "the frequency the curves were measured at": a typed value that prints the same. */
const SAME_FREQUENCY = 1e-9;
/** Drive levels are stated to 0.1 dB at best; below a thousandth of a dB two drives are one. */
const SAME_DRIVE_DB = 1e-3;

/**
 * The design point read off the released curves: each figure on its typical curve by linear
 * interpolation (in dB against the swept axis; against log10 x on a log axis), the units' spread at
 * the same point, and the sheet's limits at those conditions. Outside the measured range, or at
 * another value of the fixed axis than the curves', it refuses and names the range.
 */
export function computeDesignIn(model: SheetModel, query: DesignInQuery): DesignInAnswer | DesignInRefusal {
  const read = readDesignInCurves(model);
  if (!read.ok) return read;
  const curves = read.curves;
  const sweptValue = curves.swept.field === "drive" ? query.driveDbm : query.frequencyHz;
  const fixedValue = curves.fixed.field === "drive" ? query.driveDbm : query.frequencyHz;

  const fixedText = quantityText(curves.fixed.value, curves.fixed.unit);
  const sameFixed =
    curves.fixed.unit === "Hz"
      ? Math.abs(fixedValue - curves.fixed.value) <= SAME_FREQUENCY * Math.abs(curves.fixed.value)
      : Math.abs(fixedValue - curves.fixed.value) <= SAME_DRIVE_DB;
  if (!sameFixed) {
    return {
      ok: false,
      code: "outside-range",
      field: curves.fixed.field,
      message:
        `The released curves of ${model.header.partNumber} were measured at ${lowerFirst(curves.fixed.label)} ${fixedText} only; ` +
        `${quantityText(fixedValue, curves.fixed.unit)} is outside the measured range, and the calculator does not extrapolate.`,
      range: { min: curves.fixed.value, max: curves.fixed.value, unit: curves.fixed.unit, text: fixedText },
    };
  }
  const { min, max } = curves.range;
  if (!(sweptValue >= min && sweptValue <= max)) {
    const rangeText = rangeWords(min, max, curves.swept.unit);
    return {
      ok: false,
      code: "outside-range",
      field: curves.swept.field,
      message:
        `${curves.swept.label} ${quantityText(sweptValue, curves.swept.unit)} is outside the measured range of ${model.header.partNumber}, ` +
        `${rangeText}; the calculator does not extrapolate.`,
      range: { min, max, unit: curves.swept.unit, text: rangeText },
    };
  }

  const logX = curves.swept.scale === "log";
  const toAxis = logX ? Math.log10 : (x: number) => x;
  const readings: DesignInReading[] = curves.curves.map((curve) => {
    const values = [...curve.units.values()].map((points) => interpolate(points, sweptValue, toAxis)).filter((v): v is number => v !== null);
    const between = bracket(curve.typical, sweptValue);
    const typical = interpolate(curve.typical, sweptValue, toAxis)!;
    return {
      id: curve.id,
      label: curve.label,
      unit: curve.unit,
      chartId: curve.chartId,
      series: curve.series,
      typical: roundStable(typical),
      between: { x0: roundStable(between.x0), y0: roundStable(between.y0), x1: roundStable(between.x1), y1: roundStable(between.y1) },
      spread: {
        n: values.length,
        mean: roundStable(computeMean(values)),
        standardDeviation: values.length > 1 ? roundStable(computeSampleStandardDeviation(values)) : null,
        min: roundStable(Math.min(...values)),
        max: roundStable(Math.max(...values)),
      },
      limits: limitsFor(model, curve, { query, temperatureC: curves.temperatureC }),
    };
  });

  const unitCount = Math.max(...curves.curves.map((c) => c.units.size));
  const sweptWords = `${lowerFirst(curves.swept.label)}${curves.swept.unit ? ` in ${curves.swept.unit}` : ""}`;
  return {
    ok: true,
    deviceClass: curves.deviceClass,
    query,
    swept: { ...curves.swept, value: sweptValue },
    fixed: curves.fixed,
    range: curves.range,
    temperatureC: curves.temperatureC,
    conditionsLabel: curves.conditionsLabel,
    method:
      `Read off the released typical curves (at ${curves.conditionsLabel}; the median of the ${unitCount} units at each measured point), ` +
      `linear in dB against ${logX ? `log10 of ${sweptWords}` : sweptWords} between the two nearest measured points. ` +
      `The curves were measured at one ${lowerFirst(curves.fixed.label)}, ${fixedText}, so the reading is one-dimensional; nothing is extrapolated.`,
    uncertainty:
      `The spread is that of the units drawn on the sheet, each read at the same point by linear interpolation on its own curve: ` +
      `their standard deviation (n − 1) and their lowest and highest value. It does not include the measurement uncertainty, ` +
      `lot-to-lot variation beyond these units, or the error of interpolating between measured points.`,
    readings,
  };
}

/** The typical curve's two points around x (one point twice when x is a measured point). */
function bracket(points: Point[], x: number): DesignInReading["between"] {
  let i = 0;
  while (i < points.length - 1 && points[i + 1][0] <= x) i++;
  const [x0, y0] = points[i];
  const [x1, y1] = x0 === x || i === points.length - 1 ? points[i] : points[i + 1];
  return { x0, y0, x1, y1 };
}

/**
 * The specification rows of the figure's parameter at the design's conditions: an input frequency
 * that is the design's, a band that contains it, an LO drive that is the design's, the curves'
 * temperature (or a span of temperatures that holds it). A multiplier's row at another per-port drive than the design's is kept and marked (its conditions name the drive), since it is what the sheet guarantees.
 */
function limitsFor(model: SheetModel, curve: DesignInCurve, at: { query: DesignInQuery; temperatureC: number | null }): DesignInLimit[] {
  const groups = new Map(model.statistics.groups.map((g) => [g.groupId, g]));
  const out: DesignInLimit[] = [];
  for (const row of model.specifications.rows) {
    if (row.parameter !== curve.parameter) continue;
    const c = parseConditionsKey(row.conditionsKey);
    if (!Object.entries(curve.match).every(([k, v]) => c[k] === v)) continue;
    if (!rowApplies(c, at)) continue;
    if (row.min.value === null && row.typ.value === null && row.max.value === null) continue;
    // A multiplier's row names its drive: a stated per-port drive (+10 dBm), or "optimum" on a sheet built before drives were stated.
    const driveDiffers = typeof c.drive === "string" || (typeof c.drive === "number" && Math.abs(c.drive - at.query.driveDbm) > SAME_DRIVE_DB);
    out.push(limitOf(row, groups.get(row.groupId)?.conditionsText ?? "", driveDiffers));
  }
  return out;
}

function rowApplies(c: Conditions, { query, temperatureC }: { query: DesignInQuery; temperatureC: number | null }): boolean {
  if (typeof c.inputFrequencyHz === "number" && Math.abs(c.inputFrequencyHz - query.frequencyHz) > SAME_FREQUENCY * c.inputFrequencyHz) return false;
  if (typeof c.startHz === "number" && typeof c.stopHz === "number" && !(query.frequencyHz >= c.startHz && query.frequencyHz <= c.stopHz)) return false;
  if (typeof c.loPowerDbm === "number" && Math.abs(c.loPowerDbm - query.driveDbm) > SAME_DRIVE_DB) return false;
  if (temperatureC !== null && typeof c.temperatureC === "number" && c.temperatureC !== temperatureC) return false;
  // A row over temperature applies at the curves' temperature when its span holds it.
  if (temperatureC !== null && typeof c.temperatureMinC === "number" && typeof c.temperatureMaxC === "number" && !(temperatureC >= c.temperatureMinC && temperatureC <= c.temperatureMaxC)) return false;
  return true;
}

function limitOf(row: SpecTableRow, conditionsText: string, driveDiffers: boolean): DesignInLimit {
  return {
    rowId: row.rowId,
    label: row.label,
    conditionsText,
    min: row.min.value,
    typ: row.typ.value,
    max: row.max.value,
    minText: row.min.text,
    typText: row.typ.text,
    maxText: row.max.text,
    unit: row.unit,
    basis: row.basis,
    basisMark: row.basisMark,
    basisText: limitBasisWords[row.basis].legend,
    driveDiffers,
  };
}

/** A drive signed ("+10 dBm"), a frequency with its prefix ("1.2 GHz"). */
export function quantityText(value: number, unit: string): string {
  return unit === "dBm" ? formatQuantity(value, unit, { signed: true, digits: { maxDecimals: 2 } }) : formatQuantity(value, unit, { digits: { maxSignificant: 6 } });
}

function rangeWords(min: number, max: number, unit: string): string {
  return unit === "dBm" ? `${quantityText(min, unit)} to ${quantityText(max, unit)}` : formatRange(min, max, unit, { digits: { maxSignificant: 6 } });
}

/* ---------- one request, page or API ---------- */

export type DesignInOutcome =
  | { kind: "blank" }
  | { kind: "issues"; issues: DesignInIssue[] }
  | { kind: "refused"; refusal: DesignInRefusal }
  | { kind: "answer"; answer: DesignInAnswer };

/**
 * What the page and `GET /api/v1/sheets/{org}/{part}/{rev}/design-in` both do with the two fields as
 * typed: a sheet the calculator cannot read is said first, then unreadable input, then the reading
 * or the refusal to extrapolate.
 */
export function designInOutcome(model: SheetModel, typed: { drive?: string | null; frequency?: string | null }): DesignInOutcome {
  const curves = readDesignInCurves(model);
  if (!curves.ok) return { kind: "refused", refusal: curves };
  const read = readDesignInQuery(typed);
  if (read.ok === "blank") return { kind: "blank" };
  if (read.ok === false) return { kind: "issues", issues: read.issues };
  const answer = computeDesignIn(model, read.query);
  return answer.ok ? { kind: "answer", answer } : { kind: "refused", refusal: answer };
}
