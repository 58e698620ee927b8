import { z } from "zod";
import { catalogMaxPageSize, catalogQueryLimits } from "@/lib/catalog/catalog-query";
import type { CatalogResult } from "@/lib/catalog/types";
import { settingSources } from "@/lib/domain/analysis-settings";
import { deviceClasses } from "@/lib/domain/device-classes";
import { measurementSetStates, measurementSources, type MeasurementSetSummary } from "@/lib/domain/measurements";
import { revisionStandings, type RevisionSummary } from "@/lib/domain/reviews";
import { referencePattern, sha256Pattern, type VerifyAnswer } from "@/lib/domain/verify";
import { errorStatus, type AppError } from "@/lib/errors";
import type { ValueTable } from "@/lib/analysis/tables";
import type { Readiness } from "@/lib/server/health/check-readiness";
import type { Same } from "./same-type";
import { sheetModelSchema } from "./sheet-model";

/**
 * What the versioned public API (app/api/v1) answers, as zod schemas: the handlers type their
 * answers with them (`satisfies`), and /api/v1/openapi.json is generated from them
 * (lib/schemas/openapi-document.ts). Each schema is held to the domain type the server functions
 * return by a `Same<…>` check, so a field added on either side fails the type check.
 */

const isoDateTime = z.iso.datetime({ offset: true });

/* ---------- errors ---------- */

export const errorBodySchema = z
  .object({
    error: z.object({
      code: z.enum(Object.keys(errorStatus) as [keyof typeof errorStatus, ...(keyof typeof errorStatus)[]]),
      message: z.string().meta({ description: "Says what is wrong, naming the field where there is one." }),
      details: z.record(z.string(), z.unknown()).optional().meta({ description: "E.g. `fields`: each field and its message (422)." }),
    }),
  })
  .meta({ description: "Every refusal: a 4xx (or 503 while the database is unreachable) with a code and a message." });
const errorBodyMatches: Same<z.infer<typeof errorBodySchema>, ReturnType<AppError["toJSON"]>> = true;

/* ---------- catalog search ---------- */

const band = z.object({ min: z.number(), max: z.number() }).nullable();

export const catalogHitSchema = z.object({
  revisionId: z.number().int(),
  organization: z.object({ slug: z.string(), name: z.string() }),
  partNumber: z.string(),
  title: z.string(),
  deviceClass: z.enum(deviceClasses),
  letter: z.string(),
  releasedAt: isoDateTime,
  inputFrequencyHz: band,
  outputFrequencyHz: band,
  driveLevelDbm: z.number().nullable(),
  sortValue: z.number().nullable().meta({ description: "The value of the column the results are sorted by, when it is a figure." }),
  figures: z.array(
    z.object({
      key: z.string(),
      typ: z.number().nullable(),
      limit: z.number().nullable(),
      guarantee: z.enum(["min", "max"]),
      unit: z.string(),
    }),
  ),
  path: z.string().meta({ description: "The revision's public sheet page." }),
  apiPath: z.string().meta({ description: "The revision's model as JSON (GET /api/v1/sheets/{org}/{part}/{rev})." }),
});

const facet = <T extends z.ZodType<string>>(value: T) => z.object({ value, label: z.string(), count: z.number().int().min(0) });

export const catalogResultSchema = z.object({
  total: z.number().int().min(0),
  page: z.number().int().min(1),
  pageSize: z.number().int().min(1),
  hits: z.array(catalogHitSchema),
  facets: z.object({ deviceClass: z.array(facet(z.enum(deviceClasses))), organization: z.array(facet(z.string())) }),
});
const catalogResultMatches: Same<z.infer<typeof catalogResultSchema>, CatalogResult> = true;

export const sheetsSearchResponseSchema = catalogResultSchema
  .extend({ apiVersion: z.literal(1) })
  .meta({ description: "A page of released revisions, the total, and the counts per device class and organization (each without its own filter)." });
export type SheetsSearchResponse = z.infer<typeof sheetsSearchResponseSchema>;

/**
 * The query string of GET /api/v1/sheets, for the document: `parseCatalogQuery`
 * (lib/catalog/catalog-query.ts) reads it, with the same limits, and answers 422 naming the field.
 */
