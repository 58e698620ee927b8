/**
 * The diff in plain sentences, one change a line: the generated part of a revision's release
 * notes, and the reason given when a candidate goes stale. Every figure is the one formatter's
 * text (lib/format) as the sheet printed it.
 */
import { kindLabel } from "../domain/measurements";
import { joinUnit } from "../format/quantity";
import { rowMovedWithDataOnly } from "./diff-queries";
import { designInSectionTitles } from "./diff-design-in";
import type { DesignInChange, LimitFieldChange, MeasurementSetRef, RatingFigures, SheetDiff, SpecRowChange, SpecRowFieldChange, SpecRowRef } from "./diff-types";

/** Measurement sets named one by one up to this many; beyond it, counted. */
const SETS_NAMED = 6;

export function summaryLines(diff: SheetDiff): string[] {
  if (diff.firstRelease) return ["First release."];
  const lines: string[] = [];
  const dataOnly = diff.rows.filter(rowMovedWithDataOnly);
  for (const row of diff.rows) if (!dataOnly.includes(row)) lines.push(rowLine(row));
  if (dataOnly.length > 0) {
    lines.push(`Measured typical values (no typ stated) moved with the data in ${dataOnly.length} ${dataOnly.length === 1 ? "row" : "rows"}`);
  }
  for (const change of diff.basisChanges) lines.push(`${rowName(change)}: basis ${change.previous} → ${change.next}`);
  for (const section of diff.prose) lines.push(`Prose changed: ${section.title}`);
  for (const rating of diff.ratings) lines.push(ratingLine(rating.kind, rating.label, rating.previous, rating.next));
  for (const change of diff.designIn) lines.push(designInLine(change));
  for (const caution of diff.cautions.added) lines.push(`Caution added: ${caution}`);
  for (const caution of diff.cautions.removed) lines.push(`Caution removed: ${caution}`);
  if (diff.measurementSets.added.length > 0) lines.push(setsLine("added", diff.measurementSets.added));
  if (diff.measurementSets.removed.length > 0) lines.push(setsLine("removed", diff.measurementSets.removed));
  for (const detail of diff.details) {
    if (detail.previous === null) lines.push(`Key fact added: ${detail.label} ${detail.next}`);
    else if (detail.next === null) lines.push(`Key fact removed: ${detail.label}`);
    else if (detail.label === "Description") lines.push("Description changed");
    else lines.push(`${detail.label}: ${detail.previous} → ${detail.next}`);
  }
  for (const chart of diff.charts) {
    if (chart.presence === "next-only") lines.push(`Chart added: ${chart.title}`);
    if (chart.presence === "previous-only") lines.push(`Chart removed: ${chart.title}`);
  }
  const redrawn = diff.charts.filter((c) => c.presence === "both" && c.panels.some((p) => p.changed)).map((c) => c.title);
  if (redrawn.length > 0) lines.push(`Typical curves changed: ${redrawn.join("; ")}`);
  return lines;
}

/** "Conversion loss (Frequency 2 GHz in, T_A 25 °C)". */
function rowName(row: SpecRowRef): string {
  return row.conditionsText ? `${row.label} (${row.conditionsText})` : row.label;
}

function rowLine(row: SpecRowChange): string {
  if (row.kind === "added") {
    const stated = row.next ? statedFigures(row.next) : "";
    return `Added: ${rowName(row)}${stated ? `: ${stated}` : ""}`;
  }
  if (row.kind === "removed") return `Removed: ${rowName(row)}`;
  return `${rowName(row)}: ${row.fields.map(fieldText).join("; ")}`;
}

function statedFigures(figures: NonNullable<SpecRowChange["next"]>): string {
  return (["min", "typ", "max"] as const)
    .filter((field) => figures[field].text !== "")
    .map((field) => `${field} ${joinUnit(figures[field].text, figures.unit)}`)
    .join(", ");
}

const EFFECT_WORDS: Record<LimitFieldChange["effect"], string> = {
  tightened: " (tightened)",
  loosened: " (loosened)",
  neutral: "",
  incomparable: " (units differ, not compared)",
};

function fieldText(change: SpecRowFieldChange): string {
  switch (change.field) {
    case "min":
    case "typ":
    case "max":
      return `${change.field} ${change.previousText || "none"} → ${change.nextText || "none"}${EFFECT_WORDS[change.effect]}`;
    case "unit":
      return `unit ${change.previous} → ${change.next}`;
    case "conditions":
      return `conditions ${change.previous || "none"} → ${change.next || "none"}`;
    case "footnotes":
      return "footnotes changed";
  }
}

function ratingText(figures: RatingFigures): string {
  return figures.missing ? "to be stated" : joinUnit(figures.value, figures.unit);
}

function ratingLine(kind: "added" | "removed" | "changed", label: string, previous: RatingFigures | null, next: RatingFigures | null): string {
  if (kind === "added") return `Absolute maximum rating added: ${label} ${ratingText(next!)}`;
  if (kind === "removed") return `Absolute maximum rating removed: ${label}`;
  return `Absolute maximum rating changed: ${label} ${ratingText(previous!)} → ${ratingText(next!)}`;
}

function setsLine(kind: "added" | "removed", sets: MeasurementSetRef[]): string {
  const named = sets.slice(0, SETS_NAMED).map((s) => `${s.serial}, ${kindLabel(s.kind).toLowerCase()}, ${s.measuredOn}`);
  const more = sets.length - named.length;
  return `Measurement sets ${kind} (${sets.length}): ${named.join("; ")}${more > 0 ? `; and ${more} more` : ""}`;
}

/** "Recommended operating conditions, LO drive: min 5, typ 7, max 10 dBm → min 6, typ 7, max 10 dBm"; "Package outline: drawing changed". */
function designInLine(change: DesignInChange): string {
  // The outline is one row of its section: the section's name says it ("Package outline: drawing changed").
  const where = change.section === "outline" ? designInSectionTitles.outline : `${designInSectionTitles[change.section]}, ${change.key}`;
  if (change.kind === "added") return `Added: ${where}${change.next ? `: ${change.next}` : ""}`;
  if (change.kind === "removed") return `Removed: ${where}`;
  if (change.section === "outline") {
    const words = change.fields.map((f) => (f === "drawing" ? "drawing changed" : `caption ${change.previous ? `“${change.previous}”` : "none"} → ${change.next ? `“${change.next}”` : "none"}`));
    return `${where}: ${words.join("; ")}`;
  }
  return `${where}: ${change.previous || "none"} → ${change.next || "none"}`;
}
