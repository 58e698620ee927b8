/**
 * The compare table: the specification rows of two to four released sheets aligned by parameter and
 * conditions, one line per figure (min, typ, max) with one value per sheet in one unit, and the
 * better value marked where the parameter has a better side (better-direction.ts). Pure: the page,
 * the CSV export and the tests build the same table from the frozen models.
 *
 * Alignment. A row is the same figure on two sheets when its template row (`rowId`) and the
 * conditions that say *which* figure it is (port, path, harmonic order, offset, statistic) agree.
 * The operating conditions (band, frequencies, LO drive, temperature) may differ between two parts
 * and the figures are still put side by side, because that is what a designer compares; the line
 * then says which conditions differ and each cell keeps its own conditions — never hidden. Among a
 * sheet's groups of one figure, a group joins the line whose conditions it matches exactly, else the
 * one it shares most operating conditions with, else a line of its own.
 */
import { formatNumber, splitPrefixedUnit } from "../format/quantity";
import { parseConditionsKey, type Conditions } from "../sheet/conditions";
import type { LimitBasis, SheetModel, SpecTableRow } from "../sheet/types";
import { betterDirectionOf, type BetterDirection } from "./better-direction";

export type CompareField = "min" | "typ" | "max";
export const compareFields: readonly CompareField[] = ["min", "typ", "max"];

/** Conditions under which a figure is stated, as opposed to conditions that say which figure it is. */
const OPERATING_CONDITIONS: Record<string, string> = {
  startHz: "band",
  stopHz: "band",
  inputFrequencyHz: "input frequency",
  outputFrequencyHz: "output frequency",
  carrierFrequencyHz: "carrier frequency",
  loPowerDbm: "LO drive",
  temperatureC: "temperature",
};

/** One compared sheet, as the columns and the legend name it. */
export interface CompareSheet {
  /** "kestrine/KDX-2G4/B": the lettered address, unique in a comparison. */
  key: string;
  /** How the columns and the chart legend name it: "KDX-2G4 Rev. B" (with the organization when two parts share a number). */
  label: string;
  organizationName: string;
  partNumber: string;
  letter: string;
  title: string;
  deviceClassLabel: string;
  releasedOn: string;
  standing: "current" | "superseded" | "withdrawn";
  /** The lettered public page of the revision. */
  path: string;
}

export interface CompareCell {
  /** The value in the line's unit, from the figure as the sheet prints it; null when the sheet states none. */
  value: number | null;
  /** The value as shown in the line's unit ("" when none). */
  text: string;
  /** The figure as the sheet itself prints it, when the sheet's unit differs from the line's (converted by SI prefix). */
  stated: { text: string; unit: string } | null;
  /** "Band 1.5–2.5 GHz, T_A 25 °C": the sheet's own conditions for this figure, all of them. */
  conditionsText: string;
  /** Those of the sheet's conditions that the line's other sheets do not share ("Band 1.5–2.5 GHz"); "" when none. */
  ownConditionsText: string;
  basis: LimitBasis;
  /** The better value of the line (ties all marked); false when the line has no better side or nothing to choose. */
  better: boolean;
}

export interface CompareRow {
  /** Unique within the table. */
  id: string;
  /** The aligned figure this line belongs to: its min, typ and max lines share it (numbered in table order). */
  figure: number;
  rowId: string;
  parameter: string;
  label: string;
  symbol: string;
  field: CompareField;
  /** The one unit of every value in the line. */
  unit: string;
  direction: BetterDirection | null;
  /** How many of the sheets state the figure. */
  statedCount: number;
  /** True when every sheet that states the figure states it under the same conditions. */
  conditionsMatch: boolean;
  /** The names of the operating conditions that differ ("band", "temperature"); empty when they match. */
  differingConditions: string[];
  /** The conditions every sheet stating the figure shares, as printed ("Port 1, T_A 25 °C"); "" when none. */
  conditionsText: string;
  /** One per sheet, in the sheets' order; null when that sheet does not state the figure. */
  cells: (CompareCell | null)[];
}

export interface CompareTable {
  sheets: CompareSheet[];
  rows: CompareRow[];
}