export const sheetsSearchParamsSchema = z.object({
  q: z.string().max(catalogQueryLimits.textCharacters).optional().meta({ description: "Words the part number or the title contains." }),
  class: z.enum(deviceClasses).optional().meta({ description: "Device class." }),
  org: z.string().max(catalogQueryLimits.textCharacters).optional().meta({ description: "An organization's short name (its slug)." }),
  covers: z.string().max(catalogQueryLimits.textCharacters).optional().meta({ description: "A frequency the input or output band must contain, with its unit: `2.4 GHz`." }),
  f: z
    .array(z.string().max(catalogQueryLimits.textCharacters))
    .max(catalogQueryLimits.conditions)
    .optional()
    .meta({ description: "Conditions `<key>[.<min|typ|max>]<=|>=<value>[ unit]`, e.g. `conversion-loss.max<=10 dB`, `drive<=+13 dBm`." }),
  rev: z.enum(["current", "all"]).optional().meta({ description: "`all` includes superseded and withdrawn revisions." }),
  sort: z.string().max(catalogQueryLimits.textCharacters).optional().meta({ description: "`part`, `released`, `drive` or `<key>.<min|typ|max>`." }),
  dir: z.enum(["asc", "desc"]).optional(),
  page: z.number().int().min(1).max(catalogQueryLimits.page).optional(),
  limit: z.number().int().min(1).max(catalogMaxPageSize).optional(),
});

/* ---------- a released revision ---------- */

const person = z.object({ id: z.number().int(), name: z.string() });
const signer = z.object({ name: z.string(), roleWord: z.string(), signedAt: isoDateTime });

export const revisionSummarySchema = z.object({
  id: z.number().int(),
  deviceId: z.number().int(),
  letter: z.string(),
  releasedAt: isoDateTime,
  releasedBy: person,
  signers: z.array(signer),
  standing: z.enum(revisionStandings),
  withdrawal: z.object({ reason: z.string(), withdrawnAt: isoDateTime, by: z.string() }).nullable(),
  notes: z.array(z.string()),
  pdfSha256: z.string().regex(/^[0-9a-f]{64}$/),
  pdfBytes: z.number().int().min(0),
  reference: z.string(),
  publicPath: z.string(),
  pdfPath: z.string(),
});
const revisionSummaryMatches: Same<z.infer<typeof revisionSummarySchema>, RevisionSummary> = true;

export const releasedSheetResponseSchema = z
  .object({ apiVersion: z.literal(1), revision: revisionSummarySchema, history: z.array(revisionSummarySchema), sheet: sheetModelSchema })
  .meta({ description: "A released revision: its standing, the part's revision history (newest first) and the frozen sheet model." });
export type ReleasedSheetResponse = z.infer<typeof releasedSheetResponseSchema>;

export const sheetPathParamsSchema = z.object({
  org: z.string().meta({ description: "The organization's short name." }),
  part: z.string().meta({ description: "The part number." }),
  rev: z.string().meta({ description: "A revision letter (`A`, `B`, … `AA`) or `current`." }),
});

/* ---------- verify ---------- */

const verifyRevisionRef = z.object({ letter: z.string(), releasedAt: isoDateTime, standing: z.enum(revisionStandings), notes: z.array(z.string()), publicPath: z.string() });

export const verifyAnswerSchema = z.object({
  organization: z.object({ name: z.string(), slug: z.string() }),
  partNumber: z.string(),
  title: z.string(),
  letter: z.string(),
  releasedAt: isoDateTime,
  signers: z.array(signer),
  standing: z.enum(revisionStandings),
  reference: z.string(),
  pdfSha256: z.string().regex(/^[0-9a-f]{64}$/),
  publicPath: z.string(),
  pdfPath: z.string(),
  withdrawal: z.object({ reason: z.string(), withdrawnAt: isoDateTime }).nullable(),
  supersededBy: verifyRevisionRef.nullable(),
  later: z.array(verifyRevisionRef),
});
const verifyAnswerMatches: Same<z.infer<typeof verifyAnswerSchema>, VerifyAnswer> = true;

export const verifyResponseSchema = z
  .object({ verification: verifyAnswerSchema })
  .meta({ description: "Which released revision a printout is, and whether it is current, superseded (by which) or withdrawn (why)." });
export type VerifyResponse = z.infer<typeof verifyResponseSchema>;

export const verifyParamsSchema = z.object({
  sha256: z.string().regex(sha256Pattern).optional().meta({ description: "The PDF's SHA-256, 64 hexadecimal digits." }),
  reference: z.string().regex(referencePattern).optional().meta({ description: "The verification reference printed in the PDF's footer, e.g. `7KQ2M-XR4TD`." }),
});

/* ---------- bench upload ---------- */

const optionalNumber = z.number().optional();

