/**
 * How many decimals a figure was typed with, so that a limit prints as the engineer wrote it:
 * "9.5" → 1, "10.0" → 1, "10" → 0, "−3.25" → 2, "1.5e-3" → 4 (0.0015), "2e3" → 0.
 * Undefined for blank text or text that is not one decimal number (the form says why elsewhere).
 */
export function countTypedDecimals(text: string): number | undefined {
  const match = /^[+\-\u2212]?(\d*)(?:\.(\d*))?(?:[eE]([+\-\u2212]?\d+))?$/.exec(text.trim());
  if (!match || (!match[1] && !match[2])) return undefined;
  const fraction = match[2]?.length ?? 0;
  const exponent = match[3] ? Number(match[3].replace("\u2212", "-")) : 0;
  return Math.min(15, Math.max(0, fraction - exponent));
}

/** The fewest decimals that print a stored number back exactly (shortest round trip), at most 15: 9.5 → 1, 10 → 0. */
export function shortestDecimals(value: number): number {
  if (!Number.isFinite(value)) return 0;
  const text = String(Math.abs(value));
  const match = /^\d*(?:\.(\d+))?(?:e([+-]\d+))?$/.exec(text);
  if (!match) return 0;
  return Math.min(15, Math.max(0, (match[1]?.length ?? 0) - Number(match[2] ?? 0)));
}
