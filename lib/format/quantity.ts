/**
 * The one way Benchfold prints a number with a unit: the web sheet, the PDF, the workspace
 * tables, the device pages, the chart tooltips and the CLI table all come through here.
 *
 * The rules (pinned in tests/unit/format/quantity.test.ts):
 * - A true minus sign, U+2212 (ISO 80000-1 §7.1.4 uses the minus, not the hyphen); a value that
 *   rounds to zero has no sign. `signed` puts "+" before a positive value (drive levels, dBm).
 * - No digit grouping: "2500 MHz", never "2,500 MHz".
 * - Digits: a fixed number of decimals (a template's `decimals`), up to a number of decimals with
 *   trailing zeros dropped (optionally keeping some significant figures for a small value), or
 *   significant figures.
 * - Value and unit are joined by a no-break space (SI Brochure, 9th ed., §5.4.3), except the
 *   plane-angle degree and a ratio, which follow the number: "90°", "1.5:1".
 * - An engineering prefix only for units that take one (Hz, W, V, A, s, Ω; never a logarithmic
 *   unit such as dB, dBm, dBc/Hz, nor °C, K or %). The prefix is chosen after rounding, so
 *   999.96 MHz at four significant figures reads "1.000 GHz", not "1000 MHz".
 * - A range prints its unit once, both ends in one prefix taken from the larger end, unless the
 *   smaller end would then read below 0.1: "0.2–2 GHz", "10–3000 MHz". Ends are joined by an en
 *   dash, or by " to " when an end carries a sign ("−10 to +5 dBm").
 * - `plain` is for terminals and machine-read text (the CLI table): a hyphen-minus and a normal
 *   space instead of U+2212 and the no-break space; the digits are the same.
 */

export const MINUS = "\u2212";
export const EN_DASH = "\u2013";
export const NBSP = "\u00a0";
export const MISSING = "\u2014";

/** How many digits a number is printed with. */
export type Digits =
  /** Exactly this many decimals, zeros kept: 9.50. */
  | { decimals: number }
  /** Up to this many decimals, trailing zeros dropped; a small value keeps `minSignificant` figures (0.0042°, not 0°). */
  | { maxDecimals: number; minSignificant?: number }
  /** Exactly this many significant figures, zeros kept: 1.000 GHz. */
  | { significant: number }
  /** Up to this many significant figures, trailing zeros dropped. */
  | { maxSignificant: number };

export interface NumberStyle {
  /** Default: up to three decimals, trailing zeros dropped. */
  digits?: Digits;
  /** "+" before a positive value. */
  signed?: boolean;
  /** Hyphen-minus and a plain space, for terminals (the CLI). */
  plain?: boolean;
}

export interface QuantityStyle extends NumberStyle {
  /** Default true: an engineering prefix where the unit takes one. */
  prefix?: boolean;
}

/** A printed quantity in two parts, for renderers that set the unit apart (the web's `Quantity`, the PDF's muted unit). */
export interface QuantityParts {
  value: string;
  unit: string;
}

const DEFAULT_DIGITS: Digits = { maxDecimals: 3 };
/** toFixed() accepts up to 100; beyond 15 a double has no more digits to give. */
const MAX_DECIMALS = 15;

/** The magnitude to print (already rounded to its significant figures) and how many decimals to print it with. */
function decimalsFor(magnitude: number, digits: Digits): { magnitude: number; decimals: number; trim: boolean } {
  if ("decimals" in digits) return { magnitude, decimals: digits.decimals, trim: false };
  if ("maxDecimals" in digits) {
    let decimals = digits.maxDecimals;
    if (digits.minSignificant && magnitude > 0) decimals = Math.max(decimals, digits.minSignificant - 1 - Math.floor(Math.log10(magnitude)));
    return { magnitude, decimals: Math.min(MAX_DECIMALS, decimals), trim: true };
  }
  const significant = "significant" in digits ? digits.significant : digits.maxSignificant;
  const trim = !("significant" in digits);
  if (magnitude === 0) return { magnitude, decimals: 0, trim };
  // Round to the significant figures first: 999.96 at four figures is 1000, which has no decimals left.
  const rounded = Number(magnitude.toPrecision(significant));
  return { magnitude: rounded, decimals: Math.min(MAX_DECIMALS, Math.max(0, significant - 1 - Math.floor(Math.log10(rounded)))), trim };
}

function trimZeros(text: string): string {
  return text.includes(".") ? text.replace(/0+$/, "").replace(/\.$/, "") : text;
}

/** The magnitude as printed, without a sign. */
function magnitudeText(value: number, digits: Digits): string {
  const { magnitude, decimals, trim } = decimalsFor(Math.abs(value), digits);
  const text = magnitude.toFixed(decimals);
  return trim ? trimZeros(text) : text;
}

