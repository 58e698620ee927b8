/**
 * Phase noise as L(f), single-sideband, dBc/Hz (IEEE Std 1139-2008: L(f) = ½·Sφ(f)).
 * A trace is a list of offsets (Hz, increasing after sorting) and L values. Between
 * points L is taken as a straight line on log-log axes (a power law): linear
 * interpolation of dBc/Hz in log10(offset).
 */

import { lowerBound, upperBound } from "./sorted-search";

export interface PhaseNoiseTrace {
  offsetHz: ArrayLike<number>;
  phaseNoiseDbcHz: ArrayLike<number>;
}

export interface TracePoint {
  offsetHz: number;
  phaseNoiseDbcHz: number;
}

/** Ideal frequency multiplication by N raises L(f) by 20·log10(N) dB (common practice). */
export function computeMultiplicationPenaltyDb(multiplicationFactor: number): number {
  if (!(multiplicationFactor > 0)) throw new RangeError(`Multiplication factor must be positive, got ${multiplicationFactor}`);
  return 20 * Math.log10(multiplicationFactor);
}

export interface MultiplierExcessOptions {
  inputPhaseNoiseDbcHz: number;
  outputPhaseNoiseDbcHz: number;
  multiplicationFactor: number;
}

/** Output noise above what an ideal ×N would give: L_out − (L_in + 20·log10 N), dB. Positive = the multiplier adds noise. */
export function computeExcessOverIdealMultiplicationDb(options: MultiplierExcessOptions): number {
  const { inputPhaseNoiseDbcHz, outputPhaseNoiseDbcHz, multiplicationFactor } = options;
  return outputPhaseNoiseDbcHz - inputPhaseNoiseDbcHz - computeMultiplicationPenaltyDb(multiplicationFactor);
}

/** L at one offset, linear in log10(offset) between the neighbouring points; throws outside the trace. */
export function interpolatePhaseNoiseDbcHz(trace: PhaseNoiseTrace, offsetHz: number): number {
  return interpolateSorted(readSortedTrace(trace), offsetHz);
}

export interface SpotPhaseNoise {
  offsetHz: number;
  phaseNoiseDbcHz: number;
}

/**
 * Spot L(f) at the requested offsets, by default every decade (1 Hz … 100 MHz)
 * that lies within the trace. Offsets outside the measured span are left out
 * rather than extrapolated.
 */
export function computeSpotPhaseNoise(
  trace: PhaseNoiseTrace,
  offsetsHz: readonly number[] = DECADE_OFFSETS_HZ,
): SpotPhaseNoise[] {
  const sorted = readSortedTrace(trace);
  const first = sorted.offsetHz[0];
  const last = sorted.offsetHz[sorted.offsetHz.length - 1];
  return offsetsHz
    .filter((offsetHz) => offsetHz >= first && offsetHz <= last)
    .map((offsetHz) => ({ offsetHz, phaseNoiseDbcHz: interpolateSorted(sorted, offsetHz) }));
}

export const DECADE_OFFSETS_HZ: readonly number[] = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8];

export interface IntegratePhaseNoiseOptions {
  trace: PhaseNoiseTrace;
  startOffsetHz: number;
  stopOffsetHz: number;
  carrierFrequencyHz: number;
}

export interface IntegratedPhaseNoise {
  /** A = ∫ L(f) df in linear units, expressed in dBc. */
  integratedPhaseNoiseDbc: number;
  /** φrms = √(2A), radians: both sidebands (Sφ = 2L). */
  phaseRmsRad: number;
  phaseRmsDeg: number;
  /** σt = φrms / (2π·f0), seconds. */
  jitterRmsS: number;
}

/**
 * Integrated phase noise between two offsets. Each segment between trace points
 * is a power law L(f) = L1·(f/f1)^b, b = ΔdB/(10·Δlog10 f), and is integrated
 * exactly: L1·f1/(b+1)·[(f2/f1)^(b+1) − 1], or L1·f1·ln(f2/f1) when b = −1
 * (10 dB/decade). φrms = √(2A), σt = φrms/(2π f0) (IEEE Std 1139-2008; the method
 * of MathWorks phaseNoiseToJitter).
 */
