/**
 * The sheet model's figures: each carries its number (for the JSON API and the checks) and
 * its text as printed, from the one formatter in lib/format.
 */

import { differenceUnit, displayUnit, formatNumber, formatQuantity } from "../format/quantity";
import { shortestDecimals } from "../format/typed-decimals";
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

/**
 * A span of temperatures as ratings write it: "−40 to +85 °C" (the high end signed when the low end is
 * below zero), "25 to 85 °C"; one temperature when both ends agree.
 */
export function formatTemperatureRange(lowC: number, highC: number): string {
  if (lowC === highC) return formatTemperature(lowC);
  const digits = { maxDecimals: 1 };
  return `${formatNumber(lowC, { digits })} to ${formatNumber(highC, { digits, signed: lowC < 0 })}\u00a0°C`;
}

/**
 * A stated limit (min, typ or max) with the digits the engineer typed: 9.5 stays "9.5" and 10.0
 * stays "10.0", whatever the template's decimals. A limit saved without its typed digits (through
 * the API as a JSON number, or before they were kept) prints the stored number's shortest exact
 * form: 9.5 → "9.5", 10 → "10". Never a digit the engineer did not write.
 */
export function formatLimitValue(value: number | null | undefined, typedDecimals: number | undefined): FormattedValue {
  if (value === null || value === undefined || !Number.isFinite(value)) return emptyValue;
  const stable = roundStable(value);
  return formatValue(stable, typedDecimals ?? shortestDecimals(stable));
}

/**
 * The decimals a typical value taken from the measured units is printed with: the decade of the
 * spread s of the units (one significant digit of s; JCGM 100:2008 §7.2.6: quote an uncertainty with
 * at most two significant digits and round the estimate to the same last place), never more than
 * the template's decimals, never fewer than none. s = 0.31 dB → 1 decimal, s = 0.04 dB → 2, s = 3 dB → 0.
 * The spread of the units, not the uncertainty of their mean (s/√n): a typical value says where a
 * unit lies, and a unit departs from it by s. With fewer than two units or no spread, the template's decimals.
 */
export function typicalDecimals(options: { standardDeviation: number; n: number; templateDecimals: number }): number {
  const { standardDeviation: s, n, templateDecimals } = options;
  if (n < 2 || !(s > 0) || !Number.isFinite(s)) return templateDecimals;
  // Round s to one significant digit first: 0.096 is 0.1, whose decade is the first decimal.
  const rounded = Number(s.toPrecision(1));
  return Math.min(templateDecimals, Math.max(0, -Math.floor(Math.log10(rounded))));
}

/** The annex's pass count, "4/5": only where a min or max limit exists to pass against (a typ alone judges nothing). */
export function formatPassCount(group: { acceptance: unknown; passCount: number; n: number }): string {
  return group.acceptance ? `${group.passCount}/${group.n}` : "";
}

/**
 * The statistics annex's word on the Cpk it leaves blank: one sentence for all the groups whose
 * limit has too few units behind it, or null when every limit's Cpk is stated.
 */
export function describeAbsentCpk(statistics: { cpkMinUnits?: number; groups: { cpkAbsentReason?: string }[] }): string | null {
  const count = statistics.groups.filter((g) => g.cpkAbsentReason).length;
  if (count === 0) return null;
  const minimum = statistics.cpkMinUnits !== undefined ? `the ${statistics.cpkMinUnits} units` : "the units";
  return (
    `Cpk is left blank for ${count === 1 ? "one limit" : `${count} limits`}: fewer than ${minimum} the organization requires were measured, ` +
    `and from so few units the estimate is too uncertain to mean something. Such a Cpk is still judged against the threshold.`
  );
}

/**
 * The unit beside a parameter in the statistics annex, where one row holds values, their spread and
 * their uncertainty: "(dB)", or for a level "(dBc; s, U in dB)", since the spread and the uncertainty
 * of a level in dBc, dBc/Hz or dBm are ratios, in dB.
 */
export function annexUnitText(unit: string): string {
  const spread = differenceUnit(unit);
  return spread === unit ? `(${displayUnit(unit)})` : `(${displayUnit(unit)}; s, U in ${displayUnit(spread)})`;
}

/** A printed Cpk's confidence interval as the annex shows it under the figure, "1.10–1.94"; "" when there is none. */
export function formatCpkInterval(group: { cpkInterval?: { lower: FormattedValue; upper: FormattedValue } }): string {
  return group.cpkInterval ? `${group.cpkInterval.lower.text}\u2013${group.cpkInterval.upper.text}` : "";
}
