/**
 * A number typed by an engineer: accepts the true minus sign (U+2212) that the
 * sheet prints, so a figure copied from the sheet can be pasted back.
 */
export function parseFigure(text: string): { value: number | undefined; error?: string } {
  const trimmed = text.trim().replace(/\u2212/g, "-").replace(/^\+/, "");
  if (trimmed === "") return { value: undefined };
  if (!/^-?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(trimmed)) return { value: undefined, error: "not a number" };
  const value = Number(trimmed);
  return Number.isFinite(value) ? { value } : { value: undefined, error: "not a finite number" };
}

/** A stored number shown in an input: plain ASCII so it can be edited and sent back unchanged. */
export function figureInputText(value: number | null | undefined): string {
  return value === null || value === undefined ? "" : String(value);
}
