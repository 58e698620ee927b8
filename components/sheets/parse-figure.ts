import { parseDecimalText } from "@/lib/ingest/number";

/**
 * A number typed by an engineer: accepts the true minus sign (U+2212) that the
 * sheet prints, so a figure copied from the sheet can be pasted back.
 */
export function parseFigure(text: string): { value: number | undefined; error?: string } {
  const value = parseDecimalText(text);
  if (value === undefined) return { value: undefined };
  return Number.isNaN(value) ? { value: undefined, error: "not a number" } : { value };
}

/** A stored number shown in an input as it was typed (10.0 stays "10.0"): plain ASCII so it can be edited and sent back unchanged. */
export function figureInputText(value: number | null | undefined, typedDecimals?: number): string {
  if (value === null || value === undefined) return "";
  return typedDecimals !== undefined && Number(value.toFixed(typedDecimals)) === value ? value.toFixed(typedDecimals) : String(value);
}
