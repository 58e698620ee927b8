import type { DeviceClass } from "@/models/device";

/** Human names of the device classes, shared by the pages and the device list's sort. */
export const deviceClassLabels: Record<DeviceClass, string> = {
  "frequency-multiplier": "Frequency multiplier",
  "double-balanced-mixer": "Double-balanced mixer",
  "quadrature-hybrid": "Hybrid / splitter",
};
