import type { ClassConditions } from "../types";

/** A comb generator is driven like a multiplier: input frequency and drive. */
export const combGeneratorConditions: ClassConditions = {
  uploadFields: ["inputFrequencyHz", "driveLevelDbm", "cableLossDb"],
};
