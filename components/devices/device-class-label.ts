import type { DeviceClass } from "@/models/device";

export const deviceClassLabels: Record<DeviceClass, string> = {
  "frequency-multiplier": "Frequency multiplier",
  "double-balanced-mixer": "Double-balanced mixer",
  "quadrature-hybrid": "Hybrid / splitter",
};
