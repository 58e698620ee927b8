import type { ClassConditions } from "../types";

/**
 * What a mixer's measurement is stated at: RF, LO and IF frequencies and the LO drive. A file's own
 * `# lo_frequency:`, `# if_frequency:` and `# lo_power:` lines win over the upload's values; a
 * frequency sweep's RF band is always the file's.
 */
export const doubleBalancedMixerConditions: ClassConditions = {
  uploadFields: ["rfFrequencyHz", "loFrequencyHz", "ifFrequencyHz", "loDriveDbm"],
  keyFields: { inputFrequency: "rfFrequencyHz", drive: "loDriveDbm" },
};
