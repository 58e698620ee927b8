import type { ClassConditions } from "../types";

/**
 * What a multiplier's measurement is stated at. The upload asks for the input frequency, the drive
 * and the losses between source and device that the per-port drive is referred through. Its drive is
 * per port, as the sheet's Drive column, its key facts and the design-in calculator state it.
 */
export const frequencyMultiplierConditions: ClassConditions = {
  uploadFields: ["inputFrequencyHz", "driveLevelDbm", "splitterExcessLossDb", "cableLossDb"],
  fieldWords: { driveLevelDbm: { label: "Drive level, per port", hint: "At each device port, after the input split" } },
};
