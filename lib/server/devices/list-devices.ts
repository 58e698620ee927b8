import "server-only";
import { db } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { toDeviceSummary, type DeviceSummary } from "./device-summary";

/** Every device of the viewer's organization, by part number (the API's list; the page pages through findDevicePage). */
export async function listDevices(viewer: SessionUser): Promise<DeviceSummary[]> {
  const { Device } = db();
  const { organizationId } = authorize(viewer, "devices");
  const rows = await Device.findAll({ where: { organizationId }, order: [["partNumber", "ASC"]] });
  return rows.map(toDeviceSummary);
}
