import { z } from "zod";
import { limitBases, proseSectionIds, proseSectionTitles } from "@/lib/domain/sheets";
import { findProseLimitBreach } from "@/lib/sheet/render-prose";
import { parseDecimalText } from "@/lib/ingest/number";
import { minNotAboveMax } from "./decimal";

const finite = z.number().refine(Number.isFinite, "must be a finite number");

const typedDecimals = z.number().int().min(0).max(15);

/** Typed decimals that would print a figure as another number (9.55 with 1 decimal reads 9.6) are refused, on that figure. */
function decimalsHoldTheValue(l: { min?: number | null; typ?: number | null; max?: number | null; decimals?: { min?: number; typ?: number; max?: number } }, ctx: z.RefinementCtx) {
  for (const key of ["min", "typ", "max"] as const) {
    const value = l[key];
    const decimals = l.decimals?.[key];
    if (value == null || decimals === undefined) continue;
    if (Number(value.toFixed(decimals)) !== value) {
      ctx.addIssue({ code: "custom", path: ["decimals", key], message: `${key} ${value} has more decimals than the ${decimals} stated` });
    }
  }
}

/** The whole set of a device's spec limits, replaced at once by the limits editor. */
export const specLimitsBodySchema = z.object({
  limits: z
    .array(
      z
        .object({
          parameter: z.string().regex(/^[a-z0-9-]+$/).max(64),
          conditionsKey: z.string().max(255),
          min: finite.nullable().optional(),
          typ: finite.nullable().optional(),
          max: finite.nullable().optional(),
          unit: z.string().trim().min(1).max(16),
          basis: z.enum(limitBases),
          footnote: z.string().trim().max(500).optional(),
          /** The decimals each figure was typed with: "9.50" is 9.5 with 2. The sheet prints exactly these. */
          decimals: z
            .object({ min: typedDecimals.optional(), typ: typedDecimals.optional(), max: typedDecimals.optional() })
            .optional(),
        })
        .refine((l) => l.min != null || l.typ != null || l.max != null, "Give at least one of min, typ, max.")
        .superRefine(decimalsHoldTheValue)
        .superRefine(minNotAboveMax("limits")),
    )
    .max(400),
});
export type SpecLimitsBody = z.infer<typeof specLimitsBodySchema>;

/** Each section within the prose limits (lib/sheet/prose-limits.ts), refused with the section and the limit named. */
const proseSchema = z.partialRecord(z.enum(proseSectionIds), z.string()).superRefine((prose, ctx) => {
  for (const id of proseSectionIds) {
    const markdown = prose[id];
    const breach = markdown === undefined ? null : findProseLimitBreach(markdown);
    if (breach) ctx.addIssue({ code: "custom", path: [id], message: `The section “${proseSectionTitles[id]}” ${breach.reason}; ${breach.remedy}.`, params: { limit: breach.limit } });
  }
});

export const sheetContentBodySchema = z.object({
  prose: proseSchema.default({}),
  absoluteMaximumRatings: z
    .array(z.object({ label: z.string().trim().min(1).max(120), value: z.string().trim().min(1).max(40), unit: z.string().trim().max(16) }))
    .max(40)
    .default([]),
  measurementUncertainty: z.record(z.string().regex(/^[a-z0-9-]+$/).max(64), z.number().positive().max(100)).default({}),
});
export type SheetContentBody = z.infer<typeof sheetContentBodySchema>;

const cell = (max: number) => z.string().trim().max(max);
/** A figure as typed ("9.5", "−40"), kept as text so the sheet prints its digits; blank is not stated. */
const typedFigureText = z
  .string()
  .trim()
  .max(24)
  .refine((t) => t === "" || Number.isFinite(parseDecimalText(t) ?? NaN), "must be a decimal number, or blank");

/** What a designer needs beside the specifications, replaced at once by the design-in editor. */
export const designDataBodySchema = z.object({
  pinFunctions: z.array(z.object({ pin: cell(16), name: cell(40).min(1), function: cell(200).min(1) })).max(100),
  ordering: z.array(z.object({ partNumber: cell(64).min(1), options: cell(200), packing: cell(120) })).max(50),
  recommendedOperatingConditions: z
    .array(
      z
        .object({ parameter: cell(120).min(1), min: typedFigureText, typ: typedFigureText, max: typedFigureText, unit: cell(16) })
        .refine((c) => c.min !== "" || c.typ !== "" || c.max !== "", { message: "Give at least one of min, typ, max.", path: ["typ"] })
        .refine((c) => c.min === "" || c.max === "" || parseDecimalText(c.min)! <= parseDecimalText(c.max)!, { message: "min is above max", path: ["max"] }),
    )
    .max(40),
  packageOutlineCaption: cell(200).optional(),
});
export type DesignDataBody = z.infer<typeof designDataBodySchema>;
