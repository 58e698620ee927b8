import "server-only";
import { AppError } from "@/lib/errors";
import { Device, getSequelize } from "@/models";

export async function findDeviceByPartNumber(opts: { organizationId: number; partNumber: string }): Promise<Device> {
  getSequelize();
  const device = await Device.findOne({ where: { organizationId: opts.organizationId, partNumber: opts.partNumber } });
  if (!device) throw new AppError("not-found", `No device with part number ${opts.partNumber} in this organization.`, { field: "device" });
  return device;
}
