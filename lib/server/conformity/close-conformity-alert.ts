import "server-only";
import { AppError } from "@/lib/errors";
import type { CloseConformityAlertBody } from "@/lib/schemas/reviews";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import { lockOwnRow } from "../auth/own-row";
import type { SessionUser } from "../auth/session-user";
import { refreshOpenCandidates } from "../reviews/freshness";

/**
 * An engineer closes an open conformity alert with a reason ("new lot, limit revision planned"):
 * the row is locked in the actor's organization, a closed alert answers 409, and the audit trail keeps
 * who, when and why. The alert leaves the sheet's open issues, so an open review is checked again.
 */
export async function closeConformityAlert(opts: { actor: SessionUser; alertId: number; body: CloseConformityAlertBody }): Promise<{ id: number; closedAt: string }> {
  const { actor, alertId, body } = opts;
  authorize(actor, "conformity-close");
  const { ConformityAlert, sequelize } = db();
  const closed = await sequelize.transaction(async (transaction) => {
    const alert = await lockOwnRow(ConformityAlert, alertId, actor, transaction, "conformity alert");
    if (alert.closedAt) throw new AppError("conflict", `Conformity alert #${alert.id} is already closed.`);
    alert.closedAt = new Date();
    alert.closedById = actor.id;
    alert.closeReason = body.reason;
    await alert.save({ transaction });
    await recordAuditEvent(
      {
        organizationId: actor.organizationId,
        actorUserId: actor.id,
        action: "conformity-alert.close",
        subjectType: "conformity-alert",
        subjectId: alert.id,
        before: { closedAt: null },
        after: { closedAt: alert.closedAt.toISOString(), reason: body.reason },
      },
      transaction,
    );
    return alert;
  });
  await refreshOpenCandidates({ organizationId: actor.organizationId, deviceId: closed.deviceId });
  return { id: closed.id, closedAt: closed.closedAt!.toISOString() };
}
