/**
 * The review diff: a candidate sheet model against the last released revision's frozen model
 * (or against nothing, for a first release). Pure and deterministic: the same two models give
 * the same diff, byte for byte.
 */
import { diffWords } from "diff";
import { joinUnit, MINUS, splitPrefixedUnit } from "../format/quantity";
import { diffProseAnchorId, diffRowAnchorId } from "./diff-anchors";
import { overlayCharts } from "./diff-charts";
import { diffDesignIn } from "./diff-design-in";
import type {
  BasisChange,
  ChangeDirection,
  DetailChange,
  DiffSheetModelsOptions,
  LimitEffect,
  LimitField,
  LimitFieldChange,
  ProseChange,
  ProseDiffPart,
  RatingChange,
  SheetDiff,
  SpecRowChange,
  SpecRowFieldChange,
  SpecRowFigures,
  SpecRowRef,
} from "./diff-types";
import { roundStable } from "./format";
import { proseToPlainText } from "./render-prose";
import type { FormattedValue, SheetModel, SpecTableRow } from "./types";

export * from "./diff-types";
export { summaryLines } from "./diff-summary";
export { diffIsEmpty, rowMovedWithDataOnly } from "./diff-queries";
export { diffChartAnchorId, diffProseAnchorId, diffRowAnchorId } from "./diff-anchors";

/**
 * What changed from `previous` (a released revision's frozen model, or null for a first release)
 * to `next` (the candidate). The labels name the two sides in the view and on the overlays.
 */
export function diffSheetModels(previous: SheetModel | null, next: SheetModel, options: DiffSheetModelsOptions = {}): SheetDiff {
  const nextLabel = options.nextLabel ?? "Candidate";
  if (!previous) {
    return {
      firstRelease: true,
      previousLabel: null,
      nextLabel,
      rows: [],
      basisChanges: [],
      prose: [],
      ratings: [],
      designIn: [],
      cautions: { added: [], removed: [] },
      measurementSets: { added: [], removed: [] },
      details: [],
      charts: [],
    };
  }
  const previousLabel = options.previousLabel ?? defaultPreviousLabel(previous);
  const { rows, basisChanges } = diffSpecRows(previous, next);
  return {
    firstRelease: false,
    previousLabel,
    nextLabel,
    rows,
    basisChanges,
    prose: diffProse(previous, next),
    ratings: diffRatings(previous, next),
    designIn: diffDesignIn(previous.designData, next.designData),
    cautions: diffLists(previous.cautions, next.cautions),
    measurementSets: diffMeasurementSets(previous, next),
    details: diffDetails(previous, next),
    charts: overlayCharts(previous, next, { previousLabel, nextLabel }),
  };
}

function defaultPreviousLabel(previous: SheetModel): string {
  const letter = previous.release?.revisionLabel ?? previous.header.revisionLabel;
  return letter ? `Rev. ${letter}` : "Previous";
}

/* ---------- spec-table rows ---------- */

const KIND_ORDER: Record<SpecRowChange["kind"], number> = { tightened: 0, loosened: 1, added: 2, removed: 3, changed: 4 };

function diffSpecRows(previous: SheetModel, next: SheetModel): { rows: SpecRowChange[]; basisChanges: BasisChange[] } {
  const before = new Map(previous.specifications.rows.map((row, index) => [row.groupId, { row, index }]));
  const after = new Map(next.specifications.rows.map((row, index) => [row.groupId, { row, index }]));
  const found: { change: SpecRowChange; order: number }[] = [];
  const basisChanges: { change: BasisChange; order: number }[] = [];

  for (const [groupId, { row, index }] of after) {
    const old = before.get(groupId);
    const ref = rowRef(row, next);
    if (!old) {
      found.push({ change: { ...ref, kind: "added", fields: [], previous: null, next: rowFigures(row) }, order: index });
      continue;
    }
    const fields = diffRowFields(old.row, previous, row, next);
    if (fields.length > 0) {
      found.push({ change: { ...ref, kind: rowKind(fields), fields, previous: rowFigures(old.row), next: rowFigures(row) }, order: index });
    }
    if (old.row.basis !== row.basis) basisChanges.push({ change: { ...ref, previous: old.row.basis, next: row.basis }, order: index });
  }
  // Removed rows follow the added ones; among themselves, in the previous table's order.
  for (const [groupId, { row, index }] of before) {
    if (after.has(groupId)) continue;
    found.push({ change: { ...rowRef(row, previous), kind: "removed", fields: [], previous: rowFigures(row), next: null }, order: index });
  }

  found.sort((a, b) => KIND_ORDER[a.change.kind] - KIND_ORDER[b.change.kind] || a.order - b.order);
  basisChanges.sort((a, b) => a.order - b.order);
  return { rows: found.map((f) => f.change), basisChanges: basisChanges.map((b) => b.change) };
}

