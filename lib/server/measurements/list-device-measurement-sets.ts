import "server-only";
import { AppError } from "@/lib/errors";
import { Device, getSequelize } from "@/models";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetSummary } from "./measurement-set-summary";

export async function listDeviceMeasurementSets(opts: { organizationId: number; deviceId: number }): Promise<MeasurementSetSummary[]> {
  getSequelize();
  const device = await Device.findOne({ where: { id: opts.deviceId, organizationId: opts.organizationId }, attributes: ["id"] });
  if (!device) throw new AppError("not-found", "No such device in your organization.");
  return loadMeasurementSets({ deviceId: opts.deviceId, organizationId: opts.organizationId });
}
