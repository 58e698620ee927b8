import "server-only";
import { UniqueConstraintError } from "sequelize";
import { AppError } from "@/lib/errors";
import type { DeviceBody } from "@/lib/schemas/measurements";
import { db } from "@/models";
import type { Device } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { toDeviceSummary, type DeviceSummary } from "./device-summary";
import { lockOwnRow } from "../auth/own-row";
import { refreshOpenCandidates } from "../reviews/freshness";

/** Creates a device, or edits one of the engineer's organization when `deviceId` is given. */
export async function saveDevice(opts: { actor: SessionUser; input: DeviceBody; deviceId?: number }): Promise<DeviceSummary> {
  const { Device, sequelize } = db();
  const { actor, input, deviceId } = opts;
  authorize(actor, "device-edit");
  try {
    const saved = await sequelize.transaction(async (transaction) => {
      let row: Device | null;
      let before: unknown = null;
      if (deviceId) {
        row = await lockOwnRow(Device, deviceId, actor, transaction, "device");
        before = toDeviceSummary(row);
        await row.update(input, { transaction });
      } else {
        row = await Device.create({ ...input, organizationId: actor.organizationId, createdById: actor.id }, { transaction });
      }
      const after = toDeviceSummary(row);
      await recordAuditEvent(
        { organizationId: actor.organizationId, actorUserId: actor.id, action: deviceId ? "device.update" : "device.create", subjectType: "device", subjectId: row.id, before, after },
        transaction,
      );
      return after;
    });
    if (deviceId) await refreshOpenCandidates({ organizationId: actor.organizationId, deviceId });
    return saved;
  } catch (error) {
    if (error instanceof UniqueConstraintError) {
      throw new AppError("conflict", `Part number ${input.partNumber} is already used in your organization.`, { field: "partNumber" });
    }
    throw error;
  }
}
