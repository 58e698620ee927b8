import type { ClassConditions } from "../types";

/** What a hybrid's or splitter's measurement is stated at: the band its figures hold over. */
export const quadratureHybridConditions: ClassConditions = {
  uploadFields: ["bandStartHz", "bandStopHz"],
  keyConditionWords: { inputFrequency: "Band" },
};
