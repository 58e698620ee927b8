/**
 * The sheet model: one JSON document holding everything a characterization
 * sheet shows, built once from the device data and read by both renderers
 * (web and PDF). Renderers lay it out; they compute nothing.
 */

import type { Curve, DerivedParameter } from "../analysis/types";
import type { LimitBasis, ProseSectionId, RevisionState } from "../domain/sheets";

export type { LimitBasis, ProseSectionId, RevisionState };

/** As on a calibration certificate: one stated uncertainty of one quantity. */
export interface InstrumentUncertaintyInput {
  quantity: string;
  value: number;
  unit: string;
  coverageFactor: number;
}

export interface SheetInstrumentInput {
  kind: string;
  model: string;
  serial: string;
  /** ISO dates (YYYY-MM-DD). */
  calibratedOn: string;
  calibrationDueOn: string;
  uncertainty: InstrumentUncertaintyInput[];
}

export interface ApprovedSetInput {
  id: string | number;
  kind: string;
  serial: string;
  lot?: string;
  temperatureC?: number;
  /** ISO date (YYYY-MM-DD). */
  measuredOn: string;
  parameters: DerivedParameter[];
  curves: Curve[];
  instruments: SheetInstrumentInput[];
  /** The set's plausibility warnings (lib/ingest/plausibility.ts): each is an open issue of the sheet it feeds. */
  plausibilityWarnings?: string[];
}

export interface SpecLimitInput {
  parameter: string;
  /** From SheetModel statistics groups (`conditionsKey`): the row's matched and grouping conditions, "k=v;k=v" sorted by key. */
  conditionsKey: string;
  min?: number;
  typ?: number;
  max?: number;
  unit: string;
  basis: LimitBasis;
  footnote?: string;
  /** How many decimals each figure was typed with (lib/format countTypedDecimals): printed with exactly those. */
  decimals?: { min?: number; typ?: number; max?: number };
}

export interface KeyConditionsInput {
  inputFrequencyHz?: { min: number; max: number };
  outputFrequencyHz?: { min: number; max: number };
  driveLevelDbm?: number;
  multiplicationFactor?: number;
}

export interface SheetInput {
  device: {
    partNumber: string;
    deviceClass: string;
    title: string;
    description: string;
    keyConditions: KeyConditionsInput;
    organizationName: string;
  };
  revision: {
    /** Null until released (the letter is assigned at release). */
    label: string | null;
    state: RevisionState;
    /** ISO date (YYYY-MM-DD) printed on the sheet; given, never read from the clock. */
    date: string;
    history: { label: string; date: string; summary: string }[];
  };
  approvedSets: ApprovedSetInput[];
  limits: SpecLimitInput[];
  /** Markdown per prose section; a missing section takes the template's default. */
  prose: Partial<Record<ProseSectionId, string>>;
  absoluteMaximumRatings: { label: string; value: string; unit: string }[];
  /** What a designer needs beside the specifications (lib/sheet/design-data.ts); none stated when absent. */
  designData?: DesignDataInput;
  /** The device's open conformity alerts, each in one sentence: listed among the sheet's open issues. */
  conformityAlerts?: string[];
  settings: {
    /** A limit whose Cpk falls below this is flagged, e.g. 1.33. */
    cpkThreshold: number;
    /** Cpk is stated only from this many units or more (the organization's setting, default 10). */
    cpkMinUnits?: number;
    /** Fewer units than this behind a limit guaranteed by characterization is an open issue (the organization's setting, default 5). */
    limitMinUnits?: number;
    /** Tolerance-interval coverage and confidence, e.g. 0.99 and 0.95. */
    toleranceCoverage: number;
    toleranceConfidence: number;
    /** Expanded uncertainty U (k = 2) per parameter name, in the parameter's unit. */
    measurementUncertainty?: Record<string, number>;
  };
}

/* ---------- what a designer needs ---------- */

export type PinFunction = { pin: string; name: string; function: string };
export type OrderingEntry = { partNumber: string; options: string; packing: string };

export interface DesignDataInput {
  pinFunctions: PinFunction[];
  ordering: OrderingEntry[];
  /** Figures as the engineer typed them (decimal text, blank when not stated). */
  recommendedOperatingConditions: { parameter: string; min: string; typ: string; max: string; unit: string }[];
  /** The drawing as the sheet prints it: a PNG (an SVG upload is rasterised on the server first). */
  packageOutline: { caption: string; sha256: string; widthPx: number; heightPx: number; pngBase64: string } | null;
  /** The outline's caption as saved, also when no drawing is on the sheet yet (the editor shows it; the sheet prints it only with a drawing). */
  packageOutlineCaption?: string;
}

