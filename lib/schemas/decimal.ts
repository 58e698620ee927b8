import { z } from "zod";
import { parseDecimalText } from "@/lib/ingest/number";

/**
 * The one zod helper for numbers that arrive as text or JSON (form fields, bench API fields,
 * query strings). Text goes through the engine's strict decimal reader: a blank field is
 * missing (never 0), and hexadecimal, binary, octal, Infinity, NaN, thousands separators and
 * trailing text are refused.
 */
export type DecimalOptions = { label: string; min?: number; max?: number; integer?: boolean };

function shorten(text: string): string {
  return text.length > 24 ? `${text.slice(0, 24)}…` : text;
}

function decimal(options: DecimalOptions, required: boolean) {
  const { label, min, max, integer } = options;
  return z.unknown().transform((value, ctx): number | undefined => {
    let x: number | undefined;
    if (value === undefined || value === null) x = undefined;
    else if (typeof value === "number") x = value;
    else if (typeof value === "string") x = parseDecimalText(value);
    else {
      ctx.addIssue({ code: "custom", message: `${label} must be a number` });
      return z.NEVER;
    }
    if (x === undefined) {
      if (!required) return undefined;
      ctx.addIssue({ code: "custom", message: `${label} is missing` });
      return z.NEVER;
    }
    if (!Number.isFinite(x)) {
      ctx.addIssue({ code: "custom", message: `${label} must be a decimal number such as 12.5 or -3e9, found "${shorten(String(value))}"` });
      return z.NEVER;
    }
    if (integer && !Number.isInteger(x)) {
      ctx.addIssue({ code: "custom", message: `${label} must be a whole number, found "${shorten(String(value))}"` });
      return z.NEVER;
    }
    if (min !== undefined && x < min) {
      ctx.addIssue({ code: "custom", message: `${label} must be at least ${min}` });
      return z.NEVER;
    }
    if (max !== undefined && x > max) {
      ctx.addIssue({ code: "custom", message: `${label} must be at most ${max}` });
      return z.NEVER;
    }
    return x;
  }).meta({ description: `${label}: a decimal number${min !== undefined && max !== undefined ? ` from ${min} to ${max}` : ""}${integer ? ", whole" : ""}` });
}

/** A number that may be left out or blank (undefined then). */
export function optionalDecimal(options: DecimalOptions) {
  return decimal(options, false).optional();
}

/** A number that must be given. */
export function requiredDecimal(options: DecimalOptions) {
  return decimal(options, true).pipe(z.number());
}

/**
 * For an object with `min` and `max` (a frequency band, a limit pair): refuses min above max,
 * on the `max` field, saying both values. Equal ends are allowed (one frequency, a fixed value).
 */
export function minNotAboveMax(label: string) {
  return (value: { min?: number | null; max?: number | null }, ctx: z.RefinementCtx) => {
    if (value.min != null && value.max != null && value.min > value.max) {
      ctx.addIssue({ code: "custom", path: ["max"], message: `${label}: the minimum ${value.min} is above the maximum ${value.max}` });
    }
  };
}

/**
 * A record id as written in a URL path or query: plain decimal digits only, 1 to 2^32. Number()
 * would read "0x10", " 16" and "1.6e1" as 16. Undefined when the text is not such an id.
 */
export function parseRecordId(text: string | undefined): number | undefined {
  if (text === undefined || !/^[0-9]{1,10}$/.test(text)) return undefined;
  const id = Number(text);
  return id >= 1 && id <= 2 ** 32 ? id : undefined;
}
