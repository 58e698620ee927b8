/**
 * The sheet's consistency checks before review: each a pure function from the sheet's input (and the
 * statistics groups it computed) to open issues, which a submitter acknowledges one by one and a
 * reviewer reads. `reviewCheckStatements` says in words which checks exist, and what cannot be
 * checked, so the reviewer knows what was left to them; both renderers print it under the review notes.
 */

import { parameterName, specRowName } from "../domain/parameter-names";
import type { SheetTemplate, StatedBandTemplate } from "../../templates/types";
import { differenceUnit, formatNumber, formatQuantity, formatRange } from "../format/quantity";
import { lowerFirst } from "../format/text";
import { combineUncertainty } from "../stats/uncertainty";
import { parseConditionsKey, type Conditions } from "./conditions";
import { formatTemperature } from "./format";
import { plainNotation } from "./notation";
import type { ApprovedSetInput, SheetInput, SheetModel, StatisticsGroup } from "./types";


type Issue = SheetModel["issues"][number];

/** The organization's default minimum of units behind a limit guaranteed by characterization (organizations.limitMinUnits). */
export const DEFAULT_LIMIT_MIN_UNITS = 5;

/** What the checks below look at, in words, and what no check can see; printed on every unreleased sheet. */
export const reviewCheckStatements: string[] = [
  "Benchfold checked before review: the frequencies and bands of the specification rows against the device's stated bands; " +
    "each stated measurement uncertainty against the root-sum-square of the stated uncertainties of the instruments that measured " +
    "the data (JCGM 100:2008 §5.1.2); the lots and temperatures behind each guaranteed limit against the rated operating " +
    "temperature; the units behind each limit guaranteed by characterization against the organization's minimum; the calibration " +
    "of each instrument on the measurement date; plausibility of the measured values; every absolute maximum rating filled in; " +
    "the analyzer bandwidth behind each phase-noise set's spurs, where the sheet states spurs in dBc.",
  "Not checked: the prose (description, features, handling, test fixture) is free text, so a statement there that contradicts " +
    "the fixture, the conditions or the data is for the reviewer to find; so are limits that are consistent but wrong.",
];

/* ---------- the device's stated bands against the rows' frequencies ---------- */

/** One place in a band where rows are specified: a spot frequency (start = stop) or a band. */
interface SpecifiedSpan {
  startHz: number;
  stopHz: number;
}

/** Equal within the precision the conditions are stored with (a stated band edge and a row's frequency are the same number). */
const RELATIVE_TOLERANCE = 1e-6;
const below = (a: number, b: number) => a < b * (1 - RELATIVE_TOLERANCE);
const above = (a: number, b: number) => a > b * (1 + RELATIVE_TOLERANCE);

function spanOf(band: StatedBandTemplate, conditions: Conditions): SpecifiedSpan | null {
  for (const source of band.sources) {
    const start = conditions[source.key];
    if (typeof start !== "number") continue;
    if (!source.stopKey) return { startHz: start, stopHz: start };
    const stop = conditions[source.stopKey];
    if (typeof stop === "number") return { startHz: Math.min(start, stop), stopHz: Math.max(start, stop) };
  }
  return null;
}

const describeSpan = (span: SpecifiedSpan) =>
  span.startHz === span.stopHz ? formatQuantity(span.startHz, "Hz", { digits: { maxSignificant: 6 } }) : formatRange(span.startHz, span.stopHz, "Hz", { digits: { maxSignificant: 6 } });

/**
 * The device's stated bands against the frequencies its specification rows are stated at. What an RF
 * reviewer flags, and so what this raises (one issue per stated band and kind):
 * - a row specified at a frequency, or over a band, reaching outside the stated band: the sheet then
 *   specifies the part where its maker does not offer it, or the stated band is understated; a reader
 *   cannot tell which band the part is for, even when a worst-in-band figure over the wider band would
 *   also hold inside the narrower one;
 * - a stated band whose lower or upper edge no row reaches: the headline band promises performance at
 *   its edges, where a device is usually at its worst, and no figure there backs it. The check asks
 *   for the edges only: spot frequencies cannot cover a band, and the curves show what lies between.
 * Quiet when the device states no band, or no row carries a frequency in it.
 */