export interface DesignData {
  packageOutline: { caption: string; sha256: string; widthPx: number; heightPx: number; dataUri: string } | null;
  pinFunctions: PinFunction[];
  ordering: OrderingEntry[];
  recommendedOperatingConditions: { parameter: string; min: FormattedValue; typ: FormattedValue; max: FormattedValue; unit: string }[];
}

/* ---------- prose ---------- */

export type ProseInline =
  | { type: "text"; value: string }
  | { type: "strong"; children: ProseInline[] }
  | { type: "emphasis"; children: ProseInline[] }
  | { type: "code"; value: string }
  | { type: "link"; href: string; children: ProseInline[] }
  | { type: "break" };

export type ProseBlock =
  | { type: "paragraph"; children: ProseInline[] }
  | { type: "heading"; children: ProseInline[] }
  | { type: "list"; ordered: boolean; items: ProseBlock[][] }
  | { type: "code"; value: string }
  | { type: "quote"; children: ProseBlock[] };

export interface ProseSection {
  id: ProseSectionId;
  title: string;
  /** Sanitized HTML, for API consumers. */
  html: string;
  /** The same content as a small safe tree: what both renderers draw. */
  blocks: ProseBlock[];
  /** True when the template's default text stands in for the engineer's. */
  isDefault: boolean;
}

/* ---------- model ---------- */

export interface FormattedValue {
  value: number | null;
  /** Number as printed (U+2212 minus), without unit; "" when absent. */
  text: string;
}

export type FlagCode =
  | "cpk-below-threshold"
  | "unit-outside-acceptance"
  | "insufficient-data"
  | "limit-without-data"
  | "limit-unit-mismatch"
  | "guard-band-closes-acceptance";

export interface StatisticsFlag {
  code: FlagCode;
  message: string;
}

export interface UnitResult {
  serial: string;
  lot: string | null;
  setId: string;
  value: FormattedValue;
  decision: "pass" | "fail" | null;
  /** Simple acceptance only: within U of a limit (ILAC-G8:09/2019 §4.2.1). */
  conditional: boolean;
}

/** Which spec row and condition group a figure belongs to: the statistics and the spec table name it alike. */
export interface GroupIdentity {
  groupId: string;
  rowId: string;
  parameter: string;
  conditionsKey: string;
  label: string;
  symbol: string;
  unit: string;
}

/** What the statistics of one group say, formatted: computeGroupStatistics gives it, the sheet shows it. */
export interface SampleFigures {
  n: number;
  lots: number;
  mean: FormattedValue;
  standardDeviation: FormattedValue;
  median: FormattedValue;
  min: FormattedValue;
  max: FormattedValue;
  toleranceInterval: { lower: FormattedValue; upper: FormattedValue; factor: FormattedValue } | null;
  cpk: FormattedValue;
  /** The two-sided confidence interval of a printed Cpk (Bissell 1990), at the sheet's stated confidence; absent otherwise. */
  cpkInterval?: { lower: FormattedValue; upper: FormattedValue };
  expandedUncertainty: FormattedValue;
  decisionRule: "guard-band" | "simple-acceptance" | null;
  acceptance: { lower: FormattedValue; upper: FormattedValue } | null;
  passCount: number;
  failCount: number;
  units: UnitResult[];
  flags: StatisticsFlag[];
}

export interface StatisticsGroup extends GroupIdentity, SampleFigures {
  conditionsText: string;
  limits: { min: FormattedValue; typ: FormattedValue; max: FormattedValue; basis: LimitBasis } | null;
  /** False when a limit is stated that the data does not support. */
  supported: boolean;
  /** Why a limit's Cpk is not stated (too few units to mean something); absent when stated or no limit. */
  cpkAbsentReason?: string;
}

export interface SpecTableRow extends GroupIdentity {
  /** One cell per specifications.conditionColumns entry; "" when the condition does not apply. */
  conditions: string[];
  min: FormattedValue;
  typ: FormattedValue;
  max: FormattedValue;
  /** True when typ is the measured mean rather than a stated typical value. */
  typIsMeasuredMean: boolean;
  basis: LimitBasis;
  basisMark: string;
  footnoteMarks: string[];
  n: number;
  supported: boolean;
}