export interface CompareInput {
  sheet: CompareSheet;
  model: SheetModel;
}

interface Entry {
  row: SpecTableRow;
  operating: Conditions;
  /** [column label, printed value] of each condition the row states. */
  conditions: [string, string][];
}

interface Line {
  identity: string;
  rowId: string;
  unit: string;
  entries: (Entry | undefined)[];
}

export function buildCompareTable(inputs: readonly CompareInput[]): CompareTable {
  const lines: Line[] = [];
  inputs.forEach(({ model }, sheetIndex) => {
    const entries = model.specifications.rows.map((row) => ({ row, ...describe(row, model) }));
    const pending: Entry[] = [];
    // First the groups whose conditions match a line exactly, then the rest by the most shared conditions.
    for (const entry of entries) {
      const line = lines.find((l) => accepts(l, entry, sheetIndex) && l.entries.some((e) => e?.row.conditionsKey === entry.row.conditionsKey));
      if (line) line.entries[sheetIndex] = entry;
      else pending.push(entry);
    }
    for (const entry of pending) {
      let best: Line | null = null;
      let bestScore = -1;
      for (const line of lines) {
        if (!accepts(line, entry, sheetIndex)) continue;
        const score = sharedConditions(reference(line).operating, entry.operating);
        if (score > bestScore) {
          best = line;
          bestScore = score;
        }
      }
      if (best) {
        best.entries[sheetIndex] = entry;
        continue;
      }
      const line: Line = { identity: identityOf(entry.row), rowId: entry.row.rowId, unit: entry.row.unit, entries: [] };
      line.entries[sheetIndex] = entry;
      // Beside the lines of the same template row, so one parameter's lines stay together.
      const after = lines.findLastIndex((l) => l.rowId === line.rowId);
      lines.splice(after === -1 ? lines.length : after + 1, 0, line);
    }
  });

  const rows: CompareRow[] = [];
  lines.forEach((line, lineIndex) => {
    const first = reference(line);
    const differing = differingConditions(line);
    const shared = sharedConditionPairs(line);
    for (const field of compareFields) {
      const cells = inputs.map((_, i) => {
        const entry = line.entries[i];
        return entry ? cellOf(entry, field, line.unit, shared) : null;
      });
      if (!cells.some((c) => c && c.value !== null)) continue;
      const direction = betterDirectionOf(first.row.parameter);
      markBetter(cells, direction);
      rows.push({
        id: `${line.identity}#${lineIndex}:${field}`,
        figure: lineIndex,
        rowId: line.rowId,
        parameter: first.row.parameter,
        label: first.row.label,
        symbol: first.row.symbol,
        field,
        unit: line.unit,
        direction,
        statedCount: cells.filter((c) => c && c.value !== null).length,
        conditionsMatch: differing.length === 0,
        differingConditions: differing,
        conditionsText: pairsText(first.conditions.filter(([label]) => shared.has(label))),
        cells: cells.map((c) => (c && c.value !== null ? c : null)),
      });
    }
  });
  return { sheets: inputs.map((i) => i.sheet), rows };
}

function describe(row: SpecTableRow, model: SheetModel): { operating: Conditions; conditions: [string, string][] } {
  const all = parseConditionsKey(row.conditionsKey);
  const operating = Object.fromEntries(Object.entries(all).filter(([key]) => key in OPERATING_CONDITIONS));
  const conditions = model.specifications.conditionColumns.flatMap((column, i): [string, string][] => (row.conditions[i] ? [[column.label, row.conditions[i]]] : []));
  return { operating, conditions };
}

/** "Band 1.5–2.5 GHz, T_A 25 °C", as the statistics annex names a group. */
function pairsText(pairs: [string, string][]): string {
  return pairs.map(([label, value]) => `${label} ${value}`).join(", ");
}

/** The condition columns (by label) that every entry of the line states with the same printed value. */
function sharedConditionPairs(line: Line): Set<string> {
  const present = line.entries.filter((e): e is Entry => e !== undefined);
  const [first, ...rest] = present;
  return new Set(
    first.conditions
      .filter(([label, value]) => rest.every((e) => e.conditions.some(([l, v]) => l === label && v === value)))
      .map(([label]) => label),
  );
}

