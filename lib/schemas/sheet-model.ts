import { z } from "zod";
import { limitBases, proseSectionIds, revisionStates } from "@/lib/domain/sheets";
import type { ProseBlock, ProseInline, SheetModel } from "@/lib/sheet/types";
import type { Same } from "./same-type";

/**
 * The sheet model (lib/sheet/types.ts) as a zod schema: what GET /api/v1/sheets/{org}/{part}/{rev}
 * answers as `sheet`, and what /api/v1/openapi.json publishes for it. The TypeScript types stay the
 * model's own; the check at the foot of this file fails the type check when the two part ways.
 */

const formattedValue = z.object({
  value: z.number().nullable(),
  text: z.string().meta({ description: "The number as printed (U+2212 minus), without unit; empty when absent." }),
});

export const proseInlineSchema: z.ZodType<ProseInline> = z.lazy(() =>
  z.discriminatedUnion("type", [
    z.object({ type: z.literal("text"), value: z.string() }),
    z.object({ type: z.literal("strong"), children: z.array(proseInlineSchema) }),
    z.object({ type: z.literal("emphasis"), children: z.array(proseInlineSchema) }),
    z.object({ type: z.literal("code"), value: z.string() }),
    z.object({ type: z.literal("link"), href: z.string(), children: z.array(proseInlineSchema) }),
    z.object({ type: z.literal("break") }),
  ]),
);

export const proseBlockSchema: z.ZodType<ProseBlock> = z.lazy(() =>
  z.discriminatedUnion("type", [
    z.object({ type: z.literal("paragraph"), children: z.array(proseInlineSchema) }),
    z.object({ type: z.literal("heading"), children: z.array(proseInlineSchema) }),
    z.object({ type: z.literal("list"), ordered: z.boolean(), items: z.array(z.array(proseBlockSchema)) }),
    z.object({ type: z.literal("code"), value: z.string() }),
    z.object({ type: z.literal("quote"), children: z.array(proseBlockSchema) }),
  ]),
);

const groupIdentity = {
  groupId: z.string(),
  rowId: z.string(),
  parameter: z.string(),
  conditionsKey: z.string(),
  label: z.string(),
  symbol: z.string(),
  unit: z.string(),
};

const flagCodes = [
  "cpk-below-threshold",
  "unit-outside-acceptance",
  "insufficient-data",
  "limit-without-data",
  "limit-unit-mismatch",
  "guard-band-closes-acceptance",
] as const;

const sampleFigures = {
  n: z.number().int(),
  lots: z.number().int(),
  mean: formattedValue,
  standardDeviation: formattedValue,
  median: formattedValue,
  min: formattedValue,
  max: formattedValue,
  toleranceInterval: z.object({ lower: formattedValue, upper: formattedValue, factor: formattedValue }).nullable(),
  cpk: formattedValue,
  cpkInterval: z.object({ lower: formattedValue, upper: formattedValue }).optional(),
  expandedUncertainty: formattedValue,
  decisionRule: z.enum(["guard-band", "simple-acceptance"]).nullable(),
  acceptance: z.object({ lower: formattedValue, upper: formattedValue }).nullable(),
  passCount: z.number().int(),
  failCount: z.number().int(),
  units: z.array(
    z.object({
      serial: z.string(),
      lot: z.string().nullable(),
      setId: z.string(),
      value: formattedValue,
      decision: z.enum(["pass", "fail"]).nullable(),
      conditional: z.boolean(),
    }),
  ),
  flags: z.array(z.object({ code: z.enum(flagCodes), message: z.string() })),
};

const specTableRow = z.object({
  ...groupIdentity,
  conditions: z.array(z.string()),
  min: formattedValue,
  typ: formattedValue,
  max: formattedValue,
  typIsMeasuredMean: z.boolean(),
  basis: z.enum(limitBases),
  basisMark: z.string(),
  footnoteMarks: z.array(z.string()),
  n: z.number().int(),
  supported: z.boolean(),
});

const statisticsGroup = z.object({
  ...groupIdentity,
  cpkAbsentReason: z.string().optional(),
  ...sampleFigures,
  conditionsText: z.string(),
  limits: z.object({ min: formattedValue, typ: formattedValue, max: formattedValue, basis: z.enum(limitBases) }).nullable(),
  supported: z.boolean(),
});

const chartSpec = z.object({
  id: z.string(),
  title: z.string(),
  caption: z.string(),
  description: z.string(),
  unitCount: z.number().int(),
  vegaLite: z.record(z.string(), z.unknown()).meta({ description: "A complete Vega-Lite 6 specification with its data inlined." }),
});