export interface ChartSpec {
  id: string;
  title: string;
  caption: string;
  /** Words for screen readers and for the PDF's alt text. */
  description: string;
  unitCount: number;
  /** A complete Vega-Lite 6 specification with its data inlined. */
  vegaLite: Record<string, unknown>;
}

/**
 * One electronic signature as printed on a released sheet: who (printed name, role, organization),
 * when (UTC), what it means, and the digest of the candidate it signs — 21 CFR Part 11 §11.50 and §11.70.
 */
export interface SheetSignature {
  name: string;
  /** The signer's role word, e.g. "Reviewer". */
  role: string;
  organizationName: string;
  /** UTC, ISO 8601 to the second: "2026-12-02T09:14:05Z". */
  signedAt: string;
  /** The stated meaning, in words ("Reviewed and approved for release"). */
  meaning: string;
  /** SHA-256 (hex) of the candidate sheet model the signer reviewed. */
  candidateDigest: string;
}

export interface SheetRelease {
  /** The revision letter: "A", "B", … "Z", "AA". */
  revisionLabel: string;
  /** ISO date (YYYY-MM-DD, UTC) of the release. */
  releasedOn: string;
  signatures: SheetSignature[];
  /** A short code printed in the footer; it names the revision's public record. */
  verificationReference: string;
  /** Where that record is: an absolute https:// or http:// address. */
  verificationUrl: string;
  /** Release notes: what changed since the previous revision (generated), then the engineer's note. */
  notes: string[];
}

export interface SheetModel {
  schemaVersion: 1;
  /**
   * The class, and the per-port drive its drive-held rows were read at (a released model's conformity watch
   * reads new sets at the same drive; a model released before the drive was recorded was at the class's default).
   */
  template: { deviceClass: string; label: string; statedDriveDbm?: number };
  header: {
    partNumber: string;
    title: string;
    organizationName: string;
    deviceClassLabel: string;
    description: string;
    /** "Rev. B", or "Unreleased" before a revision letter is given at release. */
    revisionText: string;
    revisionLabel: string | null;
    state: RevisionState;
    stateLabel: string;
    date: string;
    released: boolean;
    /** Present on every page and screen until the revision is released. */
    banner: string | null;
  };
  keyFacts: { label: string; value: string; unit: string }[];
  /**
   * Said where the tables would be when no approved measurement set feeds the sheet yet
   * (the specifications, the traceability and the annex); null once data exist.
   */
  noDataNotice: string | null;
  specifications: {
    conditionColumns: { id: string; label: string }[];
    rows: SpecTableRow[];
    notes: string[];
    basisLegend: { basis: LimitBasis; mark: string; text: string }[];
    footnotes: { mark: string; text: string }[];
  };
  absoluteMaximumRatings: { label: string; value: string; unit: string; missing: boolean }[];
  /** Package outline, pin functions, ordering information, recommended operating conditions (absent on sheets released before they were kept). */
  designData?: DesignData;
  charts: ChartSpec[];
  prose: ProseSection[];
  cautions: string[];
  traceability: {
    measurementSets: {
      id: string;
      kind: string;
      serial: string;
      lot: string | null;
      temperature: string;
      measuredOn: string;
    }[];
    instruments: {
      kind: string;
      model: string;
      serial: string;
      calibratedOn: string;
      calibrationDueOn: string;
      uncertainty: string[];
      setCount: number;
      /** True when some set was measured outside the calibration interval. */
      calibrationLapsed: boolean;
    }[];
    statements: string[];
  };
  statistics: {
    coverage: number;
    confidence: number;
    cpkThreshold: number;
    /** Cpk is stated only from this many units or more (absent on sheets released before it was kept). */
    cpkMinUnits?: number;
    method: string;
    decisionRules: string[];
    groups: StatisticsGroup[];
    flaggedGroupCount: number;
  };
  revisionHistory: { label: string; date: string; summary: string }[];
  /** The release record (revision letter, date, signatures, verification reference); null on a draft or candidate. */
  release: SheetRelease | null;
  /** Problems a reviewer must see before approving (missing ratings, unknown limits, lapsed calibration). */
  issues: { code: string; message: string }[];
  /**
   * Which consistency checks were made before review and what no check can see (lib/sheet/consistency-checks.ts),
   * printed with the review notes of an unreleased sheet; absent on sheets built before it was kept.
   */
  reviewChecks?: string[];
}
