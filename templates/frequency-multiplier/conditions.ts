import type { ClassConditions } from "../types";

/**
 * What a multiplier's measurement is stated at. The upload asks for the input frequency, the drive
 * and the losses between source and device that the per-port drive is referred through.
 */
export const frequencyMultiplierConditions: ClassConditions = {
  uploadFields: ["inputFrequencyHz", "driveLevelDbm", "splitterExcessLossDb", "cableLossDb"],
};