export function checkStatedBands(options: {
  template: Pick<SheetTemplate, "statedBands">;
  keyConditions: SheetInput["device"]["keyConditions"];
  groups: Pick<StatisticsGroup, "rowId" | "label" | "conditionsKey" | "n" | "limits">[];
}): Issue[] {
  const issues: Issue[] = [];
  for (const band of options.template.statedBands ?? []) {
    const stated = options.keyConditions[band.deviceKey];
    if (!stated || !(stated.max >= stated.min)) continue;
    const spans = new Map<string, SpecifiedSpan>();
    const rowsOutside = new Map<string, Set<string>>();
    for (const group of options.groups) {
      if (band.rowIds && !band.rowIds.includes(group.rowId)) continue;
      if (group.n === 0 && !group.limits) continue;
      const span = spanOf(band, parseConditionsKey(group.conditionsKey));
      if (!span) continue;
      const key = `${span.startHz}|${span.stopHz}`;
      spans.set(key, span);
      if (below(span.startHz, stated.min) || above(span.stopHz, stated.max)) {
        if (!rowsOutside.has(key)) rowsOutside.set(key, new Set());
        rowsOutside.get(key)!.add(group.label);
      }
    }
    if (spans.size === 0) continue;
    const statedText = formatRange(stated.min, stated.max, "Hz", { digits: { maxSignificant: 6 } });
    if (rowsOutside.size > 0) {
      const places = [...rowsOutside.entries()]
        .sort(([a], [b]) => spans.get(a)!.startHz - spans.get(b)!.startHz || spans.get(a)!.stopHz - spans.get(b)!.stopHz)
        .map(([key, labels]) => `${describeSpan(spans.get(key)!)} (${[...labels].join(", ")})`);
      issues.push({
        code: "specified-outside-stated-band",
        message:
          `The specifications state figures at ${places.join("; ")}, outside the device's stated ${band.label} ${statedText}: ` +
          `either the band the device is offered for or the rows' conditions is wrong, and a reader cannot tell which.`,
      });
    }
    const all = [...spans.values()];
    const lowest = Math.min(...all.map((s) => s.startHz));
    const highest = Math.max(...all.map((s) => s.stopHz));
    const missing: string[] = [];
    if (above(lowest, stated.min)) missing.push(`its lower edge ${formatQuantity(stated.min, "Hz", { digits: { maxSignificant: 6 } })}`);
    if (below(highest, stated.max)) missing.push(`its upper edge ${formatQuantity(stated.max, "Hz", { digits: { maxSignificant: 6 } })}`);
    if (missing.length > 0) {
      const covered = lowest === highest ? `at ${describeSpan({ startHz: lowest, stopHz: lowest })}` : `over ${describeSpan({ startHz: lowest, stopHz: highest })}`;
      issues.push({
        code: "stated-band-not-specified",
        message:
          `The device's stated ${band.label} ${statedText} is specified only ${covered}: no row states ${missing.join(" or ")}, ` +
          `where a designer using the whole band needs a figure.`,
      });
    }
  }
  return issues;
}

/* ---------- stated uncertainty against the instruments' ---------- */

/** Figures that are the ratio of two readings of one receiver (a tone against the carrier, noise density against it). */
const RELATIVE_UNITS = new Set(["dBc", "dBc/Hz"]);

interface InstrumentContribution {
  serial: string;
  quantity: string;
  value: number;
  unit: string;
  coverageFactor: number;
  /** U / k, in the figure's difference unit. */
  standardUncertainty: number;
}

/**
 * A stated expanded uncertainty U (k = 2, as the sheet content stores it: `measurementUncertainty`)
 * smaller than the instruments that produced the data allow. The combined standard uncertainty of
 * uncorrelated inputs with unit sensitivity is u_c = √Σ u_i² (JCGM 100:2008 §5.1.2, eq. 10, c_i = 1);
 * each instrument's stated uncertainty is expanded, U_i with its own coverage factor k_i (a
 * calibration certificate's way; `coverageFactor` in the register), so u_i = U_i / k_i (§4.3.3), and
 * the sheet's U is compared with 2·u_c. The register's quantities are free text, so which of an
 * instrument's entries entered a figure is not known: each instrument counts with its smallest entry
 * in the figure's difference unit (dB for dB, dBm, dBc and dBc/Hz figures), a lower bound. A figure in
 * dBc or dBc/Hz is a ratio read by one receiver, in which the stimulus' level cancels: it is compared
 * with the smallest single instrument's contribution instead of the sum. So the check fires only when
 * even the most favourable reading of the register exceeds the stated U; the worst set is named.
 */
