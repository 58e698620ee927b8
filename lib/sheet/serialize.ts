import type { SheetModel } from "./types";

/**
 * Stable JSON of a sheet model: object keys sorted at every depth, arrays in
 * their (already deterministic) order, non-finite numbers refused. The server
 * hashes these bytes, so the same model always gives the same digest.
 */
export function serializeSheetModel(model: SheetModel): string {
  return JSON.stringify(sortKeys(model));
}

function sortKeys(value: unknown, path = "$"): unknown {
  if (typeof value === "number" && !Number.isFinite(value)) throw new RangeError(`Non-finite number at ${path}`);
  if (Array.isArray(value)) return value.map((item, i) => sortKeys(item, `${path}[${i}]`));
  if (value !== null && typeof value === "object") {
    const sorted: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) {
      const item = (value as Record<string, unknown>)[key];
      if (item !== undefined) sorted[key] = sortKeys(item, `${path}.${key}`);
    }
    return sorted;
  }
  return value;
}