/** A number alone: sign, digits, no unit. Not a finite number prints an em dash. */
export function formatNumber(value: number, style: NumberStyle = {}): string {
  if (!Number.isFinite(value)) return MISSING;
  const text = magnitudeText(value, style.digits ?? DEFAULT_DIGITS);
  if (Number(text) === 0) return text;
  if (value < 0) return `${style.plain ? "-" : MINUS}${text}`;
  return style.signed ? `+${text}` : text;
}

/** Scientific notation for figures outside any sensible fixed width (the CLI's very small or very large values): 1.234e-5. */
export function formatScientific(value: number, fractionDigits: number, style: Pick<NumberStyle, "plain"> = {}): string {
  if (!Number.isFinite(value)) return MISSING;
  const text = value.toExponential(fractionDigits);
  return style.plain ? text : text.replace(/^-/, MINUS).replace("e-", `e${MINUS}`);
}

/** Units as the trade writes them: "deg" is "°". */
export function displayUnit(unit: string): string {
  return unit === "deg" ? "°" : unit;
}

/** Levels in decibels relative to a reference (mW, the carrier, the carrier per hertz, …). */
const DECIBEL_LEVEL = /^dB(m|W|c|c\/Hz|µV|uV|FS|i)$/;

/**
 * The unit of a difference, spread or uncertainty of a figure in this unit: the difference of two
 * levels in dBm, dBc or dBc/Hz is a ratio, in dB (common practice: a level meter's accuracy reads
 * "±0.5 dB", never "±0.5 dBm"). Any other unit is its own.
 */
export function differenceUnit(unit: string): string {
  return DECIBEL_LEVEL.test(unit) ? "dB" : unit;
}

/** Units that follow the number without a space. */
const ATTACHED_UNITS = new Set(["°", ":1"]);

/** True for a unit printed straight after its number, with no space: the degree, a ratio. */
export function attachesToNumber(unit: string): boolean {
  return ATTACHED_UNITS.has(displayUnit(unit));
}

/** A printed number and its unit in one string: "2.45 GHz", "90°", "1.5:1". */
export function joinUnit(valueText: string, unit: string, style: Pick<NumberStyle, "plain"> = {}): string {
  const shown = displayUnit(unit);
  if (!shown) return valueText;
  if (ATTACHED_UNITS.has(shown)) return `${valueText}${shown}`;
  return `${valueText}${style.plain ? " " : NBSP}${shown}`;
}

const PREFIXES = [
  { prefix: "T", factor: 1e12 },
  { prefix: "G", factor: 1e9 },
  { prefix: "M", factor: 1e6 },
  { prefix: "k", factor: 1e3 },
  { prefix: "", factor: 1 },
  { prefix: "m", factor: 1e-3 },
  { prefix: "µ", factor: 1e-6 },
  { prefix: "n", factor: 1e-9 },
  { prefix: "p", factor: 1e-12 },
] as const;
type Prefix = (typeof PREFIXES)[number];

/**
 * The units that take an engineering prefix, each with the prefixes it uses. A bench frequency is
 * never in millihertz (lib/ingest reads "mhz" as MHz), so Hz stops at the hertz.
 */
const PREFIXED_UNITS: Record<string, { largest: number; smallest: number }> = {
  Hz: { largest: 1e12, smallest: 1 },
  W: { largest: 1e3, smallest: 1e-12 },
  V: { largest: 1e3, smallest: 1e-9 },
  A: { largest: 1, smallest: 1e-12 },
  s: { largest: 1, smallest: 1e-12 },
  "\u03a9": { largest: 1e9, smallest: 1e-3 },
};

export function takesPrefix(unit: string): boolean {
  return Object.hasOwn(PREFIXED_UNITS, unit);
}

/**
 * A unit as written, split into the unit that takes a prefix and the prefix's factor:
 * "GHz" → { base: "Hz", factor: 1e9 }, "Hz" → { base: "Hz", factor: 1 }. Null for a unit that
 * takes no prefix ("dB", "dBm", "°C") or a prefix the unit does not use here ("mHz").
 */
export function splitPrefixedUnit(unit: string): { base: string; factor: number } | null {
  if (takesPrefix(unit)) return { base: unit, factor: 1 };
  for (const p of PREFIXES) {
    if (!p.prefix || !unit.startsWith(p.prefix)) continue;
    const base = unit.slice(p.prefix.length);
    if (takesPrefix(base) && prefixesOf(base).includes(p)) return { base, factor: p.factor };
  }
  return null;
}

function prefixesOf(unit: string): Prefix[] {
  const range = PREFIXED_UNITS[unit];
  return PREFIXES.filter((p) => p.factor <= range.largest && p.factor >= range.smallest);
}

/** The largest prefix that keeps |value| at 1 or more (the smallest the unit has otherwise; the base unit for zero). */
function prefixFor(magnitude: number, unit: string): Prefix {
  const allowed = prefixesOf(unit);
  if (magnitude === 0) return allowed.find((p) => p.factor === 1) ?? allowed[allowed.length - 1];
  return allowed.find((p) => magnitude >= p.factor) ?? allowed[allowed.length - 1];
}