export function checkStatedUncertainty(options: {
  rows: Pick<SheetTemplate["specifications"]["rows"][number], "parameter" | "unit">[];
  sets: Pick<ApprovedSetInput, "id" | "serial" | "parameters" | "instruments">[];
  measurementUncertainty: Record<string, number> | undefined;
}): Issue[] {
  const issues: Issue[] = [];
  const stated = options.measurementUncertainty ?? {};
  for (const parameter of Object.keys(stated).sort()) {
    const statedU = stated[parameter];
    const row = options.rows.find((r) => r.parameter === parameter);
    if (!row || !(statedU >= 0)) continue;
    const unit = differenceUnit(row.unit);
    const relative = RELATIVE_UNITS.has(row.unit);
    let worst: { setId: string; expanded: number; used: InstrumentContribution[] } | null = null;
    for (const set of options.sets) {
      if (!set.parameters.some((p) => p.name === parameter && p.value !== null && Number.isFinite(p.value))) continue;
      const contributions = instrumentContributions(set.instruments, unit);
      if (contributions.length === 0) continue;
      const used = relative ? [contributions.reduce((a, b) => (b.standardUncertainty < a.standardUncertainty ? b : a))] : contributions;
      const expanded = combineUncertainty(
        used.map((c) => ({ name: `${c.serial} ${c.quantity}`, bound: c.value, distribution: "normal" as const, coverageFactor: c.coverageFactor })),
        2,
      ).expandedUncertainty;
      if (!worst || expanded > worst.expanded) worst = { setId: String(set.id), expanded, used };
    }
    if (!worst || !below(statedU, worst.expanded)) continue;
    const listed = worst.used
      .map((c) => `${c.serial} ${c.quantity} ${formatQuantity(c.value, c.unit, { digits: { maxSignificant: 3 } })}, k = ${formatNumber(c.coverageFactor, { digits: { maxDecimals: 2 } })}`)
      .join("; ");
    const how = relative
      ? "the smallest stated uncertainty of the instruments that measured"
      : "the root-sum-square of the stated uncertainties of the instruments that measured";
    issues.push({
      code: "uncertainty-below-instruments",
      message:
        `The stated uncertainty of ${lowerFirst(parameterName(parameter))}, U = ${formatQuantity(statedU, unit, { digits: { maxSignificant: 3 } })} (k = 2), ` +
        `is smaller than ${formatQuantity(worst.expanded, unit, { digits: { maxSignificant: 3 } })} (k = 2), ${how} measurement set ${worst.setId} ` +
        `(${listed}; JCGM 100:2008 §5.1.2, uncorrelated inputs, unit sensitivity): the guard bands built on it are too narrow.`,
    });
  }
  return issues;
}

/** Each instrument's smallest stated uncertainty in the unit, once per instrument (by serial). */
function instrumentContributions(instruments: ApprovedSetInput["instruments"], unit: string): InstrumentContribution[] {
  const bySerial = new Map<string, InstrumentContribution>();
  for (const instrument of instruments) {
    for (const entry of instrument.uncertainty) {
      if (differenceUnit(entry.unit) !== unit || !(entry.value > 0) || !(entry.coverageFactor > 0)) continue;
      const contribution = { serial: instrument.serial, quantity: entry.quantity, value: entry.value, unit: entry.unit, coverageFactor: entry.coverageFactor, standardUncertainty: entry.value / entry.coverageFactor };
      const current = bySerial.get(instrument.serial);
      if (!current || contribution.standardUncertainty < current.standardUncertainty) bySerial.set(instrument.serial, contribution);
    }
  }
  return [...bySerial.values()].sort((a, b) => (a.serial < b.serial ? -1 : a.serial > b.serial ? 1 : 0));
}

/* ---------- what stands behind a guaranteed limit ---------- */

type LimitGroup = Pick<StatisticsGroup, "rowId" | "label" | "conditionsKey" | "conditionsText" | "n" | "limits" | "units">;

