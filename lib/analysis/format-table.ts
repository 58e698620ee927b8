import type { DerivedParameter } from "./types";

const SI_PREFIXES: [number, string][] = [
  [1e9, "G"],
  [1e6, "M"],
  [1e3, "k"],
];

/** 1e9 → "1 GHz", 70e6 → "70 MHz", 12.59 → "12.59 Hz". */
export function formatFrequency(hz: number): string {
  for (const [scale, prefix] of SI_PREFIXES) {
    if (Math.abs(hz) >= scale) return `${trimNumber(hz / scale)} ${prefix}Hz`;
  }
  return `${trimNumber(hz)} Hz`;
}

function trimNumber(value: number): string {
  return String(Number(value.toPrecision(6)));
}

export function formatValue(value: number | null): string {
  if (value === null) return "—";
  const magnitude = Math.abs(value);
  if (magnitude !== 0 && (magnitude < 1e-3 || magnitude >= 1e7)) return value.toExponential(3);
  return value.toFixed(magnitude >= 1000 ? 1 : 3);
}

export function formatConditions(conditions: Record<string, string | number>): string {
  return Object.entries(conditions)
    .map(([key, value]) => {
      if (typeof value !== "number") return `${key}=${value}`;
      if (key.endsWith("DbmHz")) return `${key}=${trimNumber(value)} dBm/Hz`;
      if (key.endsWith("Hz")) return `${key}=${formatFrequency(value)}`;
      if (key.endsWith("Dbm")) return `${key}=${trimNumber(value)} dBm`;
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
