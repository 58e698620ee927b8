import { formatNumber, formatQuantity, formatScientific, MISSING } from "../format/quantity";
import type { DerivedParameter } from "./types";

/** The CLI prints for a terminal: a hyphen-minus and plain spaces, the figures as everywhere else. */
const PLAIN = { plain: true } as const;
/** Condition values: up to six significant figures, trailing zeros dropped. */
const CONDITION_DIGITS = { digits: { maxSignificant: 6 }, ...PLAIN } as const;

/** 1e9 → "1 GHz", 70e6 → "70 MHz", 12.59 → "12.59 Hz". */
function formatFrequency(hz: number): string {
  return formatQuantity(hz, "Hz", CONDITION_DIGITS);
}

/** The value column: three decimals (one from 1000 up), scientific outside 1e-3 … 1e7. */
function formatValue(value: number | null): string {
  if (value === null) return MISSING;
  const magnitude = Math.abs(value);
  if (magnitude !== 0 && (magnitude < 1e-3 || magnitude >= 1e7)) return formatScientific(value, 3, PLAIN);
  return formatNumber(value, { digits: { decimals: magnitude >= 1000 ? 1 : 3 }, ...PLAIN });
}

export function formatConditions(conditions: Record<string, string | number>): string {
  return Object.entries(conditions)
    .map(([key, value]) => {
      if (typeof value !== "number") return `${key}=${value}`;
      if (key.endsWith("DbmHz")) return `${key}=${formatQuantity(value, "dBm/Hz", CONDITION_DIGITS)}`;
      if (key.endsWith("Hz")) return `${key}=${formatFrequency(value)}`;
      if (key.endsWith("Dbm")) return `${key}=${formatQuantity(value, "dBm", CONDITION_DIGITS)}`;
      return `${key}=${value}`;
    })
    .join(", ");
}

/** An aligned plain-text table: name, conditions, value right-aligned on its decimal point, unit. */
export function formatParameterTable(parameters: readonly DerivedParameter[]): string {
  const rows = parameters.map((p) => ({
    name: p.name,
    conditions: formatConditions(p.conditions),
    value: formatValue(p.value),
    unit: p.unit,
  }));
  const header = { name: "parameter", conditions: "conditions", value: "value", unit: "unit" };
  const all = [header, ...rows];
  const width = (key: keyof typeof header) => Math.max(...all.map((r) => r[key].length));
  const nameWidth = width("name");
  const conditionsWidth = width("conditions");
  const valueWidth = width("value");
  const line = (r: typeof header) =>
    `${r.name.padEnd(nameWidth)}  ${r.conditions.padEnd(conditionsWidth)}  ${r.value.padStart(valueWidth)} ${r.unit}`.trimEnd();
  const rule = "-".repeat(nameWidth + conditionsWidth + valueWidth + width("unit") + 5);
  return [line(header), rule, ...rows.map(line)].join("\n");
}
