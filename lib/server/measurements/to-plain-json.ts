/** Typed arrays become plain arrays, so parsed data stores as JSON and reads back the same. */
export function toPlainJson(value: unknown): unknown {
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) return Array.from(value as unknown as ArrayLike<number>);
  if (Array.isArray(value)) return value.map(toPlainJson);
  if (value && typeof value === "object") {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, toPlainJson(v)]));
  }
  return value;
}
