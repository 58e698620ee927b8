import type { LimitBasis } from "@/lib/domain/sheets";
import type { SpecLimitInput, StatisticsGroup } from "@/lib/sheet/types";
import { countTypedDecimals } from "@/lib/format/typed-decimals";
import { figureInputText, parseFigure } from "./parse-figure";

export type LimitDraft = { min: string; typ: string; max: string; basis: LimitBasis; footnote: string };

/** A statistics group's identity and words, plus the group itself when the data fill it. */
export type EditorRow = Pick<StatisticsGroup, "parameter" | "conditionsKey" | "label" | "symbol" | "unit" | "conditionsText" | "rowId"> & {
  key: string;
  group: StatisticsGroup | null;
};

export const limitKey = (parameter: string, conditionsKey: string) => `${parameter}|${conditionsKey}`;

export function draftOf(limit: SpecLimitInput | undefined, defaultBasis: LimitBasis): LimitDraft {
  return {
    min: figureInputText(limit?.min, limit?.decimals?.min),
    typ: figureInputText(limit?.typ, limit?.decimals?.typ),
    max: figureInputText(limit?.max, limit?.decimals?.max),
    basis: limit?.basis ?? defaultBasis,
    footnote: limit?.footnote ?? "",
  };
}

export const hasValue = (d: LimitDraft) => d.min.trim() !== "" || d.typ.trim() !== "" || d.max.trim() !== "";

/** Equal as saved: whitespace aside, and the basis of a line with no figure does not count. */
export const sameDraft = (a: LimitDraft, b: LimitDraft) =>
  a.min.trim() === b.min.trim() && a.typ.trim() === b.typ.trim() && a.max.trim() === b.max.trim() && a.footnote.trim() === b.footnote.trim() && (a.basis === b.basis || !hasValue(a));

/** One line per statistics group, then the saved limits whose data are gone. */
export function buildEditorRows(groups: StatisticsGroup[], limits: SpecLimitInput[]): EditorRow[] {
  const fromGroups: EditorRow[] = groups.map((g) => ({
    key: limitKey(g.parameter, g.conditionsKey),
    parameter: g.parameter,
    conditionsKey: g.conditionsKey,
    label: g.label,
    symbol: g.symbol,
    unit: g.unit,
    conditionsText: g.conditionsText,
    rowId: g.rowId,
    group: g,
  }));
  const offered = new Set(fromGroups.map((r) => r.key));
  // Limits stated earlier whose data are gone still belong to the saved set: shown, so nothing is dropped unseen.
  const orphans: EditorRow[] = limits
    .filter((l) => !offered.has(limitKey(l.parameter, l.conditionsKey)))
    .map((l) => ({
      key: limitKey(l.parameter, l.conditionsKey),
      parameter: l.parameter,
      conditionsKey: l.conditionsKey,
      label: l.parameter,
      symbol: "",
      unit: l.unit,
      conditionsText: l.conditionsKey || "no conditions",
      rowId: "without-data",
      group: null,
    }));
  return [...fromGroups, ...orphans];
}

/** The heading above each line: the parameter's name where a new template row starts, else null. */
export function rowHeadings(rows: EditorRow[]): (string | null)[] {
  return rows.map((row, i) =>
    i > 0 && rows[i - 1].rowId === row.rowId ? null : row.group ? `${row.label} (${row.symbol})` : "Limits without data",
  );
}

export interface CheckedLimits {
  /** Problems by row key; empty when every line can be sent. */
  errors: Record<string, string[]>;
  /** The limits to send, and the row each one came from (same index). */
  limits: SpecLimitInput[];
  sentRows: EditorRow[];
}

/** Each line's figures parsed and checked; the lines with a figure become the limits to save. */
export function checkLimitDrafts(rows: EditorRow[], draftFor: (row: EditorRow) => LimitDraft): CheckedLimits {
  const errors: Record<string, string[]> = {};
  const sentRows: EditorRow[] = [];
  const limits: SpecLimitInput[] = [];
  for (const row of rows) {
    const d = draftFor(row);
    const min = parseFigure(d.min);
    const typ = parseFigure(d.typ);
    const max = parseFigure(d.max);
    const problems: string[] = [];
    if (min.error) problems.push(`Min: ${min.error}.`);
    if (typ.error) problems.push(`Typ: ${typ.error}.`);
    if (max.error) problems.push(`Max: ${max.error}.`);
    if (!hasValue(d)) {
      if (d.footnote.trim()) problems.push("A footnote needs a limit: give at least one of min, typ, max, or clear the footnote.");
    } else if (min.value !== undefined && max.value !== undefined && min.value > max.value) {
      problems.push("Min must not exceed max.");
    }
    if (problems.length > 0) {
      errors[row.key] = problems;
      continue;
    }
    if (!hasValue(d)) continue;
    sentRows.push(row);
    const decimals = {
      ...(min.value !== undefined ? { min: countTypedDecimals(d.min) } : {}),
      ...(typ.value !== undefined ? { typ: countTypedDecimals(d.typ) } : {}),
      ...(max.value !== undefined ? { max: countTypedDecimals(d.max) } : {}),
    };
    limits.push({
      parameter: row.parameter,
      conditionsKey: row.conditionsKey,
      ...(min.value !== undefined ? { min: min.value } : {}),
      ...(typ.value !== undefined ? { typ: typ.value } : {}),
      ...(max.value !== undefined ? { max: max.value } : {}),
      unit: row.unit,
      basis: d.basis,
      ...(d.footnote.trim() ? { footnote: d.footnote.trim() } : {}),
      decimals,
    });
  }
  return { errors, limits, sentRows };
}

/** The API's field errors ("limits.3.max") put back on the lines they came from. */
export function rowErrorsFromFields(fields: { field: string; message: string }[], sentRows: EditorRow[]): Record<string, string[]> {
  const byRow: Record<string, string[]> = {};
  for (const f of fields) {
    const match = /^limits\.(\d+)(?:\.(\w+))?/.exec(f.field);
    const row = match ? sentRows[Number(match[1])] : undefined;
    if (row) (byRow[row.key] ??= []).push(`${match?.[2] ? `${match[2]}: ` : ""}${f.message}`);
  }
  return byRow;
}

/**
 * Each line's draft as saved: its stated limit, else empty figures with the basis the sheet
 * shows for that group (characterization for a line without data).
 */
export function initialLimitDrafts(rows: EditorRow[], limits: SpecLimitInput[], specRows: { groupId: string; basis: LimitBasis }[]): Record<string, LimitDraft> {
  const byKey = new Map(limits.map((l) => [limitKey(l.parameter, l.conditionsKey), l]));
  const basisOf = defaultBasisLookup(specRows);
  return Object.fromEntries(rows.map((r) => [r.key, draftOf(byKey.get(r.key), basisOf(r))]));
}

export function defaultBasisLookup(specRows: { groupId: string; basis: LimitBasis }[]): (row: EditorRow) => LimitBasis {
  const byGroup = new Map(specRows.map((r) => [r.groupId, r.basis]));
  return (row) => (row.group ? (byGroup.get(row.group.groupId) ?? "characterization") : "characterization");
}
