import { type Complex, computeComplexAngleDeg, computeComplexMagnitude } from "./complex";

/**
 * Amplitude and phase balance between two outputs of a hybrid or splitter,
 * from the complex transmissions S_A1 and S_B1 (input to each output).
 */

/** 20·log10|S_A| − 20·log10|S_B|, dB. */
export function computeAmplitudeBalanceDb(outputA: Complex, outputB: Complex): number {
  const magnitudeA = computeComplexMagnitude(outputA);
  const magnitudeB = computeComplexMagnitude(outputB);
  if (!(magnitudeA > 0 && magnitudeB > 0)) throw new RangeError("An output transmission is zero");
  return 20 * Math.log10(magnitudeA / magnitudeB);
}

export interface PhaseBalanceOptions {
  outputA: Complex;
  outputB: Complex;
  /** Designed phase difference ∠S_A − ∠S_B: 90 for a quadrature hybrid, 0 for an in-phase splitter, 180 for a balun. */
  nominalPhaseDifferenceDeg: number;
}

/** (∠S_A − ∠S_B) − nominal, wrapped into (−180°, 180°]. */
export function computePhaseBalanceDeg(options: PhaseBalanceOptions): number {
  const { outputA, outputB, nominalPhaseDifferenceDeg } = options;
  return wrapDeg(computeComplexAngleDeg(outputA) - computeComplexAngleDeg(outputB) - nominalPhaseDifferenceDeg);
}

export interface PhaseBalanceSweepOptions {
  outputA: readonly Complex[];
  outputB: readonly Complex[];
  nominalPhaseDifferenceDeg: number;
}

/**
 * Phase balance across a frequency sweep: each output's phase is unwrapped along
 * frequency, their difference minus the nominal is taken, and the whole curve is
 * shifted by one multiple of 360° so its first point lies in (−180°, 180°]. A
 * balance that drifts past ±180° stays continuous instead of jumping.
 */
export function computePhaseBalanceSweepDeg(options: PhaseBalanceSweepOptions): number[] {
  const { outputA, outputB, nominalPhaseDifferenceDeg } = options;
  if (outputA.length !== outputB.length) {
    throw new RangeError(`Output traces differ in length: ${outputA.length} and ${outputB.length}`);
  }
  if (outputA.length === 0) return [];
  const phaseA = unwrapPhaseDeg(outputA.map(computeComplexAngleDeg));
  const phaseB = unwrapPhaseDeg(outputB.map(computeComplexAngleDeg));
  const raw = phaseA.map((a, i) => a - phaseB[i] - nominalPhaseDifferenceDeg);
  const shift = wrapDeg(raw[0]) - raw[0];
  return raw.map((value) => value + shift);
}

/** Removes 360° jumps between consecutive phase samples (degrees). */
export function unwrapPhaseDeg(phaseDeg: ArrayLike<number>): number[] {
  const unwrapped: number[] = [];
  let offset = 0;
  for (let i = 0; i < phaseDeg.length; i++) {
    if (i > 0) {
      const step = phaseDeg[i] + offset - unwrapped[i - 1];
      offset -= 360 * Math.round(step / 360);
    }
    unwrapped.push(phaseDeg[i] + offset);
  }
  return unwrapped;
}

function wrapDeg(angleDeg: number): number {
  const wrapped = angleDeg - 360 * Math.floor(angleDeg / 360);
  return wrapped > 180 ? wrapped - 360 : wrapped;
}
