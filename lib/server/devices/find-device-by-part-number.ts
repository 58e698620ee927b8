import "server-only";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import type { Device } from "@/models";

export async function findDeviceByPartNumber(opts: { organizationId: number; partNumber: string }): Promise<Device> {
  const { Device } = db();
  const device = await Device.findOne({ where: { organizationId: opts.organizationId, partNumber: opts.partNumber } });
  if (!device) throw new AppError("not-found", `No device with part number ${opts.partNumber} in this organization.`, { field: "device" });
  return device;
}
