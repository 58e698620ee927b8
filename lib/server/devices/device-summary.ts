import "server-only";
import type { Device } from "@/models";
import type { DeviceSummary } from "@/lib/domain/devices";

export type { DeviceSummary };

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
