/**
 * The catalog's search as it lives in the URL: parse a query string into a checked query, and
 * write a query back as a query string (the same for the /catalog page and GET /api/v1/sheets).
 * Pure: numbers go through the engine's strict decimal reader, units through lib/format.
 *
 *   ?q=doubler&class=frequency-multiplier&org=kestrel-rf&covers=2.4 GHz
 *    &f=conversion-loss.max<=10 dB&f=drive<=+13 dBm&rev=current&sort=conversion-loss.max&dir=asc&page=2
 *
 * A condition `f` is `<key>[.<min|typ|max>]<op><value>[ unit]`, op `<=` or `>=` (also `≤`, `≥`).
 * On a specification parameter it holds when every condition group the sheet states for that field
 * meets it (the worst case: the highest max for `<=`, the lowest min for `>=`); without a field,
 * `<=` reads the max and `>=` the min, as an engineer reads "CL ≤ 10 dB".
 */
import { deviceClasses, deviceClassLabels, type DeviceClass } from "../domain/device-classes";
import { parameterName, specRowName } from "../domain/parameter-names";
import { parseDecimalText } from "../ingest/number";
import { splitPrefixedUnit, takesPrefix } from "../format";
import { findSheetTemplate } from "../../templates";

export const catalogPageSize = 25;
export const catalogMaxPageSize = 100;
const MAX_TEXT = 200;
const MAX_CONDITIONS = 8;
const MAX_PAGE = 10_000;
/** What the parser accepts at most: characters of a text field, conditions, page number (the API's description cites them). */
export const catalogQueryLimits = { textCharacters: MAX_TEXT, conditions: MAX_CONDITIONS, page: MAX_PAGE } as const;

export type SpecField = "min" | "typ" | "max";
export const specFields: readonly SpecField[] = ["min", "typ", "max"];

/** A searchable figure: a spec parameter (all rows of that parameter), one template row, or a per-sheet fact. */
export type CatalogParameter = {
  key: string;
  /** The parameter's name, or the row's (lib/domain/parameter-names.ts). */
  label: string;
  /** The symbol the sheet prints beside it (its first row's, for a parameter of several rows). */
  symbol?: string;
  unit: string;
  /** Which column of released_spec_values names it, or "fact" for a per-revision column of released_sheets. */
  column: "parameter" | "row_id" | "fact";
  /** The device classes whose sheets state it. */
  deviceClasses: DeviceClass[];
};

/** The per-revision facts a condition may name (columns of released_sheets). */
export const catalogFacts = {
  drive: { label: "Drive level", unit: "dBm", column: "drive_dbm" },
} as const;
export type CatalogFact = keyof typeof catalogFacts;

let parameters: Map<string, CatalogParameter> | null = null;

/**
 * Every figure the templates of this build define: each analysis parameter (conversion loss of a
 * multiplier and of a mixer alike), each row whose id is not a parameter name (fundamental
 * suppression, a harmonic-suppression row), and the per-sheet facts.
 */
export function catalogParameters(): Map<string, CatalogParameter> {
  if (parameters) return parameters;
  const found = new Map<string, CatalogParameter>();
  const add = (entry: Omit<CatalogParameter, "deviceClasses">, deviceClass: DeviceClass) => {
    const known = found.get(entry.key);
    if (known) {
      if (!known.deviceClasses.includes(deviceClass)) known.deviceClasses.push(deviceClass);
    } else found.set(entry.key, { ...entry, deviceClasses: [deviceClass] });
  };
  const parameterNames = new Set<string>();
  for (const deviceClass of deviceClasses) {
    for (const row of findSheetTemplate(deviceClass)?.specifications.rows ?? []) parameterNames.add(row.parameter);
  }
  for (const deviceClass of deviceClasses) {
    for (const row of findSheetTemplate(deviceClass)?.specifications.rows ?? []) {
      add({ key: row.parameter, label: parameterName(row.parameter), symbol: row.symbol, unit: row.unit, column: "parameter" }, deviceClass);
      if (!parameterNames.has(row.id)) add({ key: row.id, label: specRowName(row), symbol: row.symbol, unit: row.unit, column: "row_id" }, deviceClass);
    }
  }
  for (const [key, fact] of Object.entries(catalogFacts)) {
    found.set(key, { key, label: fact.label, unit: fact.unit, column: "fact", deviceClasses: [...deviceClasses] });
  }
  parameters = new Map([...found.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)));
  return parameters;
}

