import { z } from "zod";
import { uploadFieldsSchema } from "./measurements";
import { deviceClasses, deviceClassLabels } from "@/lib/domain/device-classes";
import { uploadConditionFields } from "@/templates/upload-conditions";
import {
  benchUploadResponseSchema,
  catalogHitSchema,
  errorBodySchema,
  measurementSetPathParamsSchema,
  measurementSetResponseSchema,
  measurementSetSchema,
  readinessResponseSchema,
  releasedSheetResponseSchema,
  revisionSummarySchema,
  sheetPathParamsSchema,
  sheetsSearchParamsSchema,
  sheetsSearchResponseSchema,
  verifyAnswerSchema,
  verifyParamsSchema,
  verifyResponseSchema,
} from "./api-v1";
import { proseBlockSchema, proseInlineSchema, sheetModelSchema } from "./sheet-model";

/**
 * The OpenAPI 3.1 document of the versioned public API (GET /api/v1/openapi.json), generated from
 * the zod schemas the handlers use (lib/schemas/api-v1.ts, the upload's `uploadFieldsSchema`) with
 * zod's own `z.toJSONSchema` (JSON Schema 2020-12, which OpenAPI 3.1 uses as is). Pure.
 */

type JsonSchema = Record<string, unknown>;
export type OpenApiDocument = { openapi: "3.1.1"; info: Record<string, unknown>; paths: Record<string, unknown>; components: Record<string, unknown> } & Record<string, unknown>;

/** The named schemas, in components.schemas; every other schema is inlined where it is used. */
const components = {
  ErrorBody: errorBodySchema,
  SheetsSearchResponse: sheetsSearchResponseSchema,
  CatalogHit: catalogHitSchema,
  ReleasedSheetResponse: releasedSheetResponseSchema,
  RevisionSummary: revisionSummarySchema,
  SheetModel: sheetModelSchema,
  ProseBlock: proseBlockSchema,
  ProseInline: proseInlineSchema,
  VerifyResponse: verifyResponseSchema,
  VerifyAnswer: verifyAnswerSchema,
  BenchUploadResponse: benchUploadResponseSchema,
  MeasurementSet: measurementSetSchema,
  ReadinessResponse: readinessResponseSchema,
  MeasurementSetResponse: measurementSetResponseSchema,
} as const;

const ref = (name: keyof typeof components) => ({ $ref: `#/components/schemas/${name}` });

/** components.schemas: one JSON Schema per named zod schema, references between them as $ref. */
function componentSchemas(): Record<string, JsonSchema> {
  const registry = z.registry<{ id: string }>();
  for (const [id, schema] of Object.entries(components)) registry.add(schema, { id });
  const { schemas } = z.toJSONSchema(registry, { uri: (id) => `#/components/schemas/${id}`, io: "output", cycles: "ref", reused: "inline" });
  return Object.fromEntries(
    Object.entries(schemas).map(([id, schema]) => {
      const { $schema: _dialect, $id: _id, ...rest } = schema as JsonSchema;
      return [id, rest as JsonSchema];
    }),
  );
}

/** Query or path parameters from a zod object: one entry per field, its JSON Schema and description. */
function parameters(schema: z.ZodObject, where: "query" | "path"): JsonSchema[] {
  const json = z.toJSONSchema(schema, { io: "input" }) as { properties: Record<string, JsonSchema>; required?: string[] };
  return Object.entries(json.properties).map(([name, property]) => {
    const { description, ...rest } = property;
    return {
      name,
      in: where,
      required: where === "path" || (json.required ?? []).includes(name),
      ...(description ? { description } : {}),
      schema: rest,
      ...(rest.type === "array" ? { style: "form", explode: true } : {}),
    };
  });
}

