import "server-only";
import { AppError } from "@/lib/errors";
import type { SpecLimitsBody } from "@/lib/schemas/sheets";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { lockOwnRow } from "../auth/own-row";
import { refreshOpenCandidates } from "../reviews/freshness";

/** Replaces the device's spec limits as one change, with the old and new set in the audit trail. */
export async function saveSpecLimits(opts: { actor: SessionUser; deviceId: number; input: SpecLimitsBody }): Promise<number> {
  const { Device, SpecLimit, sequelize } = db();
  const { actor, deviceId, input } = opts;
  authorize(actor, "sheet-edit");
  const seen = new Set<string>();
  for (const l of input.limits) {
    const key = `${l.parameter}|${l.conditionsKey}`;
    if (seen.has(key)) throw new AppError("invalid", `Two limits for ${l.parameter} under the same conditions (${l.conditionsKey || "none"}).`, { field: "limits" });
    seen.add(key);
  }
  const saved = await sequelize.transaction(async (transaction) => {
    const device = await lockOwnRow(Device, deviceId, actor, transaction, "device");
    const before = await SpecLimit.findAll({ where: { deviceId }, transaction });
    await SpecLimit.destroy({ where: { deviceId }, transaction });
    await SpecLimit.bulkCreate(
      input.limits.map((l) => ({
        organizationId: actor.organizationId,
        deviceId,
        parameter: l.parameter,
        conditionsKey: l.conditionsKey,
        minValue: l.min ?? null,
        typValue: l.typ ?? null,
        maxValue: l.max ?? null,
        minDecimals: l.min != null ? (l.decimals?.min ?? null) : null,
        typDecimals: l.typ != null ? (l.decimals?.typ ?? null) : null,
        maxDecimals: l.max != null ? (l.decimals?.max ?? null) : null,
        unit: l.unit,
        basis: l.basis,
        footnote: l.footnote || null,
      })),
      { transaction },
    );
    await recordAuditEvent(
      {
        organizationId: actor.organizationId,
        actorUserId: actor.id,
        action: "spec-limits.replace",
        subjectType: "device",
        subjectId: deviceId,
        before: before.map((l) => ({ parameter: l.parameter, conditionsKey: l.conditionsKey, min: l.minValue, typ: l.typValue, max: l.maxValue, unit: l.unit, basis: l.basis })),
        after: input.limits,
      },
      transaction,
    );
    return input.limits.length;
  });
  await refreshOpenCandidates({ organizationId: actor.organizationId, deviceId });
  return saved;
}