/** A stated min or max: a typical value guarantees nothing. */
const guarantees = (g: LimitGroup) => g.limits !== null && (g.limits.min.value !== null || g.limits.max.value !== null);

/** Issue messages are plain text everywhere they are shown: the notation's subscripts are written inline ("TA 25 °C"). */

const describeGroup = (g: LimitGroup) => plainNotation(g.conditionsText ? `${g.label} (${g.conditionsText})` : g.label);

/** "−40 to +85" (U+2212 or a hyphen, "to", an en dash or "…" between) → the two ends, in °C; null when not two numbers. */
export function readTemperatureRange(text: string): { min: number; max: number } | null {
  const numbers = text
    .replace(/\u2212/g, "-")
    .match(/[+-]?\d+(?:\.\d+)?/g);
  if (!numbers || numbers.length !== 2) return null;
  const [a, b] = numbers.map(Number);
  return { min: Math.min(a, b), max: Math.max(a, b) };
}

/** The operating temperature the maker rates the part for (the absolute maximum ratings' "Operating temperature"). */
export function ratedOperatingTemperature(ratings: SheetInput["absoluteMaximumRatings"]): { min: number; max: number } | null {
  const rating = ratings.find((r) => /operating temperature/i.test(r.label) && r.value.trim());
  return rating ? readTemperatureRange(rating.value) : null;
}

/**
 * Guaranteed limits resting on one lot, or on one temperature while the part is rated over a range.
 * - Lots: a limit guaranteed by characterization says the next lot will meet it; units of one lot
 *   (or of no stated lot) carry no lot-to-lot spread. Limits guaranteed by test are checked on every
 *   shipped unit, and by design on the design, so their sample's lots are not asked about.
 * - Temperature: a limit guaranteed by test or characterization whose template row has data at one
 *   temperature only, while the operating temperature is rated over a range, holds at that
 *   temperature; a designer at the range's ends has nothing. Quiet when no range is rated (the
 *   missing rating is its own issue), or when the row has data at two temperatures or more (a row over
 *   temperature, whose groups carry temperatureMinC and temperatureMaxC, has the two ends of its span).
 * One issue per kind, listing the limits.
 */
export function checkLimitSpread(options: { groups: LimitGroup[]; operatingTemperatureC: { min: number; max: number } | null }): Issue[] {
  const issues: Issue[] = [];
  const guaranteed = options.groups.filter((g) => guarantees(g) && g.n > 0);

  const oneLot = guaranteed.filter((g) => g.limits!.basis === "characterization" && new Set(g.units.map((u) => u.lot ?? "")).size === 1);
  if (oneLot.length > 0) {
    const lots = [...new Set(oneLot.map((g) => g.units[0].lot).filter((lot): lot is string => !!lot))].sort();
    const whose = lots.length === 0 ? "units that state no lot" : lots.length === 1 ? `units of one lot, ${lots[0]}` : `units of one lot each (${lots.join(", ")})`;
    issues.push({
      code: "limit-from-one-lot",
      message:
        `${count(oneLot.length, "limit")} guaranteed by characterization rest${oneLot.length === 1 ? "s" : ""} on ${whose}: ${oneLot.map(describeGroup).join("; ")}. ` +
        `The data hold no lot-to-lot spread, so the next lot may not meet ${oneLot.length === 1 ? "it" : "them"}.`,
    });
  }

  const rated = options.operatingTemperatureC;
  if (rated && rated.max > rated.min) {
    const temperaturesByRow = new Map<string, Set<number | string>>();
    for (const g of options.groups) {
      if (g.n === 0) continue;
      const { temperatureC, temperatureMinC, temperatureMaxC } = parseConditionsKey(g.conditionsKey);
      if (!temperaturesByRow.has(g.rowId)) temperaturesByRow.set(g.rowId, new Set());
      const temperatures = temperaturesByRow.get(g.rowId)!;
      // A row over temperature states no one temperature: its group carries the span its units were measured over.
      if (typeof temperatureMinC === "number" && typeof temperatureMaxC === "number") [temperatureMinC, temperatureMaxC].forEach((t) => temperatures.add(t));
      else temperatures.add(temperatureC ?? "unstated");
    }
    const oneTemperature = guaranteed.filter((g) => g.limits!.basis !== "design" && (temperaturesByRow.get(g.rowId)?.size ?? 0) <= 1);
    if (oneTemperature.length > 0) {
      const temperatures = [...new Set(oneTemperature.map((g) => parseConditionsKey(g.conditionsKey).temperatureC))];
      const at = temperatures.length === 1 && typeof temperatures[0] === "number" ? `data at ${formatTemperature(temperatures[0])} only` : "data at one temperature per row";
      issues.push({
        code: "limit-at-one-temperature",
        message:
          `${count(oneTemperature.length, "guaranteed limit")} rest${oneTemperature.length === 1 ? "s" : ""} on ${at}, while the operating temperature is rated ` +
          `${formatRange(rated.min, rated.max, "°C", { signed: true, digits: { maxDecimals: 1 } })}: ${oneTemperature.map(describeGroup).join("; ")}. ` +
          `The behaviour over the rated range is not in the data.`,
      });
    }
  }
  return issues;
}

