import type { ConditionColumn, ConditionSource } from "../../templates/types";
import { formatBand, formatNumber, formatQuantity, formatRange } from "../format/quantity";
import { formatDrive, formatTemperature, formatTemperatureRange } from "./format";

export type Conditions = Record<string, string | number>;

/**
 * The stable name of a condition group: "key=value" pairs sorted by key, joined
 * by ";". Numbers are written in plain JavaScript form (2000000000, 25), so
 * limits stored in the database keep matching the same group.
 */
export function makeConditionsKey(conditions: Conditions): string {
  return Object.keys(conditions)
    .sort()
    .map((key) => `${key}=${String(conditions[key])}`)
    .join(";");
}

export function parseConditionsKey(conditionsKey: string): Conditions {
  const conditions: Conditions = {};
  if (!conditionsKey) return conditions;
  for (const pair of conditionsKey.split(";")) {
    const at = pair.indexOf("=");
    if (at <= 0) continue;
    const raw = pair.slice(at + 1);
    const numeric = Number(raw);
    conditions[pair.slice(0, at)] = raw.trim() !== "" && Number.isFinite(numeric) ? numeric : raw;
  }
  return conditions;
}

/** A condition cell: the first of the column's sources present in `conditions` that serves the row `rowId`. */
export function formatConditionCell(column: ConditionColumn, conditions: Conditions, rowId?: string): string {
  for (const source of column.sources) {
    if (source.rows && (rowId === undefined || !source.rows.includes(rowId))) continue;
    if (source.exceptRows && rowId !== undefined && source.exceptRows.includes(rowId)) continue;
    const text = formatSource(source, conditions);
    // The suffix belongs to a number ("+10 dBm per port"), not to a word such as "optimum".
    if (text !== null) return source.suffix && typeof conditions[source.key] === "number" ? `${text} ${source.suffix}` : text;
  }
  return "";
}

function formatSource(source: ConditionSource, conditions: Conditions): string | null {
  const value = conditions[source.key];
  if (value === undefined) return null;
  switch (source.format) {
    case "frequency":
      return typeof value === "number" ? formatQuantity(value, "Hz") : String(value);
    case "frequency-range": {
      const stop = source.stopKey ? conditions[source.stopKey] : undefined;
      if (typeof value === "number" && typeof stop === "number") return formatRange(value, stop, "Hz");
      return typeof value === "number" ? formatQuantity(value, "Hz") : String(value);
    }
    case "frequency-band": {
      const stop = source.stopKey ? conditions[source.stopKey] : undefined;
      if (typeof value === "number" && typeof stop === "number") return formatBand(value, stop, "Hz");
      return typeof value === "number" ? formatQuantity(value, "Hz") : String(value);
    }
    case "power-dbm":
      return typeof value === "number" ? formatDrive(value) : String(value);
    case "temperature-c":
      return typeof value === "number" ? formatTemperature(value) : String(value);
    case "temperature-range": {
      const stop = source.stopKey ? conditions[source.stopKey] : undefined;
      if (typeof value === "number" && typeof stop === "number") return formatTemperatureRange(value, stop);
      return typeof value === "number" ? formatTemperature(value) : String(value);
    }
    case "port":
      return String(value);
    case "text":
      return typeof value === "number" ? formatNumber(value) : String(value);
  }
}