export type CatalogCondition = {
  key: string;
  /** Null for a per-sheet fact. */
  field: SpecField | null;
  op: "le" | "ge";
  /** In the parameter's own unit (Hz for a frequency, as the table stores it). */
  value: number;
  /** The value as typed, trimmed ("+13 dBm"): what the URL keeps. */
  typed: string;
};

export type CatalogSortKey = "part" | "released" | `${string}.${SpecField}` | CatalogFact;

export type CatalogQuery = {
  text: string;
  deviceClass: DeviceClass | null;
  organization: string | null;
  /** A frequency the input or the output band must contain, Hz; `coversTyped` as typed. */
  coversHz: number | null;
  coversTyped: string;
  conditions: CatalogCondition[];
  revisions: "current" | "all";
  sort: CatalogSortKey;
  dir: "asc" | "desc";
  page: number;
  pageSize: number;
};

export const emptyCatalogQuery: CatalogQuery = {
  text: "",
  deviceClass: null,
  organization: null,
  coversHz: null,
  coversTyped: "",
  conditions: [],
  revisions: "current",
  sort: "part",
  dir: "asc",
  page: 1,
  pageSize: catalogPageSize,
};

export type CatalogQueryIssue = { field: string; message: string };
export type CatalogQueryResult = { ok: true; query: CatalogQuery } | { ok: false; issues: CatalogQueryIssue[] };

type Params = { get(name: string): string | null; getAll(name: string): string[] };

/** Reads a query string (URLSearchParams, or a page's searchParams object). Every problem names its field. */
export function parseCatalogQuery(input: Params | Record<string, string | string[] | undefined>): CatalogQueryResult {
  const params = toParams(input);
  const issues: CatalogQueryIssue[] = [];
  const query: CatalogQuery = { ...emptyCatalogQuery, conditions: [] };
  const one = (name: string): string => {
    const all = params.getAll(name);
    if (all.length > 1) issues.push({ field: name, message: `${name} may be given once.` });
    const value = (all[0] ?? "").trim();
    if (value.length > MAX_TEXT) {
      issues.push({ field: name, message: `${name} is ${value.length} characters long; at most ${MAX_TEXT} are read.` });
      return "";
    }
    return value;
  };

  query.text = one("q");

  const deviceClass = one("class");
  if (deviceClass) {
    if ((deviceClasses as readonly string[]).includes(deviceClass)) query.deviceClass = deviceClass as DeviceClass;
    else issues.push({ field: "class", message: `Unknown device class "${clip(deviceClass)}"; known: ${deviceClasses.join(", ")}.` });
  }

  const organization = one("org");
  if (organization) {
    if (/^[a-z0-9][a-z0-9-]{0,63}$/.test(organization)) query.organization = organization;
    else issues.push({ field: "org", message: `"${clip(organization)}" is not an organization's short name (lower-case letters, digits and hyphens).` });
  }

  const covers = one("covers");
  if (covers) {
    const read = readQuantity(covers, "Hz", { unitRequired: true });
    if (read.ok) {
      if (read.value > 0) {
        query.coversHz = read.value;
        query.coversTyped = covers;
      } else issues.push({ field: "covers", message: "covers: a frequency above zero, such as 2.4 GHz." });
    } else issues.push({ field: "covers", message: `covers: ${read.message}` });
  }

  const conditions = params.getAll("f").map((f) => f.trim()).filter((f) => f !== "");
  if (conditions.length > MAX_CONDITIONS) issues.push({ field: "f", message: `At most ${MAX_CONDITIONS} conditions; found ${conditions.length}.` });
  conditions.slice(0, MAX_CONDITIONS).forEach((text, i) => {
    const parsed = parseCondition(text);
    if (parsed.ok) query.conditions.push(parsed.condition);
    else issues.push({ field: `f[${i}]`, message: parsed.message });
  });
  issues.push(...invertedRanges(query.conditions));

  const revisions = one("rev");
  if (revisions === "all" || revisions === "current") query.revisions = revisions;
  else if (revisions) issues.push({ field: "rev", message: `rev is "current" (the default) or "all", not "${clip(revisions)}".` });

  const sort = one("sort");
  if (sort) {
    if (isSortKey(sort)) query.sort = sort;
    else issues.push({ field: "sort", message: `Cannot sort by "${clip(sort)}": use part, released, drive or <parameter>.<min|typ|max> such as conversion-loss.max.` });
  }
  const dir = one("dir");
  if (dir === "asc" || dir === "desc") query.dir = dir;
  else if (dir) issues.push({ field: "dir", message: `dir is "asc" or "desc", not "${clip(dir)}".` });

  const page = one("page");
  if (page) {
    const n = /^[0-9]{1,6}$/.test(page) ? Number(page) : NaN;
    if (Number.isInteger(n) && n >= 1 && n <= MAX_PAGE) query.page = n;
    else issues.push({ field: "page", message: `page is a whole number from 1 to ${MAX_PAGE}, not "${clip(page)}".` });
  }
  const limit = one("limit");
  if (limit) {
    const n = /^[0-9]{1,4}$/.test(limit) ? Number(limit) : NaN;
    if (Number.isInteger(n) && n >= 1 && n <= catalogMaxPageSize) query.pageSize = n;
    else issues.push({ field: "limit", message: `limit is a whole number from 1 to ${catalogMaxPageSize}, not "${clip(limit)}".` });
  }

  return issues.length ? { ok: false, issues } : { ok: true, query };
}

