/**
 * Parsed measurement data. Plain numbers and arrays in canonical units (the
 * unit is in each property name), so lib/rf can use them directly.
 */

import type { MeasurementKind } from "../domain/measurements";
import type { SpurBandwidth, SpurBandwidthKind } from "../domain/analysis-settings";

/** The kinds are listed once, in lib/domain/measurements.ts. */
export type { MeasurementKind };

/** What every CSV measurement says about the unit under test. */
export interface UnitConditions {
  serial: string;
  lot?: string;
  temperatureC?: number;
  /** `# impedance:` the impedance the power readings are referred to, Ω (dBm ↔ Vrms ↔ dBµV); 50 Ω when no source states one. */
  impedanceOhm?: number;
  /** Every "# key: value" line as written, including the ones read above. */
  metadata: Record<string, string>;
}

export interface HarmonicTrace {
  /** 1 = fundamental leak-through, 2 = second harmonic, … */
  order: number;
  outputPowerDbm: number[];
}

/** Output spectrum vs drive level at one input frequency (multipliers, mixers as doublers). */
export interface DriveSweep extends UnitConditions {
  inputFrequencyHz: number;
  /** Harmonic order of the wanted output (2 for a doubler). */
  wantedOrder: number;
  /** Excess loss of the splitter/hybrid feeding both ports, beyond the ideal 3.01 dB; 0 when not given. */
  splitterExcessLossDb: number;
  /** Cable loss between source and device; 0 when not given. */
  cableLossDb: number;
  /** `# compression_reference:` the small-signal reference drive for P1dB, dBm into the device (all ports). */
  compressionReferenceDbm?: number;
  /** Total input power as measured at the source, one entry per row, strictly increasing. */
  inputPowerDbm: number[];
  /** One trace per pN_out column, sorted by order; each has one entry per row. */
  harmonics: HarmonicTrace[];
}

/** Quantities vs frequency (mixer conversion loss, isolation, multiplier output). */
export interface FrequencySweep extends UnitConditions {
  /** Strictly increasing. */
  frequencyHz: number[];
  inputPowerDbm?: number[];
  outputPowerDbm?: number[];
  conversionLossDb?: number[];
  isolationLoRfDb?: number[];
  isolationLoIfDb?: number[];
  isolationRfIfDb?: number[];
  /** LO drive (mixers) or input drive (multipliers). */
  loPowerDbm?: number;
  ifFrequencyHz?: number;
  loFrequencyHz?: number;
}

/** Two-tone intermodulation sweep. */
export interface TwoTone extends UnitConditions {
  /** Input power of each tone, strictly increasing. */
  inputPowerPerToneDbm: number[];
  /** Output power of each fundamental tone. */
  fundamentalOutputDbm: number[];
  /** Output power of the third-order product (2f1 − f2 or 2f2 − f1). */
  im3OutputDbm: number[];
  tone1FrequencyHz?: number;
  tone2FrequencyHz?: number;
  /** Tone 2's level minus tone 1's, dB (`# tone2_relative_level:`); the columns are tone 1's and the product beside it (2f1 − f2). */
  tone2RelativeLevelDb?: number;
  /** `# compression_reference:` the small-signal reference drive for P1dB, dBm per tone. */
  compressionReferenceDbm?: number;
  /** Given, or |f2 − f1| when both tones are given. */
  toneSpacingHz?: number;
  loPowerDbm?: number;
}

/** Single-sideband phase noise L(f) (IEEE Std 1139-2008), dBc/Hz vs offset. */
export interface PhaseNoiseTrace extends UnitConditions {
  carrierFrequencyHz: number;
  carrierPowerDbm?: number;
  /** Multiplication factor N of the device (2 for a doubler), when measured through a multiplier. */
  multiplicationFactor?: number;
  /** `# integration_start:` and `# integration_stop:`, the band for rms phase and jitter. */
  integrationBandHz?: { startHz: number; stopHz: number };
  /** `# noise_bandwidth:` or `# resolution_bandwidth:`: the one bandwidth the whole trace was normalised with. */
  spurBandwidth?: SpurBandwidth;
  /** A `noise_bandwidth` or `resolution_bandwidth` column: the bandwidth at each offset, Hz (analyzers change it per decade). */
  spurBandwidthColumn?: { kind: SpurBandwidthKind; hz: number[] };
  /** Strictly increasing, > 0. */
  offsetHz: number[];
  lDbcHz: number[];
  /** An `L_input` column: L(f) of the signal driving the multiplier, at its own (input) frequency, on the same offsets. */
  inputLDbcHz?: number[];
}

/**
 * S-parameters from a Touchstone file (IBIS Open Forum Touchstone File
 * Format Specification, Version 1.1 and 2.0). Complex values are stored
 * entry-major: S(i,j) at frequency k (0-based i = output port, j = input
 * port) is at index (i·N + j)·F + k of sRe/sIm, so one parameter across
 * frequency is a contiguous run; see sParameter().
 */
export interface TouchstoneData {
  version: 1 | 2;
  portCount: number;
  /** F frequencies in Hz, strictly increasing (0 Hz allowed). */
  frequencyHz: Float64Array;
  /** Reference impedance of each port in ohms. */
  referenceOhm: number[];
  sRe: Float64Array;
  sIm: Float64Array;
  /** Format of the numbers in the file, already converted to real/imaginary here. */
  sourceFormat: "RI" | "MA" | "DB";
  /** Comment lines ("!"-prefixed) before the data, trimmed. */
  comments: string[];
}

interface Parsed<K extends MeasurementKind, D> {
  kind: K;
  data: D;
  warnings: string[];
}

export type ParsedMeasurement =
  | Parsed<"drive-sweep", DriveSweep>
  | Parsed<"frequency-sweep", FrequencySweep>
  | Parsed<"two-tone", TwoTone>
  | Parsed<"phase-noise", PhaseNoiseTrace>
  | Parsed<"touchstone", TouchstoneData>;

/** What each parser returns: its data and warnings about things it ignored or defaulted. */
export interface ParseResult<D> {
  data: D;
  warnings: string[];
}
