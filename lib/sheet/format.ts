/**
 * Figures as the sheet prints them: a true minus (U+2212), no digit grouping,
 * a fixed number of decimals per parameter, frequencies in the largest unit
 * that keeps them above one.
 */

import type { FormattedValue } from "./types";

export const MINUS = "\u2212";
export const EN_DASH = "\u2013";

/** Keeps computed floats stable across runs and readable in JSON: 10 significant digits. */
export function roundStable(value: number): number {
  if (!Number.isFinite(value)) return value;
  const rounded = Number(value.toPrecision(10));
  return Object.is(rounded, -0) ? 0 : rounded;
}

export function formatFixed(value: number, decimals: number): string {
  const text = Math.abs(value).toFixed(decimals);
  const isZero = Number(text) === 0;
  return value < 0 && !isZero ? `${MINUS}${text}` : text;
}

/** Up to `maxDecimals`, trailing zeros dropped: 2 GHz, 2.45 GHz. */
export function formatTrimmed(value: number, maxDecimals = 3): string {
  const text = formatFixed(value, maxDecimals);
  return text.includes(".") ? text.replace(/0+$/, "").replace(/\.$/, "") : text;
}

export function formatValue(value: number | null | undefined, decimals: number): FormattedValue {
  if (value === null || value === undefined || !Number.isFinite(value)) return { value: null, text: "" };
  return { value: roundStable(value), text: formatFixed(value, decimals) };
}

export const emptyValue: FormattedValue = { value: null, text: "" };

const frequencyUnits = [
  { unit: "GHz", scale: 1e9 },
  { unit: "MHz", scale: 1e6 },
  { unit: "kHz", scale: 1e3 },
  { unit: "Hz", scale: 1 },
] as const;

export function pickFrequencyUnit(hz: number): { unit: string; scale: number } {
  return frequencyUnits.find((u) => Math.abs(hz) >= u.scale) ?? frequencyUnits[frequencyUnits.length - 1];
}

export function formatFrequency(hz: number): string {
  const { unit, scale } = pickFrequencyUnit(hz);
  return `${formatTrimmed(hz / scale)}\u00a0${unit}`;
}

/** One unit for both ends, taken from the upper end unless the lower end would drop below 0.1 of it. */
export function formatFrequencyRange(startHz: number, stopHz: number): string {
  let choice = pickFrequencyUnit(stopHz);
  if (startHz / choice.scale < 0.1) choice = pickFrequencyUnit(startHz);
  return `${formatTrimmed(startHz / choice.scale)}${EN_DASH}${formatTrimmed(stopHz / choice.scale)}\u00a0${choice.unit}`;
}

export function formatSignedDbm(value: number): string {
  const text = formatTrimmed(value, 1);
  return `${value > 0 ? "+" : ""}${text}\u00a0dBm`;
}

export function formatTemperature(celsius: number): string {
  return `${formatTrimmed(celsius, 1)}\u00a0°C`;
}