function nextLarger(prefix: Prefix, unit: string): Prefix | undefined {
  const allowed = prefixesOf(unit);
  const at = allowed.findIndex((p) => p.factor === prefix.factor);
  return at > 0 ? allowed[at - 1] : undefined;
}

/**
 * The unit (with prefix) and the factor to multiply by, for a set of values whose largest
 * magnitude is given: a chart axis, a form field. "Hz" for 2.4e9 → { unit: "GHz", factor: 1e-9 }.
 */
export function chooseScale(largestMagnitude: number, unit: string): { unit: string; factor: number } {
  if (!takesPrefix(unit)) return { unit, factor: 1 };
  const prefix = prefixFor(Math.abs(largestMagnitude), unit);
  return { unit: `${prefix.prefix}${unit}`, factor: 1 / prefix.factor };
}

/** A quantity in two parts: `quantityParts(2.45e9, "Hz")` → { value: "2.45", unit: "GHz" }. */
export function quantityParts(value: number, unit: string, style: QuantityStyle = {}): QuantityParts {
  if (!Number.isFinite(value)) return { value: MISSING, unit: displayUnit(unit) };
  if (style.prefix === false || !takesPrefix(unit)) return { value: formatNumber(value, style), unit: displayUnit(unit) };
  let prefix = prefixFor(Math.abs(value), unit);
  let text = formatNumber(value / prefix.factor, style);
  const larger = nextLarger(prefix, unit);
  // Rounding can carry a value into the next prefix: 999.96 MHz → "1000.0" → 1.0 GHz.
  if (larger && Math.abs(Number(text.replace(MINUS, "-"))) >= 1000) {
    prefix = larger;
    text = formatNumber(value / prefix.factor, style);
  }
  return { value: text, unit: `${prefix.prefix}${unit}` };
}

/** A quantity as one string: `formatQuantity(-3.5, "dBm")` → "−3.5 dBm" (no-break space). */
export function formatQuantity(value: number, unit: string, style: QuantityStyle = {}): string {
  const parts = quantityParts(value, unit, style);
  return joinUnit(parts.value, parts.unit, style);
}

/** Below this, the smaller end of a range takes its own, smaller prefix: 10–3000 MHz, not 0.01–3 GHz. */
const RANGE_SMALLER_END_FLOOR = 0.1;

/**
 * The one prefix both ends of a range are printed in (see the rules above), as the unit and
 * the factor to multiply by: for the range's text and for a form that edits the range.
 */
export function rangeScale(min: number, max: number, unit: string, style: QuantityStyle = {}): { unit: string; factor: number } {
  if (style.prefix === false || !takesPrefix(unit)) return { unit: displayUnit(unit), factor: 1 };
  const larger = Math.max(Math.abs(min), Math.abs(max));
  const smaller = Math.min(Math.abs(min), Math.abs(max));
  const fits = (p: Prefix) => smaller === 0 || smaller / p.factor >= RANGE_SMALLER_END_FLOOR;
  let prefix = prefixFor(larger, unit);
  if (!fits(prefix)) prefix = prefixFor(smaller, unit);
  const up = nextLarger(prefix, unit);
  // Rounding can carry the larger end into the next prefix, as for a single value.
  if (up && fits(up) && Math.abs(Number(formatNumber(larger / prefix.factor, { ...style, plain: true }))) >= 1000) prefix = up;
  return { unit: `${prefix.prefix}${unit}`, factor: 1 / prefix.factor };
}

/** A range in two parts: `rangeParts(200e6, 2e9, "Hz")` → { value: "0.2–2", unit: "GHz" }. */
export function rangeParts(min: number, max: number, unit: string, style: QuantityStyle = {}): QuantityParts {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { value: MISSING, unit: displayUnit(unit) };
  if (min === max) return quantityParts(min, unit, style);
  const scale = rangeScale(min, max, unit, style);
  const low = formatNumber(min * scale.factor, style);
  const high = formatNumber(max * scale.factor, style);
  const signedEnd = /^[-+\u2212]/.test(low) || /^[-+\u2212]/.test(high);
  return { value: `${low}${signedEnd ? " to " : EN_DASH}${high}`, unit: scale.unit };
}

/** A range as one string: "0.2–2 GHz", "−10 to +5 dBm". */
/**
 * A band whose ends lie decades apart ("12 kHz – 20 MHz", "10 Hz – 1 MHz"): each end with its own
 * prefix, a spaced en dash between (the ends hold spaces themselves; a hyphen in plain text), where a
 * narrow table column may wrap. formatRange keeps one prefix, which suits ends of one magnitude.
 */
export function formatBand(start: number, stop: number, unit: string, style: QuantityStyle = {}): string {
  return `${formatQuantity(start, unit, style)} ${style.plain ? "-" : EN_DASH} ${formatQuantity(stop, unit, style)}`;
}

export function formatRange(min: number, max: number, unit: string, style: QuantityStyle = {}): string {
  const parts = rangeParts(min, max, unit, style);
  return joinUnit(parts.value, parts.unit, style);
}
