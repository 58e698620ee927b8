/**
 * What changed between two sheet models (the last released revision and a candidate): the
 * review's change list, the release notes and the "why your candidate went stale" message all
 * read it. Plain JSON, so a page can hand it to a client component as it is.
 */
import type { FormattedValue, LimitBasis, ProseSectionId, SheetModel } from "./types";

/** What a change does to a guaranteed limit. "incomparable": the units differ and do not convert. */
export type LimitEffect = "tightened" | "loosened" | "neutral" | "incomparable";

/** Which way a figure moved; null when it appeared, went away or cannot be compared. */
export type ChangeDirection = "up" | "down" | null;

export type LimitField = "min" | "typ" | "max";

/** The figures of one spec-table row as one revision printed them. */
export interface SpecRowFigures {
  min: FormattedValue;
  typ: FormattedValue;
  max: FormattedValue;
  unit: string;
  basis: LimitBasis;
  /** True when typ is the measured mean rather than a stated typical value. */
  typIsMeasuredMean: boolean;
  /** Units behind the row (the statistics annex has the data). */
  n: number;
}

/** A changed min, typ or max. Texts are as printed with their unit ("9.00 dB"), or "" when absent. */
export interface LimitFieldChange {
  field: LimitField;
  previous: FormattedValue;
  next: FormattedValue;
  previousText: string;
  nextText: string;
  direction: ChangeDirection;
  effect: LimitEffect;
  /** A typ that is the measured mean on both sides: it moves with the data, not by anyone's decision. */
  measuredMean: boolean;
}

export type SpecRowFieldChange =
  | LimitFieldChange
  | {
      field: "unit";
      previous: string;
      next: string;
      /** The units differ only by an SI prefix (MHz → GHz), so the limits were compared after conversion. */
      convertible: boolean;
    }
  | { field: "conditions"; previous: string; next: string }
  | { field: "footnotes"; previous: string[]; next: string[] };

/** Which row a change is about: the spec table's row under one condition group. */
export interface SpecRowRef {
  /** `${rowId}:${conditionsKey}`: the key rows are matched by. */
  groupId: string;
  rowId: string;
  conditionsKey: string;
  label: string;
  symbol: string;
  /** "Frequency 2 GHz in, T_A 25 °C", as the statistics annex names the group. */
  conditionsText: string;
  /** The HTML id the review's change list gives this row (diffRowAnchorId), for comment links. */
  anchorId: string;
}

/**
 * One row of the review's change list. A row is "tightened" if any of its limits tightened (even
 * if another loosened: it is listed first so it is read first), "loosened" if any loosened and none
 * tightened, "changed" otherwise (typ, unit, conditions or footnotes only).
 */
export interface SpecRowChange extends SpecRowRef {
  kind: "tightened" | "loosened" | "added" | "removed" | "changed";
  /** The changed fields, in the order min, typ, max, unit, conditions, footnotes; empty when added or removed. */
  fields: SpecRowFieldChange[];
  previous: SpecRowFigures | null;
  next: SpecRowFigures | null;
}

export interface BasisChange extends SpecRowRef {
  previous: LimitBasis;
  next: LimitBasis;
}

export interface ProseDiffPart {
  text: string;
  change: "same" | "inserted" | "deleted";
}

/** A prose section whose words changed; unchanged sections are left out. */
export interface ProseChange {
  sectionId: ProseSectionId;
  /** The HTML id the review gives this section (diffProseAnchorId). */
  anchorId: string;
  title: string;
  parts: ProseDiffPart[];
  insertedWords: number;
  deletedWords: number;
}

export type RatingFigures = Pick<SheetModel["absoluteMaximumRatings"][number], "value" | "unit" | "missing">;

export interface RatingChange {
  label: string;
  kind: "added" | "removed" | "changed";
  previous: RatingFigures | null;
  next: RatingFigures | null;
}

export type MeasurementSetRef = SheetModel["traceability"]["measurementSets"][number];

/** A header or key-fact line that changed (title, description, part number, a key condition). */
export interface DetailChange {
  label: string;
  previous: string | null;
  next: string | null;
}

/** One plot of an overlay: both revisions' typical curves of one series on the same axes. */
export interface ChartOverlayPanel {
  /** Unique within the diff: the chart id, with the series when a chart is split by series. */
  id: string;
  /** The HTML id the review gives this panel (diffChartAnchorId). */
  anchorId: string;
  /** The series label when the chart has several ("2nd harmonic (×2)"), else null. */
  series: string | null;
  title: string;
  /** Words for screen readers: what is drawn, from how many units. */
  description: string;
  previousUnitCount: number;
  nextUnitCount: number;
  /** False when both typical curves are the same to the plotted precision. */
  changed: boolean;
  /** A complete Vega-Lite 6 specification (screen look) from lib/charts, data inlined. */
  vegaLite: Record<string, unknown>;
}

export interface ChartOverlay {
  chartId: string;
  title: string;
  presence: "both" | "previous-only" | "next-only";
  panels: ChartOverlayPanel[];
}

/** The four design-in sections of a sheet (DEVELOPERS.md "Design-in data"). */
export type DesignInSection = "pins" | "ordering" | "conditions" | "outline";

/**
 * One row of a design-in section that was added, removed or changed: a pin (matched by its pin
 * number, or its name when it has none), an ordering entry (by part number), an operating condition
 * (by parameter) or the package outline (its drawing compared by SHA-256, its caption by text).
 */
export interface DesignInChange {
  section: DesignInSection;
  kind: "added" | "removed" | "changed";
  /** What the row is known by: "Pin 1", "KM-7H-TR1", "LO drive", "Drawing and caption" (the outline's one row). */
  key: string;
  /** The row as printed, one line ("LO · Local-oscillator input"; "min 5, typ 7, max 10 dBm"; the outline's caption); null when absent. */
  previous: string | null;
  next: string | null;
  /** What changed in a changed row, in the section's column order: "name", "function", "min", "drawing", "caption", … */
  fields: string[];
}

export interface SheetDiff {
  /** True when there is no previous revision: everything else is then empty. */
  firstRelease: boolean;
  /** How the two sides are named in the view and the charts: "Rev. A", "Candidate". */
  previousLabel: string | null;
  nextLabel: string;
  /** Tightened, then loosened, then added, removed, other changes; within each, in table order. */
  rows: SpecRowChange[];
  basisChanges: BasisChange[];
  prose: ProseChange[];
  ratings: RatingChange[];
  /** Operating conditions, the outline, pins, ordering (the sheet's order); within each, added and changed in the sheet's order, then removed. */
  designIn: DesignInChange[];
  cautions: { added: string[]; removed: string[] };
  measurementSets: { added: MeasurementSetRef[]; removed: MeasurementSetRef[] };
  details: DetailChange[];
  charts: ChartOverlay[];
}

export interface DiffSheetModelsOptions {
  /** Default: "Rev. <letter>" of the previous model, or "Previous" when it has none. */
  previousLabel?: string;
  /** Default: "Candidate". */
  nextLabel?: string;
}
