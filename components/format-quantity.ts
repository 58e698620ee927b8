/**
 * Display formatting for figures: a true minus sign (U+2212), an en dash in ranges,
 * no digit grouping (engineers read "2500 MHz", not "2,500 MHz").
 */
const MINUS = "\u2212";

export function formatNumber(value: number, options: { signed?: boolean; maxDecimals?: number } = {}): string {
  const { signed = false, maxDecimals = 3 } = options;
  const text = new Intl.NumberFormat("en-US", { maximumFractionDigits: maxDecimals, useGrouping: false }).format(Math.abs(value));
  if (value < 0 && text !== "0") return `${MINUS}${text}`;
  return signed && value > 0 ? `+${text}` : text;
}

const frequencyUnits = [
  { unit: "GHz", scale: 1e9 },
  { unit: "MHz", scale: 1e6 },
  { unit: "kHz", scale: 1e3 },
  { unit: "Hz", scale: 1 },
] as const;

function pickFrequencyUnit(hz: number) {
  return frequencyUnits.find((u) => Math.abs(hz) >= u.scale) ?? frequencyUnits[frequencyUnits.length - 1];
}

export function formatFrequency(hz: number): { value: string; unit: string } {
  const { unit, scale } = pickFrequencyUnit(hz);
  return { value: formatNumber(hz / scale), unit };
}

/**
 * One unit for both ends, chosen from the lower end unless that would print a long
 * integer: 0.5–1.5 GHz, 10–3000 MHz, 1.7–2.3 GHz.
 */
export function formatFrequencyRange(range: { min: number; max: number }): { value: string; unit: string } {
  let choice = pickFrequencyUnit(range.min);
  const upper = pickFrequencyUnit(range.max);
  if (upper.scale > choice.scale && range.min / upper.scale >= 0.5) choice = upper;
  return { value: `${formatNumber(range.min / choice.scale)}\u2013${formatNumber(range.max / choice.scale)}`, unit: choice.unit };
}

export function formatDate(iso: string): string {
  // ISO 8601 dates, as on a datasheet's revision block; UTC so server and browser agree.
  return new Date(iso).toISOString().slice(0, 10);
}

export function formatDateTime(iso: string): string {
  const d = new Date(iso).toISOString();
  return `${d.slice(0, 10)} ${d.slice(11, 16)} UTC`;
}