/** The query string of a query, defaults left out, in a fixed order; parseCatalogQuery reads it back to the same query. */
export function serializeCatalogQuery(query: CatalogQuery): string {
  const out = new URLSearchParams();
  if (query.text) out.set("q", query.text);
  if (query.deviceClass) out.set("class", query.deviceClass);
  if (query.organization) out.set("org", query.organization);
  if (query.coversHz !== null) out.set("covers", query.coversTyped);
  for (const c of query.conditions) out.append("f", conditionText(c));
  if (query.revisions !== "current") out.set("rev", query.revisions);
  if (query.sort !== "part") out.set("sort", query.sort);
  if (query.dir !== "asc") out.set("dir", query.dir);
  if (query.page !== 1) out.set("page", String(query.page));
  if (query.pageSize !== catalogPageSize) out.set("limit", String(query.pageSize));
  return out.toString();
}

/** `conversion-loss.max<=10 dB`, `drive<=+13 dBm`. */
export function conditionText(c: CatalogCondition): string {
  return `${c.key}${c.field ? `.${c.field}` : ""}${c.op === "le" ? "<=" : ">="}${c.typed}`;
}

export function parseCondition(text: string): { ok: true; condition: CatalogCondition } | { ok: false; message: string } {
  if (text.length > MAX_TEXT) return { ok: false, message: `A condition is at most ${MAX_TEXT} characters; this one has ${text.length}.` };
  const normalized = text.replace(/≤/g, "<=").replace(/≥/g, ">=");
  const at = normalized.search(/<=|>=/);
  if (at < 0) return { ok: false, message: `"${clip(text)}" has no <= or >=: write e.g. conversion-loss.max<=10 dB.` };
  const left = normalized.slice(0, at).trim();
  const op = normalized.slice(at, at + 2) === "<=" ? "le" : "ge";
  const typed = normalized.slice(at + 2).trim();
  const [key, field, extra] = left.split(".");
  if (extra !== undefined) return { ok: false, message: `"${clip(left)}" is not a parameter name.` };
  const parameter = catalogParameters().get(key);
  if (!parameter) return { ok: false, message: `Unknown parameter "${clip(key)}"; known: ${[...catalogParameters().keys()].join(", ")}.` };
  let specField: SpecField | null = null;
  if (parameter.column === "fact") {
    if (field !== undefined) return { ok: false, message: `${parameter.label} is one figure per sheet: write ${key}${op === "le" ? "<=" : ">="}… without .${clip(field)}.` };
  } else if (field === undefined) {
    specField = op === "le" ? "max" : "min";
  } else if ((specFields as readonly string[]).includes(field)) {
    specField = field as SpecField;
  } else return { ok: false, message: `"${clip(field)}" is not min, typ or max.` };
  if (!typed) return { ok: false, message: `${parameter.label}: a value is missing after the comparison.` };
  const read = readQuantity(typed, parameter.unit, { unitRequired: false });
  if (!read.ok) return { ok: false, message: `${parameter.label}: ${read.message}` };
  return { ok: true, condition: { key, field: specField, op, value: read.value, typed } };
}

