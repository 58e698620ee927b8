import type { ProseSectionId } from "@/lib/sheet/types";
import { parseFigure } from "./parse-figure";
import type { WorkspaceContent, WorkspaceModel, WorkspaceTemplate } from "./workspace-types";

export type RatingDraft = { id: number; label: string; value: string; unit: string };
export type UncertaintyParameter = { parameter: string; label: string; unit: string };

/** The stated ratings, then the class's required ratings not yet stated (labels prefilled, values to enter). */
export function initialRatings(content: WorkspaceContent, template: WorkspaceTemplate): RatingDraft[] {
  const stated = content.absoluteMaximumRatings.map((r, i) => ({ id: i, ...r }));
  const statedLabels = new Set(stated.map((r) => r.label));
  // The class's required ratings not yet stated: their labels prefilled, values to be entered.
  const missing = template.absoluteMaximumRatings
    .filter((r) => !statedLabels.has(r.label))
    .map((r, i) => ({ id: stated.length + i, label: r.label, value: "", unit: r.unit }));
  return [...stated, ...missing];
}

/** The parameters a U can be stated for: those with data, and those that already have a U. */
export function uncertaintyParameters(groups: WorkspaceModel["statistics"]["groups"], stated: Record<string, number>): UncertaintyParameter[] {
  const seen = new Map<string, { parameter: string; label: string; unit: string }>();
  const rowsOf = new Map<string, Map<string, { label: string; symbol: string }>>();
  for (const g of groups) {
    if (!rowsOf.has(g.parameter)) rowsOf.set(g.parameter, new Map());
    rowsOf.get(g.parameter)!.set(g.rowId, { label: g.label, symbol: g.symbol });
    if (!seen.has(g.parameter)) seen.set(g.parameter, { parameter: g.parameter, label: g.label, unit: g.unit });
  }
  // One U per parameter: a parameter behind several table rows (e.g. HS1, HS3, HS4) is named for all of them.
  for (const [parameter, rows] of rowsOf) {
    if (rows.size < 2) continue;
    const name = parameter.replace(/-/g, " ");
    seen.get(parameter)!.label = `${name[0].toUpperCase()}${name.slice(1)} (${[...rows.values()].map((r) => r.symbol).join(", ")})`;
  }
  for (const p of Object.keys(stated)) if (!seen.has(p)) seen.set(p, { parameter: p, label: p, unit: "" });
  return [...seen.values()];
}

/**
 * What the save sends, checked first: a rating needs a label (one without a value stays "to be
 * stated" and is not sent); a stated U is a number above zero. Errors are keyed by field id.
 */
export function collectContent(draft: {
  prose: Partial<Record<ProseSectionId, string>>;
  ratings: RatingDraft[];
  uncertainty: Record<string, string>;
}): {
  body: { prose: Record<string, string>; absoluteMaximumRatings: { label: string; value: string; unit: string }[]; measurementUncertainty: Record<string, number> };
  errors: Record<string, string>;
  sentRatings: RatingDraft[];
} {
  const errors: Record<string, string> = {};
  const sentRatings: RatingDraft[] = [];
  for (const r of draft.ratings) {
    const label = r.label.trim();
    const value = r.value.trim();
    if (!label && !value) continue;
    if (!label) errors[`rating-${r.id}`] = "Give the rating a label.";
    else if (value) sentRatings.push(r);
  }
  const measurementUncertainty: Record<string, number> = {};
  for (const [parameter, text] of Object.entries(draft.uncertainty)) {
    const parsed = parseFigure(text);
    if (parsed.error) errors[`u-${parameter}`] = `U is ${parsed.error}.`;
    else if (parsed.value !== undefined) {
      if (parsed.value <= 0) errors[`u-${parameter}`] = "U must be greater than zero.";
      else measurementUncertainty[parameter] = parsed.value;
    }
  }
  const body = {
    prose: Object.fromEntries(Object.entries(draft.prose).filter((entry): entry is [string, string] => entry[1] !== undefined && entry[1].trim() !== "")),
    absoluteMaximumRatings: sentRatings.map((r) => ({ label: r.label.trim(), value: r.value.trim(), unit: r.unit.trim() })),
    measurementUncertainty,
  };
  return { body, errors, sentRatings };
}