function rowRef(row: SpecTableRow, model: SheetModel): SpecRowRef {
  return {
    groupId: row.groupId,
    rowId: row.rowId,
    conditionsKey: row.conditionsKey,
    label: row.label,
    symbol: row.symbol,
    conditionsText: conditionsText(row, model),
    anchorId: diffRowAnchorId(row.groupId),
  };
}

/** "Label value" for each condition column the row has a value in, as the statistics annex writes it. */
function conditionsText(row: SpecTableRow, model: SheetModel): string {
  return model.specifications.conditionColumns
    .map((column, i) => (row.conditions[i] ? `${column.label} ${row.conditions[i]}` : ""))
    .filter(Boolean)
    .join(", ");
}

function rowFigures(row: SpecTableRow): SpecRowFigures {
  return {
    min: { ...row.min },
    typ: { ...row.typ },
    max: { ...row.max },
    unit: row.unit,
    basis: row.basis,
    typIsMeasuredMean: row.typIsMeasuredMean,
    n: row.n,
  };
}

function rowKind(fields: SpecRowFieldChange[]): SpecRowChange["kind"] {
  const effects = fields.flatMap((f) => ("effect" in f ? [f.effect] : []));
  if (effects.includes("tightened")) return "tightened";
  if (effects.includes("loosened")) return "loosened";
  return "changed";
}

function diffRowFields(oldRow: SpecTableRow, oldModel: SheetModel, newRow: SpecTableRow, newModel: SheetModel): SpecRowFieldChange[] {
  const fields: SpecRowFieldChange[] = [];
  const scale = unitScale(oldRow.unit, newRow.unit);
  for (const field of ["min", "typ", "max"] as const) {
    const change = diffLimit(field, oldRow, newRow, scale);
    if (change) fields.push(change);
  }
  if (oldRow.unit !== newRow.unit) fields.push({ field: "unit", previous: oldRow.unit, next: newRow.unit, convertible: scale !== null });
  const oldConditions = conditionsText(oldRow, oldModel);
  const newConditions = conditionsText(newRow, newModel);
  if (oldConditions !== newConditions) fields.push({ field: "conditions", previous: oldConditions, next: newConditions });
  const oldNotes = footnoteTexts(oldRow, oldModel);
  const newNotes = footnoteTexts(newRow, newModel);
  if (oldNotes.join("\n") !== newNotes.join("\n")) fields.push({ field: "footnotes", previous: oldNotes, next: newNotes });
  return fields;
}

function footnoteTexts(row: SpecTableRow, model: SheetModel): string[] {
  return row.footnoteMarks.map((mark) => model.specifications.footnotes.find((f) => f.mark === mark)?.text ?? "").sort();
}

/**
 * Factors that bring both units to one base: the same unit, or units that differ only by an SI
 * prefix (MHz and GHz). Logarithmic units (dB, dBm, dBc) take no prefix and never convert.
 */
function unitScale(oldUnit: string, newUnit: string): { old: number; new: number } | null {
  if (oldUnit === newUnit) return { old: 1, new: 1 };
  const a = splitPrefixedUnit(oldUnit);
  const b = splitPrefixedUnit(newUnit);
  if (!a || !b || a.base !== b.base) return null;
  return { old: a.factor, new: b.factor };
}

/**
 * The direction and effect of one changed limit. The rule is common practice for guaranteed
 * limits: a guarantee tightens when its window narrows — a lower max or a higher min, or a limit
 * stated where there was none — and loosens the other way, or when a limit is withdrawn. Typ is
 * not a guarantee, so its changes are neutral.
 */
function diffLimit(field: LimitField, oldRow: SpecTableRow, newRow: SpecTableRow, scale: { old: number; new: number } | null): LimitFieldChange | null {
  const previous = oldRow[field];
  const next = newRow[field];
  const base = {
    field,
    previous: { ...previous },
    next: { ...next },
    previousText: figureText(previous.text, oldRow.unit),
    nextText: figureText(next.text, newRow.unit),
    measuredMean: field === "typ" && oldRow.typIsMeasuredMean && newRow.typIsMeasuredMean,
  };
  if (previous.value === null && next.value === null) return null;
  if (previous.value === null || next.value === null) {
    const appeared = previous.value === null;
    const effect: LimitEffect = field === "typ" ? "neutral" : appeared ? "tightened" : "loosened";
    return { ...base, direction: null, effect };
  }
  if (!scale) return { ...base, direction: null, effect: "incomparable" };
  // Compared as printed: a guarantee is what the sheet states, and a measured mean that moved
  // below the printed digits has not changed on the sheet.
  const oldValue = roundStable(printedNumber(previous) * scale.old);
  const newValue = roundStable(printedNumber(next) * scale.new);
  if (oldValue === newValue) return null;
  const direction: ChangeDirection = newValue > oldValue ? "up" : "down";
  return { ...base, direction, effect: limitEffect(field, direction) };
}

