import "server-only";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { toDeviceSummary, type DeviceSummary } from "./device-summary";

/** One device of the viewer's organization; another organization's device is simply not found. */
export async function getDevice(opts: { viewer: SessionUser; deviceId: number }): Promise<DeviceSummary> {
  const { Device } = db();
  const { organizationId } = authorize(opts.viewer, "devices");
  const row = await Device.findOne({ where: { id: opts.deviceId, organizationId } });
  if (!row) throw new AppError("not-found", "No such device in your organization.");
  return toDeviceSummary(row);
}
