import "server-only";
import { AppError } from "@/lib/errors";
import type { CommentView } from "@/lib/domain/reviews";
import type { CommentBody } from "@/lib/schemas/reviews";
import type { SheetModel } from "@/lib/sheet";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import { lockOwnRow } from "../auth/own-row";
import type { SessionUser } from "../auth/session-user";
import { getCandidate } from "./get-candidate";

/**
 * A comment on a candidate still under review (in review, or changes requested), by an engineer
 * or reviewer of its organization. It sits on the whole sheet, a spec-table row, a chart or a prose
 * section of the candidate's own model (an anchor the model lacks is refused); a reply joins its
 * thread and takes the thread's anchor.
 */
export async function addComment(opts: { author: SessionUser; candidateId: number; body: CommentBody }): Promise<CommentView[]> {
  const { SheetCandidate, SheetComment, sequelize } = db();
  const { author, candidateId, body } = opts;
  authorize(author, "sheet-comments");
  await sequelize.transaction(async (transaction) => {
    const candidate = await lockOwnRow(SheetCandidate, candidateId, author, transaction, "sheet candidate");
    if (candidate.state !== "in-review" && candidate.state !== "changes-requested") {
      throw new AppError("conflict", `Candidate #${candidate.id} is ${candidate.state}: comments are closed.`);
    }
    let anchor = { kind: body.anchor.kind, id: body.anchor.id ?? null, label: "" };
    let parentId: number | null = null;
    if (body.parentId !== undefined) {
      const parent = await SheetComment.findOne({ where: { id: body.parentId, deviceId: candidate.deviceId, organizationId: author.organizationId }, transaction });
      if (!parent) throw new AppError("invalid", "The comment replied to is not on this sheet.", { fields: [{ field: "parentId", message: "No such comment on this sheet." }] });
      if (parent.resolvedAt) throw new AppError("conflict", "That thread is resolved.");
      parentId = parent.parentId ?? parent.id;
      anchor = { kind: parent.anchorKind, id: parent.anchorId, label: parent.anchorLabel };
    } else {
      anchor.label = anchorLabel(JSON.parse(candidate.modelJson) as SheetModel, body.anchor.kind, body.anchor.id);
    }
    const comment = await SheetComment.create(
      {
        organizationId: author.organizationId,
        deviceId: candidate.deviceId,
        candidateId: candidate.id,
        parentId,
        authorId: author.id,
        anchorKind: anchor.kind,
        anchorId: anchor.id,
        anchorLabel: anchor.label,
        body: body.body,
      },
      { transaction },
    );
    await recordAuditEvent(
      { organizationId: author.organizationId, actorUserId: author.id, action: "sheet-comment.added", subjectType: "sheet-comment", subjectId: comment.id, before: null, after: { candidateId, parentId, anchor, body: body.body } },
      transaction,
    );
  });
  return (await getCandidate({ viewer: author, candidateId })).comments;
}

/** The author of a thread's first comment resolves the thread. */
export async function resolveComment(opts: { actor: SessionUser; commentId: number }): Promise<CommentView[]> {
  const { SheetComment, sequelize } = db();
  const { actor, commentId } = opts;
  authorize(actor, "sheet-comments");
  const candidateId = await sequelize.transaction(async (transaction) => {
    const comment = await lockOwnRow(SheetComment, commentId, actor, transaction, "comment");
    if (comment.parentId !== null) throw new AppError("invalid", "Resolve the thread from its first comment.");
    if (comment.authorId !== actor.id) throw new AppError("forbidden", "Only the person who opened the thread resolves it.");
    if (comment.resolvedAt) throw new AppError("conflict", "This thread is resolved already.");
    comment.resolvedAt = new Date();
    comment.resolvedById = actor.id;
    await comment.save({ transaction });
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: "sheet-comment.resolved", subjectType: "sheet-comment", subjectId: comment.id, before: { resolved: false }, after: { resolved: true } },
      transaction,
    );
    return comment.candidateId;
  });
  return (await getCandidate({ viewer: actor, candidateId })).comments;
}

/** What an anchor is called in the candidate's model; an anchor the model does not have is a 422. */
export function anchorLabel(model: SheetModel, kind: CommentBody["anchor"]["kind"], id: string | undefined): string {
  const refuse = (what: string) => {
    throw new AppError("invalid", `The candidate has no ${what} "${id}".`, { fields: [{ field: "anchor.id", message: `No such ${what}.` }] });
  };
  switch (kind) {
    case "sheet":
      return "The whole sheet";
    case "row": {
      const row = model.specifications.rows.find((r) => r.groupId === id);
      if (!row) return refuse("spec-table row");
      const conditions = row.conditions.filter(Boolean).join(", ");
      return conditions ? `${row.label} (${conditions})` : row.label;
    }
    case "chart": {
      const chart = model.charts.find((c) => c.id === id);
      return chart ? chart.title : refuse("chart");
    }
    case "prose": {
      const section = model.prose.find((p) => p.id === id);
      return section ? section.title : refuse("prose section");
    }
  }
}