/** The figure as the sheet printed it (U+2212 minus read as "-"); its full value if the text does not parse. */
function printedNumber(figure: FormattedValue): number {
  const printed = Number(figure.text.replace(MINUS, "-"));
  return figure.text !== "" && Number.isFinite(printed) ? printed : (figure.value as number);
}

function limitEffect(field: LimitField, direction: "up" | "down"): LimitEffect {
  if (field === "typ") return "neutral";
  if (field === "max") return direction === "down" ? "tightened" : "loosened";
  return direction === "up" ? "tightened" : "loosened";
}

function figureText(text: string, unit: string): string {
  return text ? joinUnit(text, unit) : "";
}

/* ---------- prose, ratings, cautions, sets, details ---------- */

function diffProse(previous: SheetModel, next: SheetModel): ProseChange[] {
  const before = new Map(previous.prose.map((s) => [s.id, s]));
  const sections = [...next.prose, ...previous.prose.filter((s) => !next.prose.some((n) => n.id === s.id))];
  const changes: ProseChange[] = [];
  for (const section of sections) {
    const inNext = next.prose.find((s) => s.id === section.id);
    const oldText = before.has(section.id) ? proseToPlainText(before.get(section.id)!.blocks) : "";
    const newText = inNext ? proseToPlainText(inNext.blocks) : "";
    if (oldText === newText) continue;
    const parts: ProseDiffPart[] = diffWords(oldText, newText).map((c) => ({
      text: c.value,
      change: c.added ? "inserted" : c.removed ? "deleted" : "same",
    }));
    const words = (change: ProseDiffPart["change"]) =>
      parts.filter((p) => p.change === change).reduce((sum, p) => sum + (p.text.match(/\S+/g)?.length ?? 0), 0);
    changes.push({
      sectionId: section.id,
      anchorId: diffProseAnchorId(section.id),
      title: (inNext ?? section).title,
      parts,
      insertedWords: words("inserted"),
      deletedWords: words("deleted"),
    });
  }
  return changes;
}

function diffRatings(previous: SheetModel, next: SheetModel): RatingChange[] {
  const figures = (r: SheetModel["absoluteMaximumRatings"][number]) => ({ value: r.value, unit: r.unit, missing: r.missing });
  const before = new Map(previous.absoluteMaximumRatings.map((r) => [r.label, r]));
  const afterLabels = new Set(next.absoluteMaximumRatings.map((r) => r.label));
  const changes: RatingChange[] = [];
  for (const rating of next.absoluteMaximumRatings) {
    const old = before.get(rating.label);
    if (!old) changes.push({ label: rating.label, kind: "added", previous: null, next: figures(rating) });
    else if (old.value !== rating.value || old.unit !== rating.unit || old.missing !== rating.missing) {
      changes.push({ label: rating.label, kind: "changed", previous: figures(old), next: figures(rating) });
    }
  }
  for (const old of previous.absoluteMaximumRatings) {
    if (!afterLabels.has(old.label)) changes.push({ label: old.label, kind: "removed", previous: figures(old), next: null });
  }
  return changes;
}

function diffLists(previous: string[], next: string[]): { added: string[]; removed: string[] } {
  return { added: next.filter((item) => !previous.includes(item)), removed: previous.filter((item) => !next.includes(item)) };
}

function diffMeasurementSets(previous: SheetModel, next: SheetModel): SheetDiff["measurementSets"] {
  const oldIds = new Set(previous.traceability.measurementSets.map((s) => s.id));
  const newIds = new Set(next.traceability.measurementSets.map((s) => s.id));
  return {
    added: next.traceability.measurementSets.filter((s) => !oldIds.has(s.id)).map((s) => ({ ...s })),
    removed: previous.traceability.measurementSets.filter((s) => !newIds.has(s.id)).map((s) => ({ ...s })),
  };
}

function diffDetails(previous: SheetModel, next: SheetModel): DetailChange[] {
  const changes: DetailChange[] = [];
  const header = [
    ["Part number", previous.header.partNumber, next.header.partNumber],
    ["Title", previous.header.title, next.header.title],
    ["Description", previous.header.description, next.header.description],
  ] as const;
  for (const [label, old, now] of header) if (old !== now) changes.push({ label, previous: old, next: now });
  const fact = (f: SheetModel["keyFacts"][number]) => joinUnit(f.value, f.unit);
  const before = new Map(previous.keyFacts.map((f) => [f.label, fact(f)]));
  const after = new Map(next.keyFacts.map((f) => [f.label, fact(f)]));
  for (const [label, now] of after) if (before.get(label) !== now) changes.push({ label, previous: before.get(label) ?? null, next: now });
  for (const [label, old] of before) if (!after.has(label)) changes.push({ label, previous: old, next: null });
  return changes;
}