export const measurementSetSchema = z.object({
  id: z.number().int(),
  deviceId: z.number().int(),
  partNumber: z.string(),
  kind: z.string(),
  state: z.enum(measurementSetStates),
  fileName: z.string(),
  sizeBytes: z.number().int().min(0),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  conditions: z.object({
    serial: z.string(),
    lot: z.string().optional(),
    temperatureC: optionalNumber,
    inputFrequencyHz: optionalNumber,
    driveLevelDbm: optionalNumber,
    splitterExcessLossDb: optionalNumber,
    cableLossDb: optionalNumber,
    rfFrequencyHz: optionalNumber,
    loFrequencyHz: optionalNumber,
    ifFrequencyHz: optionalNumber,
    loDriveDbm: optionalNumber,
    bandStartHz: optionalNumber,
    bandStopHz: optionalNumber,
    notes: z.string().optional(),
    impedanceOhm: optionalNumber.meta({ description: "The impedance power readings are referred to, Ω, when the file or the upload stated one; 50 Ω otherwise." }),
  }),
  measuredOn: z.string().nullable(),
  parameters: z.array(
    z.object({ name: z.string(), value: z.number().nullable(), unit: z.string(), conditions: z.record(z.string(), z.union([z.string(), z.number()])) }),
  ),
  warnings: z.array(z.string()),
  source: z.enum(measurementSources),
  uploadedBy: z.string().nullable(),
  uploadedById: z.number().int().nullable(),
  benchTokenName: z.string().nullable(),
  reviewedBy: z.string().nullable(),
  reviewedAt: isoDateTime.nullable(),
  rejectionReason: z.string().nullable(),
  supersedesId: z.number().int().nullable(),
  supersededById: z.number().int().nullable(),
  instruments: z.array(
    z.object({ id: z.number().int(), kind: z.string(), model: z.string(), serial: z.string(), calibrationDueOn: z.string(), calibrationLapsed: z.boolean() }),
  ),
  createdAt: isoDateTime,
});
const measurementSetMatches: Same<z.infer<typeof measurementSetSchema>, MeasurementSetSummary> = true;

const valueTableColumnSchema = z.object({ label: z.string(), unit: z.string() });
export const valueTableSchema = z
  .object({
    id: z.string(),
    title: z.string(),
    impedanceOhm: z.number().optional().meta({ description: "Impedance the Vrms and dBµV columns are referred to, Ω." }),
    impedanceSource: z.enum(settingSources).optional().meta({ description: "Who stated the impedance: `file`, `upload`, `cli`, `template` or `engine` (Benchfold's default, 50 Ω)." }),
    x: valueTableColumnSchema,
    columns: z.array(valueTableColumnSchema),
    rows: z.array(z.array(z.number().nullable())).meta({ description: "One row per point: x first, then one cell per column (null where a value cannot be computed)." }),
  })
  .meta({ description: "Every value of the measurement at each of its points (frequency or drive step)." });
const valueTableMatches: Same<z.infer<typeof valueTableSchema>, ValueTable> = true;

export const benchUploadResponseSchema = z
  .object({ measurementSet: measurementSetSchema, tables: z.array(valueTableSchema) })
  .meta({ description: "The stored measurement set, awaiting review, with the parameters the engine derived and every value per point." });
export type BenchUploadResponse = z.infer<typeof benchUploadResponseSchema>;

/* ---------- readiness (GET /api/health/ready, outside /api/v1 but described with it) ---------- */

const readinessCheckSchema = z.object({
  status: z.enum(["ok", "failing"]),
  ms: z.number().int().meta({ description: "How long the check took, ms." }),
  message: z.string().optional().meta({ description: "Why it fails, in words; never a host, port or driver message." }),
});
export const readinessResponseSchema = z
  .object({
    status: z.enum(["ready", "not-ready", "stopping"]),
    notReady: z.array(z.enum(["database", "storage", "mail", "instance"])).meta({ description: "What is not ready: a check, or `instance` while it shuts down." }),
    checks: z
      .object({ database: readinessCheckSchema.optional(), storage: readinessCheckSchema.optional(), mail: readinessCheckSchema.optional() })
      .meta({ description: "Each check's result; empty while the instance shuts down (no check is run then)." }),
    note: z.string(),
  })
  .meta({ description: "Whether this app instance should get traffic: 200 ready, 503 not ready or stopping." });
export type ReadinessResponse = z.infer<typeof readinessResponseSchema>;
const readinessMatches: Same<ReadinessResponse, Readiness> = true;

export const measurementSetResponseSchema = z
  .object({ measurementSet: measurementSetSchema, tables: z.array(valueTableSchema) })
  .meta({ description: "One measurement set of the token's organization, in any state, with its derived parameters and every value per point: the same shape as the upload's answer." });
export type MeasurementSetResponse = z.infer<typeof measurementSetResponseSchema>;

export const measurementSetPathParamsSchema = z.object({
  id: z.string().regex(/^[1-9][0-9]{0,9}$/).meta({ description: "The measurement set's id, as the upload answered it (`measurementSet.id`)." }),
});


void [readinessMatches, valueTableMatches, errorBodyMatches, catalogResultMatches, revisionSummaryMatches, verifyAnswerMatches, measurementSetMatches];
