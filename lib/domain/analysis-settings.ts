/**
 * The measurement settings an engineer chooses per measurement (the phase-noise integration band,
 * the small-signal reference of compression, the impedance of power readings), where each can be stated, and the named bands the
 * upload form offers. Pure, so the form, the schemas, the engine and the CLI share it.
 */

/** Where a setting came from, highest precedence first; "engine" is the built-in fallback without a device class. */
export const settingSources = ["file", "upload", "cli", "template", "engine"] as const;
export type SettingSource = (typeof settingSources)[number];

/** Printed after a figure's band or reference: "set by the file". */
export const settingSourceWords: Record<SettingSource, string> = {
  file: "the file",
  upload: "the upload",
  cli: "the command line",
  template: "the device class default",
  engine: "Benchfold's default",
};

/**
 * Integration bands in common use for rms phase and jitter (common practice: 12 kHz–20 MHz is the
 * band of SONET/SDH and most clock datasheets, 10 Hz–1 MHz a close-in band for synthesizers).
 */
export const namedIntegrationBands = [
  { id: "12k-20m", label: "12 kHz – 20 MHz", startHz: 12e3, stopHz: 20e6 },
  { id: "10-1m", label: "10 Hz – 1 MHz", startHz: 10, stopHz: 1e6 },
  { id: "100-1m", label: "100 Hz – 1 MHz", startHz: 100, stopHz: 1e6 },
  { id: "1k-10m", label: "1 kHz – 10 MHz", startHz: 1e3, stopHz: 10e6 },
] as const;
export type NamedIntegrationBand = (typeof namedIntegrationBands)[number]["id"];
export const namedIntegrationBandIds = namedIntegrationBands.map((b) => b.id) as [NamedIntegrationBand, ...NamedIntegrationBand[]];

export interface IntegrationBandHz {
  startHz: number;
  stopHz: number;
}

/** What one source states; every field optional. */
export interface StatedAnalysisSettings {
  integrationBandHz?: IntegrationBandHz;
  /** The small-signal reference drive for compression, dBm, on the axis the input P1dB is reported on. */
  compressionReferenceDbm?: number;
  /** The impedance power readings are referred to for dBm ↔ Vrms ↔ dBµV, Ω (a Touchstone file states its own). */
  impedanceOhm?: number;
  /** The bandwidth a phase-noise trace was normalised to 1 Hz with, for discrete spurs in dBc. */
  spurBandwidth?: SpurBandwidth;
}

/**
 * Which bandwidth an engineer states for a phase-noise trace: "noise", the analyzer's equivalent noise
 * bandwidth (ENBW, what it divided by to print dBc/Hz), used as it is; or "resolution", the 3 dB
 * resolution bandwidth (RBW) the analyzer shows, turned into a noise bandwidth by the filter-shape
 * factor of lib/rf/spurs.ts (an ideal Gaussian filter's, 1.0645).
 */
export const spurBandwidthKinds = ["noise", "resolution"] as const;
export type SpurBandwidthKind = (typeof spurBandwidthKinds)[number];

export interface SpurBandwidth {
  kind: SpurBandwidthKind;
  hz: number;
}

/** The words a warning, the form and the set page use for each kind. */
export const spurBandwidthKindWords: Record<SpurBandwidthKind, string> = {
  noise: "noise bandwidth",
  resolution: "resolution bandwidth",
};

/** The bandwidths the file, the upload and the CLI may state, Hz: from an FFT analyzer's millihertz bins to a swept analyzer's widest RBW. */
export const spurBandwidthRangeHz = { min: 1e-3, max: 10e6 } as const;

/** Why a bandwidth cannot be used, or undefined when it can. */
export function spurBandwidthProblem(hz: number): string | undefined {
  if (!Number.isFinite(hz) || hz < spurBandwidthRangeHz.min || hz > spurBandwidthRangeHz.max) return "the bandwidth must lie from 1 mHz to 10 MHz";
  return undefined;
}

/** Impedance when no source states one, Ω (common practice: RF benches are 50 Ω systems, video and cable TV 75 Ω). */
export const DEFAULT_ANALYSIS_IMPEDANCE_OHM = 50;

/** The impedances the file, the upload and the CLI may state, Ω: wide enough for 50, 75, 100, 300 and 600 Ω systems, narrow enough to catch a typo. */
export const impedanceRangeOhm = { min: 1, max: 1000 } as const;

/** Why an impedance cannot be used, or undefined when it can. */
export function impedanceProblem(ohm: number): string | undefined {
  if (!Number.isFinite(ohm)) return "the impedance must be a number of ohms";
  if (ohm < impedanceRangeOhm.min || ohm > impedanceRangeOhm.max) return `the impedance must lie from ${impedanceRangeOhm.min} to ${impedanceRangeOhm.max} Ω`;
  return undefined;
}

export function findNamedIntegrationBand(id: string): (typeof namedIntegrationBands)[number] | undefined {
  return namedIntegrationBands.find((b) => b.id === id);
}
