/**
 * The sheet model's figures: each carries its number (for the JSON API and the checks) and
 * its text as printed, from the one formatter in lib/format.
 */

import { formatNumber, formatQuantity } from "../format/quantity";
import type { FormattedValue } from "./types";

/** Keeps computed floats stable across runs and readable in JSON: 10 significant digits. */
export function roundStable(value: number): number {
  if (!Number.isFinite(value)) return value;
  const rounded = Number(value.toPrecision(10));
  return Object.is(rounded, -0) ? 0 : rounded;
}

/** A figure with a template's fixed number of decimals; missing or not finite is empty. */
export function formatValue(value: number | null | undefined, decimals: number): FormattedValue {
  if (value === null || value === undefined || !Number.isFinite(value)) return { value: null, text: "" };
  return { value: roundStable(value), text: formatNumber(value, { digits: { decimals } }) };
}

export const emptyValue: FormattedValue = { value: null, text: "" };

/** A power level as the sheet states conditions: signed, one decimal at most ("+13 dBm", "−10 dBm"). */
export function formatDrive(dbm: number): string {
  return formatQuantity(dbm, "dBm", { signed: true, digits: { maxDecimals: 1 } });
}

/** A temperature as the sheet states conditions: one decimal at most ("25 °C", "−40 °C"). */
export function formatTemperature(celsius: number): string {
  return formatQuantity(celsius, "°C", { digits: { maxDecimals: 1 } });
}