/** The template row and the conditions that name the figure (all but the operating ones). */
function identityOf(row: SpecTableRow): string {
  const all = parseConditionsKey(row.conditionsKey);
  const naming = Object.keys(all)
    .filter((key) => !(key in OPERATING_CONDITIONS))
    .sort()
    .map((key) => `${key}=${String(all[key])}`);
  return [row.rowId, ...naming].join(";");
}

function reference(line: Line): Entry {
  return line.entries.find((e): e is Entry => e !== undefined)!;
}

function accepts(line: Line, entry: Entry, sheetIndex: number): boolean {
  return !line.entries[sheetIndex] && line.identity === identityOf(entry.row) && unitFactor(entry.row.unit, line.unit) !== null;
}

function sharedConditions(a: Conditions, b: Conditions): number {
  return Object.keys(a).filter((key) => key in b && a[key] === b[key]).length;
}

function differingConditions(line: Line): string[] {
  const present = line.entries.filter((e): e is Entry => e !== undefined);
  if (present.length < 2) return [];
  const keys = [...new Set(present.flatMap((e) => Object.keys(e.operating)))];
  const names = keys.filter((key) => present.some((e) => e.operating[key] !== present[0].operating[key])).map((key) => OPERATING_CONDITIONS[key]);
  return [...new Set(names)];
}

/** "deg" and "°" are one unit as the sheets print it. */
function canonicalUnit(unit: string): string {
  return unit === "deg" ? "°" : unit;
}

/**
 * The factor that takes a value in `from` to `to`: 1 for the same unit, the ratio of the SI
 * prefixes for units that differ only by one (mV → V is 1e-3), null for units that do not convert
 * (dB against dBm, or any two logarithmic units: they take no prefix).
 */
export function unitFactor(from: string, to: string): number | null {
  if (canonicalUnit(from) === canonicalUnit(to)) return 1;
  const a = splitPrefixedUnit(from);
  const b = splitPrefixedUnit(to);
  if (!a || !b || a.base !== b.base) return null;
  return a.factor / b.factor;
}

/** The printed figure as a number: U+2212 read as a minus; "" is no figure. */
function printedValue(text: string): number | null {
  if (!text.trim()) return null;
  const value = Number(text.replace(/\u2212/g, "-"));
  return Number.isFinite(value) ? value : null;
}

function significantFigures(text: string): number {
  const digits = text.replace(/[^0-9]/g, "").replace(/^0+/, "");
  return Math.max(1, digits.length);
}

function cellOf(entry: Entry, field: CompareField, unit: string, shared: Set<string>): CompareCell {
  const figure = entry.row[field];
  const printed = printedValue(figure.text);
  const factor = unitFactor(entry.row.unit, unit)!;
  const converted = factor !== 1;
  const value = printed === null ? null : converted ? printed * factor : printed;
  return {
    value,
    // Converted figures keep the figures they were printed with (3.50 ns → 3500 ps, 0.00350 µs).
    text: value === null ? "" : converted ? formatNumber(value, { digits: { maxSignificant: significantFigures(figure.text) } }) : figure.text,
    stated: converted && printed !== null ? { text: figure.text, unit: entry.row.unit } : null,
    conditionsText: pairsText(entry.conditions),
    ownConditionsText: pairsText(entry.conditions.filter(([label]) => !shared.has(label))),
    basis: entry.row.basis,
    better: false,
  };
}

/** Marks the best value of the line (all of them when tied); nothing when there is no direction, one value, or all are equal. */
function markBetter(cells: (CompareCell | null)[], direction: BetterDirection | null): void {
  const stated = cells.filter((c): c is CompareCell => c !== null && c.value !== null);
  if (!direction || stated.length < 2) return;
  const score = (v: number) => (direction === "lower" ? v : direction === "higher" ? -v : Math.abs(v));
  const scores = stated.map((c) => score(c.value!));
  const best = Math.min(...scores);
  if (scores.every((s) => same(s, best))) return;
  stated.forEach((c, i) => {
    c.better = same(scores[i], best);
  });
}

/** Equal as printed: converted values may differ in the last binary digit. */
function same(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
}
