import "server-only";
import { AppError } from "@/lib/errors";
import { Device, getSequelize } from "@/models";
import { toDeviceSummary, type DeviceSummary } from "./device-summary";

/** One device of the caller's organization; another organization's device is simply not found. */
export async function getDevice(opts: { organizationId: number; deviceId: number }): Promise<DeviceSummary> {
  getSequelize();
  const row = await Device.findOne({ where: { id: opts.deviceId, organizationId: opts.organizationId } });
  if (!row) throw new AppError("not-found", "No such device in your organization.");
  return toDeviceSummary(row);
}