/**
 * Limits guaranteed by characterization resting on fewer units than the organization's minimum
 * (`organizations.limit_min_units`, default 5). A different setting from the Cpk threshold (how
 * capable the data must show the process to be) and from `cpk_min_units` (from how many units a Cpk
 * is printed): this one is how many units the organization wants behind any such guarantee. A limit
 * without data is flagged already (limit-without-data); a limit guaranteed by test or design rests
 * on the test of every unit or on the design, not on this sample.
 */
export function checkLimitUnitCount(options: { groups: LimitGroup[]; minUnits: number }): Issue[] {
  const few = options.groups.filter((g) => guarantees(g) && g.limits!.basis === "characterization" && g.n > 0 && g.n < options.minUnits);
  if (few.length === 0) return [];
  return [
    {
      code: "limit-from-few-units",
      message:
        `${count(few.length, "limit")} guaranteed by characterization rest${few.length === 1 ? "s" : ""} on fewer units than the organization's minimum of ${options.minUnits}: ` +
        `${few.map((g) => `${describeGroup(g)}, ${count(g.n, "unit")}`).join("; ")}.`,
    },
  ];
}

const count = (n: number, noun: string) => `${n} ${noun}${n === 1 ? "" : "s"}`;

/* ---------- spurs without the analyzer's bandwidth ---------- */

/** The parameters a sheet row of discrete spurs in dBc reads (lib/analysis parameterCatalog). */
const SPUR_DBC_PARAMETERS = new Set(["discrete-spur", "worst-discrete-spur"]);

/**
 * Phase-noise sets whose spurs are known only as plotted, in dBc/Hz, because neither the file nor the
 * upload stated the bandwidth the analyzer normalised the trace with: a spur's power in dBc needs it
 * (lib/rf/spurs.ts), so those spurs are left out of the sheet's dBc rows and a reader would take the
 * row for the whole sample. One issue per set, naming the spurs' offsets. A set with no spur above the
 * threshold needs no bandwidth for the row and is not flagged. Quiet when the template has no spur row.
 */
export function checkSpurBandwidth(options: { rows: Pick<SheetTemplate["specifications"]["rows"][number], "parameter" | "match" | "overTemperature" | "qualifiers">[]; sets: ApprovedSetInput[] }): Issue[] {
  const rows = options.rows.filter((row) => SPUR_DBC_PARAMETERS.has(row.parameter));
  if (rows.length === 0) return [];
  const rowWords = [...new Set(rows.map((row) => lowerFirst(specRowName(row))))].join(", ");
  return options.sets.flatMap((set) => {
    const offsets = set.parameters.filter((p) => p.name === "spur" && typeof p.conditions.offsetHz === "number").map((p) => p.conditions.offsetHz as number);
    if (offsets.length === 0) return [];
    const where = [...offsets].sort((a, b) => a - b).map((f) => formatQuantity(f, "Hz", { digits: { maxSignificant: 6 } })).join(", ");
    return [
      {
        code: "spur-bandwidth-missing",
        message:
          `Measurement set ${String(set.id)} (${set.kind}, ${set.serial}) states no analyzer bandwidth: its ${count(offsets.length, "spur")} at ${where} ` +
          `${offsets.length === 1 ? "is" : "are"} known only as plotted, in dBc/Hz, and left out of ${rowWords}; state the resolution or noise bandwidth ` +
          `in the file or the upload (a corrected set) for the spur power in dBc.`,
      },
    ];
  });
}
