import "server-only";
import { Device } from "@/models";
import type { DeviceClass, KeyConditions } from "@/models/device";

export type DeviceSummary = {
  id: number;
  partNumber: string;
  deviceClass: DeviceClass;
  title: string;
  description: string;
  keyConditions: KeyConditions;
  updatedAt: string;
};

export function toDeviceSummary(d: Device): DeviceSummary {
  return {
    id: d.id,
    partNumber: d.partNumber,
    deviceClass: d.deviceClass,
    title: d.title,
    description: d.description,
    keyConditions: d.keyConditions,
    updatedAt: d.updatedAt.toISOString(),
  };
}
