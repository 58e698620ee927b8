import "server-only";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetSummary } from "./measurement-set-summary";

export async function listDeviceMeasurementSets(opts: { viewer: SessionUser; deviceId: number }): Promise<MeasurementSetSummary[]> {
  const { Device } = db();
  const { organizationId } = authorize(opts.viewer, "devices");
  const device = await Device.findOne({ where: { id: opts.deviceId, organizationId }, attributes: ["id"] });
  if (!device) throw new AppError("not-found", "No such device in your organization.");
  return loadMeasurementSets({ deviceId: opts.deviceId, organizationId });
}
