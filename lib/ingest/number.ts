/**
 * Strict decimal number reading over a slice of a string, in one pass and
 * without regexes. Accepted: optional sign, digits with at most one decimal
 * separator (at least one digit in all), optional exponent `e`/`E` with
 * optional sign and at least one digit. Rejected: hex, "Infinity", "NaN",
 * thousands separators, trailing text.
 */

const POW10 = [
  1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15,
  1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
];
const MAX_EXACT_MANTISSA = 2 ** 53;

const C_0 = 48;
const C_9 = 57;
const C_PLUS = 43;
const C_MINUS = 45;
const C_DOT = 46;
const C_COMMA = 44;
const C_E = 101;
const C_E_UPPER = 69;

/**
 * Reads text[start, end) as a number; returns NaN when the slice is not a
 * valid number (a valid number is never NaN). `decimalComma` accepts ","
 * as well as "." as the (single) decimal separator.
 *
 * Mantissas below 2^53 with a power-of-ten scale up to 1e22 are converted
 * with one correctly rounded multiplication or division (Clinger, "How to
 * Read Floating Point Numbers Accurately", PLDI 1990, the fast path); other
 * inputs fall back to Number(), which is correctly rounded too.
 */
export function parseNumberAt(text: string, start: number, end: number, decimalComma = false): number {
  let i = start;
  if (i >= end) return NaN;
  let negative = false;
  let c = text.charCodeAt(i);
  if (c === C_PLUS || c === C_MINUS) {
    negative = c === C_MINUS;
    i++;
  }
  let mantissa = 0;
  let digits = 0;
  let significant = 0;
  let fractionDigits = 0;
  let seenSep = false;
  let exact = true;
  for (; i < end; i++) {
    c = text.charCodeAt(i);
    if (c >= C_0 && c <= C_9) {
      digits++;
      if (mantissa !== 0 || c !== C_0) significant++;
      mantissa = mantissa * 10 + (c - C_0);
      if (seenSep) fractionDigits++;
    } else if ((c === C_DOT || (decimalComma && c === C_COMMA)) && !seenSep) {
      seenSep = true;
    } else {
      break;
    }
  }
  if (digits === 0) return NaN;
  if (significant > 15 || mantissa >= MAX_EXACT_MANTISSA) exact = false;
  let exponent = 0;
  if (i < end) {
    if (c !== C_E && c !== C_E_UPPER) return NaN;
    i++;
    let expNegative = false;
    if (i < end) {
      c = text.charCodeAt(i);
      if (c === C_PLUS || c === C_MINUS) {
        expNegative = c === C_MINUS;
        i++;
      }
    }
    let expDigits = 0;
    for (; i < end; i++) {
      c = text.charCodeAt(i);
      if (c < C_0 || c > C_9) return NaN;
      if (exponent < 100000) exponent = exponent * 10 + (c - C_0);
      expDigits++;
    }
    if (expDigits === 0) return NaN;
    if (expNegative) exponent = -exponent;
  }
  const scale = exponent - fractionDigits;
  let value: number;
  if (exact && scale >= -22 && scale <= 22) {
    value = scale >= 0 ? mantissa * POW10[scale] : mantissa / POW10[-scale];
  } else {
    let slice = text.slice(start, end);
    if (decimalComma) slice = slice.replace(",", ".");
    value = Math.abs(Number(slice));
  }
  return negative ? -value : value;
}

/** True for spellings of NaN or infinity, so the error can say "not finite". */
export function looksNonFinite(cell: string): boolean {
  const t = cell.trim().toLowerCase().replace(/^[+-]/, "");
  return t === "nan" || t === "inf" || t === "infinity" || t === "∞";
}

/**
 * A whole field typed or sent as text: surrounding whitespace is ignored, a blank field is
 * `undefined` (missing, never 0), a leading U+2212 minus sign counts as "-", and anything but a
 * finite decimal number ("0x10", "0b1", "0o7", "Infinity", "NaN", "1,5", "1_0", "1e400") is NaN.
 */