/** Which condition fields each device class takes (templates/<class>/conditions.ts); another class's field is a 422. */
function classConditionsDescription(): string {
  const lines = deviceClasses.map((c) => `- ${deviceClassLabels[c]}: ${uploadConditionFields(c).map((f) => `\`${f}\``).join(", ")}`);
  return ["Besides the unit, temperature, date, notes and measurement settings, each device class states its own conditions; a condition field of another class is refused (422 naming it):", ...lines].join("\n");
}

/** The bench upload's multipart fields: the upload schema's own, each sent as text, plus the file and the part number. */
function benchUploadForm(): JsonSchema {
  const json = z.toJSONSchema(uploadFieldsSchema, { io: "input", unrepresentable: "any" }) as { properties: Record<string, JsonSchema> };
  const asText = (property: JsonSchema): JsonSchema => {
    if (property.type === "array") return { ...property, items: asText((property.items as JsonSchema) ?? {}) };
    return property.type || property.anyOf ? property : { type: "string", ...property };
  };
  return {
    type: "object",
    required: ["file", "device"],
    properties: {
      file: { type: "string", contentMediaType: "application/octet-stream", description: "The bench file (fixtures/FORMATS.md)." },
      device: { type: "string", maxLength: 64, description: "The part number of a device of the token's organization." },
      ...Object.fromEntries(Object.entries(json.properties).map(([name, property]) => [name, asText(property)])),
    },
  };
}

const json = (schema: JsonSchema, description: string, headers?: Record<string, unknown>) => ({
  description,
  ...(headers ? { headers } : {}),
  content: { "application/json": { schema } },
});
const refusal = (description: string) => json(ref("ErrorBody"), description);
const unavailable = refusal("The database cannot be reached; try again (Retry-After).");

const revisionHeaders = {
  ETag: { schema: { type: "string" } },
  "X-Benchfold-Revision": { description: "The revision letter answered.", schema: { type: "string" } },
  "X-Benchfold-Standing": { description: "current, superseded or withdrawn.", schema: { type: "string", enum: ["current", "superseded", "withdrawn"] } },
};

type Parameter = { name: string; in: "path" | "query"; required: boolean; description?: string; schema: Record<string, unknown> };

/**
 * One download of a released revision, `/api/v1/sheets/{org}/{part}/{rev}/<suffix>`: the sheet's path
 * parameters, If-None-Match, and the same 200 (with the revision headers), 304, 404 and 503.
 */
function sheetDownloadPath(opts: {
  suffix: string;
  operationId: string;
  summary: string;
  description?: string;
  path?: Parameter[];
  query?: Parameter[];
  mediaType: string;
  okDescription: string;
  notFound: string;
}) {
  return {
    [`/api/v1/sheets/{org}/{part}/{rev}/${opts.suffix}`]: {
      get: {
        operationId: opts.operationId,
        summary: opts.summary,
        ...(opts.description ? { description: opts.description } : {}),
        parameters: [
          ...parameters(sheetPathParamsSchema, "path"),
          ...(opts.path ?? []),
          ...(opts.query ?? []),
          { name: "If-None-Match", in: "header", required: false, schema: { type: "string" } },
        ],
        responses: {
          "200": {
            description: opts.okDescription,
            headers: revisionHeaders,
            content: { [opts.mediaType]: { schema: opts.mediaType === "text/csv" ? { type: "string" } : { type: "string", contentMediaType: opts.mediaType } } },
          },
          "304": { description: "Unchanged since the ETag sent.", headers: revisionHeaders },
          "404": refusal(opts.notFound),
          "503": unavailable,
        },
      },
    },
  };
}

let built: OpenApiDocument | null = null;

export function buildOpenApiDocument(): OpenApiDocument {
  if (built) return built;
  const sheetPath = parameters(sheetPathParamsSchema, "path");
  built = {
    openapi: "3.1.1",
    info: {
      title: "Benchfold public API",
      version: "1",
      description:
        "Released characterization sheets (catalog search, the frozen sheet model, the stored PDF, the specifications as CSV, the Touchstone files behind them), printout verification, and the bench upload and read-back. " +
        "Every refusal is a 4xx with `{ error: { code, message, details? } }`.",
    },
    jsonSchemaDialect: "https://json-schema.org/draft/2020-12/schema",
    paths: {
      "/api/v1/sheets": {
        get: {
          operationId: "searchSheets",
          summary: "Search released sheets (the catalog's search)",
          parameters: parameters(sheetsSearchParamsSchema, "query"),
          responses: {
            "200": json(ref("SheetsSearchResponse"), "A page of results with the counts per class and organization."),
            "422": refusal("A query that cannot be read; `details.fields` names each field."),
            "503": unavailable,
          },
        },
      },
      "/api/v1/sheets/{org}/{part}/{rev}": {
        get: {
          operationId: "getReleasedSheet",
          summary: "A released revision's sheet model as versioned JSON",
          parameters: [...sheetPath, { name: "If-None-Match", in: "header", required: false, schema: { type: "string" } }],
          responses: {
            "200": json(ref("ReleasedSheetResponse"), "The revision, its history and its frozen model.", revisionHeaders),
            "304": { description: "Unchanged since the ETag sent.", headers: revisionHeaders },
            "404": refusal("No such organization, part or released revision."),
            "503": unavailable,
          },
        },
      },
      ...sheetDownloadPath({
        suffix: "pdf",
        operationId: "getReleasedSheetPdf",
        summary: "The stored PDF of a released revision",
        mediaType: "application/pdf",
        query: [{ name: "download", in: "query", required: false, description: "`1`: as an attachment.", schema: { type: "string", enum: ["1"] } }],
        okDescription: "The same bytes on every download; the ETag is their SHA-256. A lettered revision is cached for a year, `current` revalidated.",
        notFound: "No such organization, part or released revision.",
      }),
      ...sheetDownloadPath({
        suffix: "csv",
        operationId: "getReleasedSheetCsv",
        summary: "A released revision's specification table as CSV",
        description:
          "RFC 4180 (CRLF, UTF-8 with a byte-order mark): parameter, symbol, one column per condition column of the sheet, min, typ, max as printed (hyphen-minus), unit, basis, whether typ is the measured mean, units measured. Text a spreadsheet would run as a formula starts with an apostrophe.",
        mediaType: "text/csv",
        okDescription: "The table of the frozen model; the ETag is the SHA-256 of the text. A lettered revision is cached for a year, `current` and a withdrawn one revalidated.",
        notFound: "No such organization, part or released revision.",
      }),
      ...sheetDownloadPath({
        suffix: "touchstone/{setId}",
        operationId: "getReleasedTouchstone",
        summary: "The raw Touchstone file of one S-parameter set a released revision rests on",
        description:
          "The set ids are the `touchstone` entries of the model's `traceability.measurementSets`. The bytes are exactly as uploaded; the file is named `<part>_rev<letter>_<serial>_<temperature>.sNp`.",
        path: [{ name: "setId", in: "path", required: true, description: "A measurement set id the revision's traceability lists.", schema: { type: "string", pattern: "^[0-9]+$" } }],
        mediaType: "application/octet-stream",
        okDescription: "The stored bytes; the ETag is their SHA-256. A lettered revision is cached for a year, `current` and a withdrawn one revalidated.",
        notFound: "No such released revision, or a set it does not rest on.",
      }),
      ...sheetDownloadPath({
        suffix: "touchstone/median/{group}",
        operationId: "getReleasedMedianTouchstone",
        summary: "The median unit of a released revision's Touchstone sets of one condition",
        description:
          "Offered where two or more units were measured at one temperature with one port count. Written by the engine as Touchstone 1.1 (`# Hz S DB R <ohms>`): at each frequency and for each S(i,j), the median across units of |S| in dB and of the phase unwrapped along frequency; each unit counts once, by its latest set. Named `<part>_rev<letter>_median-of-<n>_<temperature>.sNp`.",
        path: [{ name: "group", in: "path", required: true, description: "The condition: temperature and port count, e.g. `25C-s4p`, `-40C-s2p`, `nominal-s3p`.", schema: { type: "string", pattern: "^[A-Za-z0-9.-]+-s[0-9]+p$" } }],
        mediaType: "application/octet-stream",
        okDescription: "The merged file; the ETag is the SHA-256 of its text. A lettered revision is cached for a year, `current` and a withdrawn one revalidated.",
        notFound: "No such released revision, or no condition with two or more units of this name.",
      }),
      "/api/v1/verify": {
        get: {
          operationId: "verifyPrintout",
          summary: "Which released revision a PDF or printout is, and its standing",
          description: "Exactly one of `sha256` and `reference`.",
          parameters: parameters(verifyParamsSchema, "query"),
          responses: {
            "200": json(ref("VerifyResponse"), "A released revision."),
            "404": refusal("Not a released Benchfold sheet."),
            "422": refusal("Neither or both parameters, or one that is not of its form."),
            "503": unavailable,
          },
        },
      },
      "/api/v1/measurements": {
        post: {
          operationId: "uploadMeasurement",
          summary: "Upload a bench file (bench token)",
          description: classConditionsDescription(),
          security: [{ benchToken: [] }],
          requestBody: { required: true, content: { "multipart/form-data": { schema: benchUploadForm() } } },
          responses: {
            "201": json(ref("BenchUploadResponse"), "Stored, awaiting review."),
            "400": refusal("The multipart body cannot be read."),
            "401": refusal("No bench token, or an unknown or revoked one."),
            "404": refusal("No device with that part number in the token's organization."),
            "409": refusal("The same file is stored for the device already."),
            "413": refusal("The file is over the size limit."),
            "415": refusal("Not multipart/form-data."),
            "422": refusal("A field or the file's content is wrong; the message names file, line and column where it can."),
            "429": refusal("Too many uploads; wait."),
            "503": unavailable,
          },
        },
      },
      "/api/health/ready": {
        get: {
          operationId: "getReadiness",
          summary: "Readiness of this app instance, for a load balancer",
          description:
            "Checks the database (a `SELECT 1`), the file storage (a HEAD of its S3 bucket) and the mail relay (it greets with 220), " +
            "each within BENCHFOLD_READY_TIMEOUT_MS (2 s). 503 from the moment the instance begins to shut down. Never cached (`no-store`); no session. " +
            "Liveness (the process answers, no checks) is `GET /api/health/live`.",
          responses: {
            "200": json(ref("ReadinessResponse"), "Ready: every check passed."),
            "503": json(ref("ReadinessResponse"), "Not ready: `notReady` names each failing check, or `instance` while it shuts down.", {
              "Retry-After": { schema: { type: "string" } },
            }),
          },
        },
      },
      "/api/v1/measurements/{id}": {
        get: {
          operationId: "getMeasurementSet",
          summary: "Read back one measurement set of the token's organization (bench token)",
          description: "The same answer as the upload's: the set as it stands now (state, review, parameters) and every value per point.",
          security: [{ benchToken: [] }],
          parameters: parameters(measurementSetPathParamsSchema, "path"),
          responses: {
            "200": json(ref("MeasurementSetResponse"), "The set and its per-point tables."),
            "401": refusal("No bench token, or an unknown or revoked one."),
            "404": refusal("No such set in the token's organization (another organization's set is not found either)."),
            "503": unavailable,
          },
        },
      },
    },
    components: {
      schemas: componentSchemas(),
      securitySchemes: {
        benchToken: { type: "http", scheme: "bearer", description: "A bench token an administrator made at /admin/bench-tokens." },
      },
    },
  };
  return built;
}
