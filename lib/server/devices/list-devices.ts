import "server-only";
import { Device, getSequelize } from "@/models";
import { toDeviceSummary, type DeviceSummary } from "./device-summary";

export async function listDevices(organizationId: number): Promise<DeviceSummary[]> {
  getSequelize();
  const rows = await Device.findAll({ where: { organizationId }, order: [["partNumber", "ASC"]] });
  return rows.map(toDeviceSummary);
}
