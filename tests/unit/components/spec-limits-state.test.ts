import { describe, expect, it } from "vitest";
import {
  buildEditorRows,
  checkLimitDrafts,
  draftOf,
  initialLimitDrafts,
  rowErrorsFromFields,
  rowHeadings,
  sameDraft,
  type LimitDraft,
} from "@/components/sheets/spec-limits-state";
import { buildSheetModel } from "@/lib/sheet";
import { loadDoublerInput } from "../sheet/fixture";

const model = buildSheetModel(loadDoublerInput());
const groups = model.statistics.groups;
const orphan = { parameter: "gone", conditionsKey: "", unit: "dB", basis: "design" as const, max: 3 };

describe("spec limits editor state", () => {
  it("offers one line per statistics group, then the saved limits whose data are gone", () => {
    const rows = buildEditorRows(groups, [orphan]);
    expect(rows).toHaveLength(groups.length + 1);
    expect(rows.slice(0, -1).map((r) => r.group)).toEqual(groups);
    expect(rows.at(-1)).toMatchObject({ key: "gone|", rowId: "without-data", conditionsText: "no conditions", group: null });
  });

  it("heads a line only where a new template row starts", () => {
    const rows = buildEditorRows(groups, [orphan]);
    const headings = rowHeadings(rows);
    const starts = rows.map((r, i) => i === 0 || rows[i - 1].rowId !== r.rowId);
    expect(headings.map((h) => h !== null)).toEqual(starts);
    expect(headings[0]).toBe(`${groups[0].label} (${groups[0].symbol})`);
    expect(headings.at(-1)).toBe("Limits without data");
  });

  it("starts each line from its saved limit, else empty with the sheet's basis", () => {
    const rows = buildEditorRows(groups, [orphan]);
    const drafts = initialLimitDrafts(rows, [orphan], model.specifications.rows);
    expect(drafts["gone|"]).toEqual({ min: "", typ: "", max: "3", basis: "design", footnote: "" });
    const first = model.specifications.rows.find((r) => r.groupId === groups[0].groupId)!;
    expect(drafts[rows[0].key].basis).toBe(first.basis);
  });

  it("treats whitespace and the basis of an empty line as no change", () => {
    const a: LimitDraft = { min: "", typ: "", max: "", basis: "design", footnote: "" };
    expect(sameDraft(a, { ...a, basis: "characterization" })).toBe(true);
    expect(sameDraft({ ...a, max: " 3 " }, { ...a, max: "3" })).toBe(true);
    expect(sameDraft({ ...a, max: "3" }, { ...a, max: "3", basis: "characterization" })).toBe(false);
  });

  it("sends the lines with a figure and marks the lines that cannot be sent", () => {
    const rows = buildEditorRows(groups, []).slice(0, 4);
    const drafts: LimitDraft[] = [
      { ...draftOf(undefined, "design"), min: "−1.5", max: "2", footnote: " at 25 °C " },
      { ...draftOf(undefined, "design"), min: "5", max: "2" },
      { ...draftOf(undefined, "design"), typ: "abc", footnote: "x" },
      { ...draftOf(undefined, "design"), footnote: "alone" },
    ];
    const checked = checkLimitDrafts(rows, (row) => drafts[rows.indexOf(row)]);
    expect(checked.sentRows).toEqual([rows[0]]);
    expect(checked.limits).toEqual([
      { parameter: rows[0].parameter, conditionsKey: rows[0].conditionsKey, min: -1.5, max: 2, unit: rows[0].unit, basis: "design", footnote: "at 25 °C", decimals: { min: 1, max: 0 } },
    ]);
    expect(checked.errors).toEqual({
      [rows[1].key]: ["Min must not exceed max."],
      [rows[2].key]: ["Typ: not a number."],
      [rows[3].key]: ["A footnote needs a limit: give at least one of min, typ, max, or clear the footnote."],
    });
  });

  it("puts the API's field errors back on the lines that were sent", () => {
    const rows = buildEditorRows(groups, []).slice(0, 2);
    const byRow = rowErrorsFromFields(
      [
        { field: "limits.1.max", message: "too large" },
        { field: "limits.1", message: "duplicate" },
        { field: "limits.7.min", message: "no such line" },
        { field: "other", message: "ignored" },
      ],
      rows,
    );
    expect(byRow).toEqual({ [rows[1].key]: ["max: too large", "duplicate"] });
  });
});