/**
 * A value with an optional unit, as typed ("2.4 GHz", "2400MHz", "+13 dBm", "1.5:1", "−3 dB"),
 * in `unit`. A prefix converts only within the unit (GHz → Hz); any other unit is refused.
 */
export function readQuantity(text: string, unit: string, options: { unitRequired: boolean }): { ok: true; value: number } | { ok: false; message: string } {
  const t = text.trim();
  const units = acceptedUnits(unit);
  let numberText = t;
  let factor: number | null = null;
  for (const u of units) {
    if (t.endsWith(u.unit) && t.length > u.unit.length) {
      numberText = t.slice(0, t.length - u.unit.length).trim();
      factor = u.factor;
      break;
    }
  }
  if (factor === null) {
    const trailing = /[^0-9.\s]+$/.exec(t)?.[0];
    if (trailing && /[A-Za-zµΩ°%:/]/.test(trailing)) {
      return { ok: false, message: `unknown unit "${clip(trailing)}"; use ${units.map((u) => u.unit).join(", ")}.` };
    }
    if (options.unitRequired) return { ok: false, message: `"${clip(t)}" needs a unit: ${units.map((u) => u.unit).join(", ")}.` };
    factor = 1;
  }
  const value = parseDecimalText(numberText);
  if (value === undefined || !Number.isFinite(value)) return { ok: false, message: `"${clip(numberText)}" is not a decimal number (such as 10, -3.5 or +13).` };
  return { ok: true, value: value * factor };
}

/** The unit itself and, for a unit that takes a prefix, its prefixed forms, longest first. */
function acceptedUnits(unit: string): { unit: string; factor: number }[] {
  const out = [{ unit, factor: 1 }];
  if (takesPrefix(unit)) {
    for (const prefix of ["T", "G", "M", "k", "m", "µ", "u", "n", "p"]) {
      const split = splitPrefixedUnit(`${prefix === "u" ? "µ" : prefix}${unit}`);
      if (split && split.base === unit) out.push({ unit: `${prefix}${unit}`, factor: split.factor });
    }
  }
  return out.sort((a, b) => b.unit.length - a.unit.length);
}

function invertedRanges(conditions: CatalogCondition[]): CatalogQueryIssue[] {
  const issues: CatalogQueryIssue[] = [];
  conditions.forEach((lower, i) => {
    if (lower.op !== "ge") return;
    conditions.forEach((upper, j) => {
      if (upper.op !== "le" || upper.key !== lower.key || upper.field !== lower.field) return;
      if (lower.value > upper.value) {
        issues.push({
          field: `f[${Math.max(i, j)}]`,
          message: `${conditionText(lower)} and ${conditionText(upper)} leave nothing between them: the lower bound is above the upper one.`,
        });
      }
    });
  });
  return issues;
}

function isSortKey(sort: string): sort is CatalogSortKey {
  if (sort === "part" || sort === "released") return true;
  const [key, field, extra] = sort.split(".");
  const parameter = catalogParameters().get(key);
  if (!parameter || extra !== undefined) return false;
  if (parameter.column === "fact") return field === undefined;
  return field !== undefined && (specFields as readonly string[]).includes(field);
}

function toParams(input: Params | Record<string, string | string[] | undefined>): Params {
  if (typeof (input as Params).getAll === "function") return input as Params;
  const record = input as Record<string, string | string[] | undefined>;
  const all = (name: string) => {
    const v = record[name];
    return v === undefined ? [] : Array.isArray(v) ? v : [v];
  };
  return { get: (name) => all(name)[0] ?? null, getAll: all };
}

function clip(text: string): string {
  return text.length > 40 ? `${text.slice(0, 40)}…` : text;
}

export function catalogClassLabel(deviceClass: DeviceClass): string {
  return deviceClassLabels[deviceClass];
}
