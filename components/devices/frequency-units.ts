import { parseDecimalText } from "@/lib/ingest/number";

/** Frequency entry in the forms: a number and a unit, sent to the server in Hz. */
export const frequencyUnitScale = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 } as const;
export type FrequencyUnit = keyof typeof frequencyUnitScale;
export const frequencyUnitNames = Object.keys(frequencyUnitScale) as FrequencyUnit[];

/** The value in Hz, or undefined for an empty field, or NaN for text that is not a number. */
export function toHz(text: string, unit: FrequencyUnit): number | undefined {
  const value = parseDecimalText(text);
  if (value === undefined) return undefined;
  // Rounded to the hertz so 2.4 GHz is 2400000000, not 2400000000.0000005.
  return Number.isFinite(value) ? Math.round(value * frequencyUnitScale[unit] * 1e3) / 1e3 : Number.NaN;
}
