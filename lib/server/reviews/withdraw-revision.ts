import "server-only";
import { AppError } from "@/lib/errors";
import type { RevisionSummary } from "@/lib/domain/reviews";
import type { WithdrawBody } from "@/lib/schemas/reviews";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import { lockOwnRow } from "../auth/own-row";
import type { SessionUser } from "../auth/session-user";
import { queueFollowerNotices } from "../subscriptions/follower-notices";
import { getRevision } from "./list-revisions";

/**
 * Withdraws a released revision with a reason (a reviewer or an administrator of its organization).
 * The revision, its PDF and signatures stay as they are and stay downloadable; the withdrawal is a
 * row of its own, append-only, and the public page says so with the reason. The part's followers
 * get a notice with the reason, queued in the same transaction.
 */
export async function withdrawRevision(opts: { actor: SessionUser; revisionId: number; body: WithdrawBody }): Promise<RevisionSummary> {
  const { SheetRevision, SheetRevisionWithdrawal, sequelize } = db();
  const { actor, revisionId, body } = opts;
  authorize(actor, "revision-withdrawal");
  await sequelize.transaction(async (transaction) => {
    const revision = await lockOwnRow(SheetRevision, revisionId, actor, transaction, "revision");
    const already = await SheetRevisionWithdrawal.findOne({ where: { revisionId: revision.id }, transaction });
    if (already) throw new AppError("conflict", `Revision ${revision.letter} is withdrawn already.`);
    const withdrawal = await SheetRevisionWithdrawal.create(
      { organizationId: actor.organizationId, revisionId: revision.id, reason: body.reason, withdrawnById: actor.id, withdrawnAt: new Date() },
      { transaction },
    );
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: "sheet-revision.withdrawn", subjectType: "sheet-revision", subjectId: revision.id, before: { withdrawn: false }, after: { withdrawn: true, reason: body.reason, withdrawalId: withdrawal.id } },
      transaction,
    );
    await queueFollowerNotices({ event: "withdrawn", revisionId: revision.id, reason: body.reason, withdrawnAt: withdrawal.withdrawnAt }, transaction);
  });
  return getRevision(revisionId);
}
