import { z } from "zod";
import { deviceClasses } from "@/lib/domain/device-classes";
import { mappableKinds, measurementKinds } from "@/lib/domain/measurements";
import { calendarDateSchema, optionalCalendarDateSchema } from "./calendar-date";
import { impedanceRangeOhm, namedIntegrationBandIds, spurBandwidthRangeHz } from "@/lib/domain/analysis-settings";
import { findProseLimitBreach } from "@/lib/sheet/render-prose";
import { conditionFieldIds, conditionFieldLabel, conditionFields, type ConditionFieldId } from "@/lib/domain/measurement-conditions";
import { minNotAboveMax, optionalDecimal, requiredDecimal } from "./decimal";

/** Shared by the upload form, the browser upload route and the bench API. */
const optionalNumber = (min: number, max: number, label: string) => optionalDecimal({ label, min, max });
const optionalId = (label: string) => optionalDecimal({ label, min: 1, max: 2 ** 32, integer: true });

export const measurementConditionsSchema = z.object({
  serial: z.string().trim().max(64).optional(),
  lot: z.string().trim().max(64).optional(),
  temperatureC: optionalNumber(-273.15, 500, "temperature (°C)"),
  // The class's own conditions (lib/domain/measurement-conditions.ts); which a device's class asks for is
  // checked against its template's list by the upload (checkClassConditions), a field of another class is a 422.
  ...conditionFieldSchemas(),
  measuredOn: optionalCalendarDateSchema,
  notes: z.string().trim().max(2000).optional(),
  // Measurement settings (lib/domain/analysis-settings.ts): a named integration band or its two ends, and the
  // compression reference drive. The file's own lines win over these; these win over the class's defaults.
  integrationBand: z.preprocess(
    (value) => (value === "" ? undefined : value),
    z.enum(namedIntegrationBandIds, { error: `Choose one of the named bands: ${namedIntegrationBandIds.join(", ")}.` }).optional(),
  ),
  integrationStartHz: optionalNumber(1e-3, 3e12, "integration band start (Hz)"),
  integrationStopHz: optionalNumber(1e-3, 3e12, "integration band stop (Hz)"),
  compressionReferenceDbm: optionalNumber(-200, 60, "compression reference drive (dBm)"),
  // The impedance power readings are referred to for dBm ↔ Vrms ↔ dBµV; a Touchstone file keeps its own.
  impedanceOhm: optionalNumber(impedanceRangeOhm.min, impedanceRangeOhm.max, "impedance (Ω)"),
  // The bandwidth a phase-noise trace was normalised with, for spurs in dBc: the analyzer's noise bandwidth (used
  // as is) or its 3 dB resolution bandwidth (× 1.0645, lib/rf/spurs.ts); one of the two. The file's own line or column wins.
  noiseBandwidthHz: optionalNumber(spurBandwidthRangeHz.min, spurBandwidthRangeHz.max, "noise bandwidth (Hz)"),
  resolutionBandwidthHz: optionalNumber(spurBandwidthRangeHz.min, spurBandwidthRangeHz.max, "resolution bandwidth (Hz)"),
});
function conditionFieldSchemas() {
  const entries = conditionFieldIds.map((id) => {
    const field = conditionFields[id];
    return [id, optionalNumber(field.min, field.max, conditionFieldLabel(id))] as const;
  });
  return Object.fromEntries(entries) as Record<ConditionFieldId, ReturnType<typeof optionalNumber>>;
}

export type MeasurementConditionsInput = z.infer<typeof measurementConditionsSchema>;

export const uploadFieldsSchema = measurementConditionsSchema.extend({
  kind: z.enum(measurementKinds).optional().or(z.literal("").transform(() => undefined)),
  instrumentIds: z.array(requiredDecimal({ label: "instrument id", min: 1, max: 2 ** 32, integer: true })).max(20).default([]),
  supersedesId: optionalId("supersedes"),
  mappingId: optionalId("column mapping"),
});
export type UploadFields = z.infer<typeof uploadFieldsSchema>;

export const reviewMeasurementBodySchema = z.discriminatedUnion("decision", [
  z.object({ decision: z.literal("approve") }),
  z.object({ decision: z.literal("reject"), reason: z.string().trim().min(5, "Say why the set is rejected (at least 5 characters).").max(2000) }),
]);
export type ReviewMeasurementBody = z.infer<typeof reviewMeasurementBodySchema>;

export const instrumentBodySchema = z
  .object({
    kind: z.string().trim().min(2).max(64),
    model: z.string().trim().min(1).max(160),
    serial: z.string().trim().min(1).max(64),
    calibratedOn: calendarDateSchema,
    calibrationDueOn: calendarDateSchema,
    uncertainty: z
      .array(
        z.object({
          quantity: z.string().trim().min(1).max(64),
          value: z.number({ error: "Enter the uncertainty as a number." }).positive("The uncertainty must be above 0."),
          unit: z.string().trim().min(1).max(16),
          coverageFactor: z.number().positive().max(5).default(2),
        }),
      )
      .max(20)
      .default([]),
  })
  .refine((v) => v.calibrationDueOn > v.calibratedOn, { message: "The due date must come after the calibration date.", path: ["calibrationDueOn"] });
export type InstrumentBody = z.infer<typeof instrumentBodySchema>;

export const benchTokenBodySchema = z.object({ name: z.string().trim().min(2, "Name the bench or script.").max(120) });

const frequencyBand = (label: string) =>
  z.object({ min: z.number().positive(), max: z.number().positive() }).superRefine(minNotAboveMax(label));

export const deviceBodySchema = z.object({
  partNumber: z.string().trim().min(1).max(64).regex(/^[A-Za-z0-9][A-Za-z0-9._\-/]*$/, "Use letters, digits, . _ - /"),
  deviceClass: z.enum(deviceClasses, { error: "Choose one of the device classes." }),
  title: z.string().trim().min(3).max(200),
  // Printed as the sheet's Description section unless the sheet has its own: the same limits as the prose.
  description: z
    .string()
    .trim()
    .max(2000)
    .default("")
    .superRefine((markdown, ctx) => {
      const breach = findProseLimitBreach(markdown);
      if (breach) ctx.addIssue({ code: "custom", message: `The description ${breach.reason}; ${breach.remedy}.`, params: { limit: breach.limit } });
    }),
  keyConditions: z
    .object({
      inputFrequencyHz: frequencyBand("input frequency band").optional(),
      outputFrequencyHz: frequencyBand("output frequency band").optional(),
      driveLevelDbm: z.number().min(-50).max(40).optional(),
      multiplicationFactor: z.number().int().min(2).max(16).optional(),
    })
    .default({}),
});
export type DeviceBody = z.infer<typeof deviceBodySchema>;

export const columnMappingBodySchema = z.object({
  name: z.string().trim().min(2).max(120),
  kind: z.enum(mappableKinds),
  headers: z.array(z.string().max(200)).min(1).max(64),
  mapping: z
    .array(z.object({ column: z.string().max(200), target: z.string().regex(/^[a-z0-9_]+$/).max(40), unit: z.string().max(16) }))
    .min(1)
    .max(64),
  metadata: z.record(z.string().regex(/^[a-z0-9_]+$/).max(40), z.string().max(200)).default({}),
});
export type ColumnMappingBody = z.infer<typeof columnMappingBodySchema>;