export function integratePhaseNoise(options: IntegratePhaseNoiseOptions): IntegratedPhaseNoise {
  const { startOffsetHz, stopOffsetHz, carrierFrequencyHz } = options;
  if (!(stopOffsetHz > startOffsetHz && startOffsetHz > 0)) {
    throw new RangeError(`Integration needs 0 < start < stop offset, got ${startOffsetHz} Hz to ${stopOffsetHz} Hz`);
  }
  if (!(carrierFrequencyHz > 0)) throw new RangeError(`Carrier frequency must be positive, got ${carrierFrequencyHz} Hz`);
  const sorted = readSortedTrace(options.trace);
  const offsets = sorted.offsetHz;
  const levels = sorted.phaseNoiseDbcHz;
  // Segments run start → every trace point strictly inside (start, stop) → stop, summed in that
  // order; the points are read in place rather than copied into a list of segment ends.
  let fromHz = startOffsetHz;
  let fromDbcHz = interpolateSorted(sorted, startOffsetHz);
  let integrated = 0;
  for (let i = upperBound(offsets, startOffsetHz); i < offsets.length && offsets[i] < stopOffsetHz; i++) {
    integrated += integratePowerLawSegment(fromHz, fromDbcHz, offsets[i], levels[i]);
    fromHz = offsets[i];
    fromDbcHz = levels[i];
  }
  integrated += integratePowerLawSegment(fromHz, fromDbcHz, stopOffsetHz, interpolateSorted(sorted, stopOffsetHz));
  const phaseRmsRad = Math.sqrt(2 * integrated);
  return {
    integratedPhaseNoiseDbc: 10 * Math.log10(integrated),
    phaseRmsRad,
    phaseRmsDeg: (phaseRmsRad * 180) / Math.PI,
    jitterRmsS: phaseRmsRad / (2 * Math.PI * carrierFrequencyHz),
  };
}

function integratePowerLawSegment(fromHz: number, fromDbcHz: number, toHz: number, toDbcHz: number): number {
  const ratio = toHz / fromHz;
  const startLinear = 10 ** (fromDbcHz / 10);
  const exponent = (toDbcHz - fromDbcHz) / (10 * Math.log10(ratio));
  const exponentPlusOne = exponent + 1;
  if (Math.abs(exponentPlusOne) < 1e-9) return startLinear * fromHz * Math.log(ratio);
  return ((startLinear * fromHz) / exponentPlusOne) * (ratio ** exponentPlusOne - 1);
}

/** Interpolates between the two points around offsetHz, found by binary search. */
function interpolateSorted(trace: SortedTrace, offsetHz: number): number {
  const { offsetHz: offsets, phaseNoiseDbcHz: levels } = trace;
  const count = offsets.length;
  const first = offsets[0];
  const last = offsets[count - 1];
  if (!(offsetHz >= first && offsetHz <= last)) {
    throw new RangeError(`Offset ${offsetHz} Hz lies outside the trace (${first} Hz to ${last} Hz)`);
  }
  if (count === 1) return levels[0];
  // The first point at or above the offset, but never the first point: the segment ends there.
  const high = Math.min(Math.max(lowerBound(offsets, offsetHz), 1), count - 1);
  const fraction = Math.log10(offsetHz / offsets[high - 1]) / Math.log10(offsets[high] / offsets[high - 1]);
  return levels[high - 1] + fraction * (levels[high] - levels[high - 1]);
}

/** A validated trace with strictly increasing offsets, as two parallel arrays. */
export interface SortedTrace {
  offsetHz: ArrayLike<number>;
  phaseNoiseDbcHz: ArrayLike<number>;
}

/**
 * Checks a trace (equal lengths, positive finite offsets, finite levels, at least one
 * point, no duplicate offset) and returns it in increasing offset order. A trace that is
 * already strictly increasing (every parsed file is: the parser checks it) is returned
 * as it is, without a copy or a sort: on a 100,000-point trace those dominated the
 * spur search and the integral.
 */
export function readSortedTrace(trace: PhaseNoiseTrace): SortedTrace {
  const { offsetHz, phaseNoiseDbcHz } = trace;
  if (offsetHz.length !== phaseNoiseDbcHz.length) {
    throw new RangeError(`Trace arrays differ in length: ${offsetHz.length} offsets, ${phaseNoiseDbcHz.length} levels`);
  }
  let increasing = true;
  for (let i = 0; i < offsetHz.length; i++) {
    if (!(offsetHz[i] > 0) || !Number.isFinite(offsetHz[i]) || !Number.isFinite(phaseNoiseDbcHz[i])) {
      throw new RangeError(`Trace point ${i} is not a positive offset with a finite level`);
    }
    if (i > 0 && !(offsetHz[i] > offsetHz[i - 1])) increasing = false;
  }
  if (offsetHz.length === 0) throw new RangeError("A phase-noise trace needs at least one point");
  if (increasing) return trace;

  const order = Array.from({ length: offsetHz.length }, (_, i) => i).sort((a, b) => offsetHz[a] - offsetHz[b]);
  for (let k = 1; k < order.length; k++) {
    if (offsetHz[order[k]] === offsetHz[order[k - 1]]) throw new RangeError(`Duplicate offset ${offsetHz[order[k]]} Hz`);
  }
  return { offsetHz: order.map((i) => offsetHz[i]), phaseNoiseDbcHz: order.map((i) => phaseNoiseDbcHz[i]) };
}

/** The trace as points in increasing offset order; see readSortedTrace for the checks. */
export function sortTrace(trace: PhaseNoiseTrace): TracePoint[] {
  const sorted = readSortedTrace(trace);
  const points: TracePoint[] = [];
  for (let i = 0; i < sorted.offsetHz.length; i++) {
    points.push({ offsetHz: sorted.offsetHz[i], phaseNoiseDbcHz: sorted.phaseNoiseDbcHz[i] });
  }
  return points;
}
