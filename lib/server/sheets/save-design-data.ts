import "server-only";
import type { Transaction } from "sequelize";
import type { DesignDataBody } from "@/lib/schemas/sheets";
import { db } from "@/models";
import type { SheetContent } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { lockOwnRow } from "../auth/own-row";
import { refreshOpenCandidates } from "../reviews/freshness";

/** The device's sheet content row, made empty when the engineer has written nothing yet. */
export async function findOrCreateSheetContent(opts: { actor: SessionUser; deviceId: number; transaction: Transaction }): Promise<SheetContent> {
  const { SheetContent } = db();
  const { actor, deviceId, transaction } = opts;
  const existing = await SheetContent.findOne({ where: { deviceId }, lock: transaction.LOCK.UPDATE, transaction });
  if (existing) return existing;
  return SheetContent.create(
    { organizationId: actor.organizationId, deviceId, prose: {}, absoluteMaximumRatings: [], measurementUncertainty: {}, updatedById: actor.id },
    { transaction },
  );
}

/** Replaces the pin functions, ordering information and recommended operating conditions of a device's sheet. */
export async function saveDesignData(opts: { actor: SessionUser; deviceId: number; input: DesignDataBody }): Promise<void> {
  const { Device, sequelize } = db();
  const { actor, deviceId, input } = opts;
  authorize(actor, "sheet-edit");
  await sequelize.transaction(async (transaction) => {
    await lockOwnRow(Device, deviceId, actor, transaction, "device");
    const content = await findOrCreateSheetContent({ actor, deviceId, transaction });
    const before = {
      pinFunctions: content.pinFunctions ?? [],
      ordering: content.orderingInformation ?? [],
      recommendedOperatingConditions: content.recommendedOperatingConditions ?? [],
      packageOutlineCaption: content.packageOutlineCaption ?? null,
    };
    await content.update(
      {
        pinFunctions: input.pinFunctions,
        orderingInformation: input.ordering,
        recommendedOperatingConditions: input.recommendedOperatingConditions,
        ...(input.packageOutlineCaption !== undefined ? { packageOutlineCaption: input.packageOutlineCaption || null } : {}),
        updatedById: actor.id,
      },
      { transaction },
    );
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: "sheet-design-data.save", subjectType: "device", subjectId: deviceId, before, after: input },
      transaction,
    );
  });
  await refreshOpenCandidates({ organizationId: actor.organizationId, deviceId });
}
