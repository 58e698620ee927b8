/**
 * The names of the derived parameters, written once. A parameter's own name is its `label` in the engine's
 * catalog (lib/analysis/catalog.ts); what a row, a column or an axis adds to it (the harmonic order, the
 * path, "over temperature", "per port", the statistic over the band) is composed here from structured
 * qualifiers, never typed again. The set page's parameter rows, the sheet's rows (web, PDF, CSV, JSON,
 * through the template), the catalog's columns and compare, and every chart legend and axis that names a
 * parameter (lib/charts seriesLabel, the engine's curves) take their words from here, so the 3rd harmonic's
 * suppression or the LO–RF isolation is called the same wherever it is read. Pure: components import it.
 */
import { parameterCatalog, type ParameterDescription, type ParameterName } from "../analysis/catalog";
import { upperFirst } from "../format/text";

export type { ParameterName };

/** English ordinal suffix: 1st, 2nd, 3rd, 4th, 11th, 12th, 13th, 21st. */
function ordinal(n: number): string {
  const suffix = n % 100 >= 11 && n % 100 <= 13 ? "th" : n % 10 === 1 ? "st" : n % 10 === 2 ? "nd" : n % 10 === 3 ? "rd" : "th";
  return `${n}${suffix}`;
}

/** Order 1 is the fundamental; order n the "nth harmonic". */
export function harmonicOrderName(order: number): string {
  return order === 1 ? "fundamental" : `${ordinal(order)} harmonic`;
}

/** A harmonic-suppression figure's name: "Fundamental suppression", "3rd harmonic suppression". */
export function harmonicSuppressionLabel(order: number): string {
  return upperFirst(`${harmonicOrderName(order)} suppression`);
}

/** A parameter's own name: the catalog's label ("Conversion loss", "Input IP3"), or the machine name of one it does not know. */
export function parameterName(parameter: string): string {
  return (parameterCatalog as Record<string, ParameterDescription>)[parameter]?.label ?? parameter;
}

/**
 * The words a row adds after its parameter's name, each after a comma, in the order given: the condition
 * it is stated per ("per port"), the statistic it takes over the band, the reference it is counted from.
 * A new phrase is one entry here.
 */
export const nameQualifierWords = {
  "per-port": "per port",
  "highest-in-band": "highest in band",
  "median-over-band": "median over band",
  "from-nominal": "from nominal",
} as const;
export type NameQualifier = keyof typeof nameQualifierWords;

/** What a name is composed of besides the parameter. `order` and `path` are the engine's own conditions of the same names. */
export interface NameParts {
  /** Harmonic order of a suppression figure (the engine's `order` condition): 1 is the fundamental. */
  order?: number;
  /** A mixer's isolation path ("LO-RF") or an S-parameter ("S21"), as the engine's `path` condition names it. */
  path?: string;
  /** Each unit's worst figure over the temperatures it was measured at (a row's `overTemperature`). */
  overTemperature?: boolean;
  qualifiers?: readonly NameQualifier[];
}

/** "S21" → ", port 1 to 2 (S21)"; "LO-RF" → " LO–RF" (en dash between the ports, as the trade writes it). */
function pathWords(path: string): string {
  const s = /^S(\d)(\d)$/.exec(path);
  if (s) return `, port ${s[2]} to ${s[1]} (${path})`;
  return ` ${path.replace(/-/g, "\u2013")}`;
}

/**
 * A figure's full name from its parameter and parts: "Conversion loss over temperature, highest in band",
 * "3rd harmonic suppression", "Isolation LO–RF", "Insertion loss, port 1 to 2 (S21)", "Optimum drive, per port".
 */
export function composeParameterName(parameter: string, parts: NameParts = {}): string {
  const base = parameter === "harmonic-suppression" && parts.order !== undefined ? harmonicSuppressionLabel(parts.order) : parameterName(parameter);
  const path = parts.path ? pathWords(parts.path) : "";
  const overTemperature = parts.overTemperature ? " over temperature" : "";
  const qualifiers = (parts.qualifiers ?? []).map((q) => `, ${nameQualifierWords[q]}`).join("");
  return `${base}${path}${overTemperature}${qualifiers}`;
}

/** The engine conditions a name is composed of (the set page leaves them out of its conditions column). */
export const nameConditionKeys = ["order", "path"] as const;

/** The parts of a name that a derived figure's (or a row's `match`) conditions carry: its harmonic order and its path. */
export function namePartsOfConditions(conditions: Readonly<Record<string, string | number>> = {}): Pick<NameParts, "order" | "path"> {
  return {
    ...(typeof conditions.order === "number" ? { order: conditions.order } : {}),
    ...(typeof conditions.path === "string" ? { path: conditions.path } : {}),
  };
}

/** A derived figure's name as the set page and the CLI print it: the parameter with the order and path its conditions state. */
export function derivedParameterName(parameter: string, conditions?: Readonly<Record<string, string | number>>): string {
  return composeParameterName(parameter, namePartsOfConditions(conditions));
}

/**
 * A specification row's name, from its parameter, the order and path its `match` holds, whether it is over
 * temperature, and its own qualifiers: the sheet (web, PDF, CSV, JSON) and the catalog print this, and it
 * begins with the set page's name of the figures the row is made of.
 */
export function specRowName(row: {
  parameter: string;
  match?: Readonly<Record<string, string | number>>;
  overTemperature?: "max" | "min";
  qualifiers?: readonly NameQualifier[];
}): string {
  return composeParameterName(row.parameter, { ...namePartsOfConditions(row.match), overTemperature: row.overTemperature !== undefined, qualifiers: row.qualifiers });
}

