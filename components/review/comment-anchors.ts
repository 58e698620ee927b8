import type { CommentAnchorKind } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet/types";

/** Something on the candidate a comment may sit on; `id` null for the whole sheet. */
export type CommentAnchorOption = { kind: CommentAnchorKind; id: string | null; label: string };

/** The words before an anchor's label in a thread's heading. */
export const anchorKindWords: Record<CommentAnchorKind, string> = {
  sheet: "Sheet",
  row: "Spec row",
  chart: "Chart",
  prose: "Prose",
};

/**
 * Every place of the candidate's own model a comment may sit on, named as the server names them:
 * the whole sheet, each spec-table row (by its group), each chart and each prose section.
 */
export function commentAnchorOptions(model: Pick<SheetModel, "specifications" | "charts" | "prose">): CommentAnchorOption[] {
  return [
    { kind: "sheet", id: null, label: "The whole sheet" },
    ...model.specifications.rows.map((row) => {
      const conditions = row.conditions.filter(Boolean).join(", ");
      return { kind: "row" as const, id: row.groupId, label: conditions ? `${row.label} (${conditions})` : row.label };
    }),
    ...model.charts.map((chart) => ({ kind: "chart" as const, id: chart.id, label: chart.title })),
    ...model.prose.map((section) => ({ kind: "prose" as const, id: section.id, label: section.title })),
  ];
}

/** The value of an anchor in the picker: "row:<groupId>", "sheet:". */
export function anchorValue(anchor: { kind: CommentAnchorKind; id: string | null }): string {
  return `${anchor.kind}:${anchor.id ?? ""}`;
}

/** The event a "Comment on this" button sends, so the comment form picks the anchor and takes focus. */
export const commentOnEvent = "benchfold:comment-on";
export type CommentOnDetail = { kind: CommentAnchorKind; id: string | null };
