import "server-only";
import type { SheetContentBody } from "@/lib/schemas/sheets";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { lockOwnRow } from "../auth/own-row";
import { refreshOpenCandidates } from "../reviews/freshness";

export async function saveSheetContent(opts: { actor: SessionUser; deviceId: number; input: SheetContentBody }): Promise<void> {
  const { Device, SheetContent, sequelize } = db();
  const { actor, deviceId, input } = opts;
  authorize(actor, "sheet-edit");
  await sequelize.transaction(async (transaction) => {
    await lockOwnRow(Device, deviceId, actor, transaction, "device");
    const existing = await SheetContent.findOne({ where: { deviceId }, transaction });
    const values = { prose: input.prose, absoluteMaximumRatings: input.absoluteMaximumRatings, measurementUncertainty: input.measurementUncertainty, updatedById: actor.id };
    const before = existing ? { prose: existing.prose, absoluteMaximumRatings: existing.absoluteMaximumRatings, measurementUncertainty: existing.measurementUncertainty } : null;
    if (existing) await existing.update(values, { transaction });
    else await SheetContent.create({ organizationId: actor.organizationId, deviceId, ...values }, { transaction });
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: "sheet-content.save", subjectType: "device", subjectId: deviceId, before, after: input },
      transaction,
    );
  });
  await refreshOpenCandidates({ organizationId: actor.organizationId, deviceId });
}