export function parseDecimalText(text: string): number | undefined {
  const t = text.trim();
  if (t === "") return undefined;
  const normalized = t.charCodeAt(0) === 0x2212 ? `-${t.slice(1)}` : t;
  const x = parseNumberAt(normalized, 0, normalized.length);
  return Number.isFinite(x) ? x : NaN;
}

/**
 * Reads the token that starts at text[start] (not a blank) and runs to the next blank (space, tab,
 * CR or form feed) or `end`, as parseNumberAt(text, start, tokenEnd) would: the value goes to
 * out[at] and the token's end is returned. The common token (a sign, at most 15 digits and a
 * decimal point, nothing else) is converted while its end is looked for, so each character is read
 * once; any other token (an exponent, more digits, text) is read by parseNumberAt itself.
 */
export function readBlankDelimitedNumber(text: string, start: number, end: number, out: Float64Array, at: number): number {
  let i = start;
  let c = text.charCodeAt(i);
  const negative = c === C_MINUS;
  if (negative || c === C_PLUS) c = text.charCodeAt(++i);
  let mantissa = 0;
  let digits = 0;
  let fractionDigits = 0;
  let seenDot = false;
  for (; i < end; c = text.charCodeAt(++i)) {
    if (c >= C_0 && c <= C_9) {
      mantissa = mantissa * 10 + (c - C_0);
      digits++;
      if (seenDot) fractionDigits++;
    } else if (c === C_DOT && !seenDot) {
      seenDot = true;
    } else {
      break;
    }
  }
  // At most 15 digits: exact in a double and within parseNumberAt's exact fast path (scale −15 … 0).
  if (digits > 0 && digits <= 15 && (i === end || c === 32 || c === 9 || c === 13 || c === 12)) {
    const value = mantissa / POW10[fractionDigits];
    out[at] = negative ? -value : value;
    return i;
  }
  let e = start + 1;
  for (; e < end; e++) {
    const k = text.charCodeAt(e);
    if (k === 32 || k === 9 || k === 13 || k === 12) break;
  }
  out[at] = parseNumberAt(text, start, e);
  return e;
}

/**
 * Reads the CSV cell that starts at text[start] and ends at the next `delimiter` (a character code)
 * or at `end`, as a plain number: spaces, a sign, at most 15 digits with one decimal separator ("."
 * or, with `decimalComma`, ","), spaces. Then the value (parseNumberAt's on the trimmed cell) goes to
 * out[at] and the cell's end (the delimiter's position, or `end`) is returned; any other cell (a tab
 * around it, an exponent, more digits, text, an empty cell) returns -1 and is read the full way.
 */
export function readPlainCsvNumber(text: string, start: number, end: number, delimiter: number, decimalComma: boolean, out: Float64Array, at: number): number {
  let i = start;
  let c = text.charCodeAt(i);
  while (i < end && c === 32) c = text.charCodeAt(++i);
  if (i >= end) return -1;
  const negative = c === C_MINUS;
  if (negative || c === C_PLUS) c = text.charCodeAt(++i);
  let mantissa = 0;
  let digits = 0;
  let fractionDigits = 0;
  let seenSep = false;
  for (; i < end; c = text.charCodeAt(++i)) {
    if (c >= C_0 && c <= C_9) {
      mantissa = mantissa * 10 + (c - C_0);
      digits++;
      if (seenSep) fractionDigits++;
    } else if ((c === C_DOT || (decimalComma && c === C_COMMA)) && !seenSep) {
      seenSep = true;
    } else {
      break;
    }
  }
  while (i < end && c === 32) c = text.charCodeAt(++i);
  if (digits === 0 || digits > 15 || (i < end && c !== delimiter)) return -1;
  const value = mantissa / POW10[fractionDigits];
  out[at] = negative ? -value : value;
  return i;
}