export const sheetSignatureSchema = z.object({
  name: z.string(),
  role: z.string(),
  organizationName: z.string(),
  signedAt: z.string().meta({ description: "UTC, ISO 8601 to the second." }),
  meaning: z.string(),
  candidateDigest: z.string().meta({ description: "SHA-256 (hex) of the candidate sheet model the signer reviewed." }),
});

const sheetRelease = z.object({
  revisionLabel: z.string(),
  releasedOn: z.string(),
  signatures: z.array(sheetSignatureSchema),
  verificationReference: z.string(),
  verificationUrl: z.string(),
  notes: z.array(z.string()),
});

const labelled = z.object({ label: z.string(), value: z.string(), unit: z.string() });

export const sheetModelSchema = z
  .object({
    schemaVersion: z.literal(1),
    template: z.object({ deviceClass: z.string(), label: z.string(), statedDriveDbm: z.number().optional().describe("Per-port drive (dBm) the drive-held rows are read at; a multiplier's only.") }),
    header: z.object({
      partNumber: z.string(),
      title: z.string(),
      organizationName: z.string(),
      deviceClassLabel: z.string(),
      description: z.string(),
      revisionText: z.string(),
      revisionLabel: z.string().nullable(),
      state: z.enum(revisionStates),
      stateLabel: z.string(),
      date: z.string(),
      released: z.boolean(),
      banner: z.string().nullable(),
    }),
    keyFacts: z.array(labelled),
    noDataNotice: z.string().nullable(),
    specifications: z.object({
      conditionColumns: z.array(z.object({ id: z.string(), label: z.string() })),
      rows: z.array(specTableRow),
      notes: z.array(z.string()),
      basisLegend: z.array(z.object({ basis: z.enum(limitBases), mark: z.string(), text: z.string() })),
      footnotes: z.array(z.object({ mark: z.string(), text: z.string() })),
    }),
    absoluteMaximumRatings: z.array(labelled.extend({ missing: z.boolean() })),
    designData: z
      .object({
        packageOutline: z
          .object({ caption: z.string(), sha256: z.string(), widthPx: z.number().int(), heightPx: z.number().int(), dataUri: z.string().meta({ description: "The drawing as a PNG data URI." }) })
          .nullable(),
        pinFunctions: z.array(z.object({ pin: z.string(), name: z.string(), function: z.string() })),
        ordering: z.array(z.object({ partNumber: z.string(), options: z.string(), packing: z.string() })),
        recommendedOperatingConditions: z.array(
          z.object({ parameter: z.string(), min: formattedValue, typ: formattedValue, max: formattedValue, unit: z.string() }),
        ),
      })
      .optional()
      .meta({ description: "What a designer needs beside the specifications; absent on sheets released before it was kept." }),
    charts: z.array(chartSpec),
    prose: z.array(
      z.object({
        id: z.enum(proseSectionIds),
        title: z.string(),
        html: z.string().meta({ description: "Sanitized HTML." }),
        blocks: z.array(proseBlockSchema),
        isDefault: z.boolean(),
      }),
    ),
    cautions: z.array(z.string()),
    traceability: z.object({
      measurementSets: z.array(
        z.object({ id: z.string(), kind: z.string(), serial: z.string(), lot: z.string().nullable(), temperature: z.string(), measuredOn: z.string() }),
      ),
      instruments: z.array(
        z.object({
          kind: z.string(),
          model: z.string(),
          serial: z.string(),
          calibratedOn: z.string(),
          calibrationDueOn: z.string(),
          uncertainty: z.array(z.string()),
          setCount: z.number().int(),
          calibrationLapsed: z.boolean(),
        }),
      ),
      statements: z.array(z.string()),
    }),
    statistics: z.object({
      coverage: z.number(),
      confidence: z.number(),
      cpkThreshold: z.number(),
      cpkMinUnits: z.number().int().optional(),
      method: z.string(),
      decisionRules: z.array(z.string()),
      groups: z.array(statisticsGroup),
      flaggedGroupCount: z.number().int(),
    }),
    revisionHistory: z.array(z.object({ label: z.string(), date: z.string(), summary: z.string() })),
    release: sheetRelease.nullable(),
    issues: z.array(z.object({ code: z.string(), message: z.string() })),
    reviewChecks: z.array(z.string()).optional(),
  })
  .meta({ description: "The frozen sheet model of a released revision: everything the web sheet and the PDF draw." });

// The schema and the model's type must describe the same thing (tsc fails here otherwise).
const sheetModelSchemaMatches: Same<z.infer<typeof sheetModelSchema>, SheetModel> = true;
void sheetModelSchemaMatches;
