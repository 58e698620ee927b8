import {
  type Complex,
  computeComplexAngleDeg,
  computeComplexMagnitude,
  divideComplex,
  subtractComplex,
  addComplex,
} from "./complex";
import { DEFAULT_IMPEDANCE_OHM } from "./units";

/**
 * Port match and transmission. Formulas as in any microwave-engineering text
 * (e.g. Pozar, Microwave Engineering, §2.3):
 *   Γ = (Z_L − Z_0)/(Z_L + Z_0), VSWR = (1+|Γ|)/(1−|Γ|),
 *   RL = −20·log10|Γ|, ML = −10·log10(1 − |Γ|²).
 */

/** Γ of a load impedance (complex, or a real resistance) on a real reference impedance. */
export function computeReflectionCoefficient(
  loadImpedanceOhm: Complex | number,
  referenceImpedanceOhm = DEFAULT_IMPEDANCE_OHM,
): Complex {
  const load = typeof loadImpedanceOhm === "number" ? { re: loadImpedanceOhm, im: 0 } : loadImpedanceOhm;
  const reference = { re: referenceImpedanceOhm, im: 0 };
  return divideComplex(subtractComplex(load, reference), addComplex(load, reference));
}

/** Z = Z_0·(1 + Γ)/(1 − Γ); Γ may be a measured S11. */
export function computeLoadImpedanceOhm(
  reflection: Complex,
  referenceImpedanceOhm = DEFAULT_IMPEDANCE_OHM,
): Complex {
  const ratio = divideComplex(addComplex({ re: 1, im: 0 }, reflection), subtractComplex({ re: 1, im: 0 }, reflection));
  return { re: ratio.re * referenceImpedanceOhm, im: ratio.im * referenceImpedanceOhm };
}

/** Return loss in dB, positive for a passive port; Infinity for a perfect match. */
export function computeReturnLossDb(reflectionMagnitude: number): number {
  assertReflectionMagnitude(reflectionMagnitude);
  return -20 * Math.log10(reflectionMagnitude);
}

/** VSWR; Infinity for total reflection. */
export function computeVswr(reflectionMagnitude: number): number {
  assertReflectionMagnitude(reflectionMagnitude);
  return (1 + reflectionMagnitude) / (1 - reflectionMagnitude);
}

export function convertVswrToReflectionMagnitude(vswr: number): number {
  if (!(vswr >= 1)) throw new RangeError(`VSWR must be at least 1, got ${vswr}`);
  return (vswr - 1) / (vswr + 1);
}

export function convertReturnLossToReflectionMagnitude(returnLossDb: number): number {
  return 10 ** (-returnLossDb / 20);
}

/** Mismatch loss: power not delivered because of reflection, dB. */
export function computeMismatchLossDb(reflectionMagnitude: number): number {
  assertReflectionMagnitude(reflectionMagnitude);
  return -10 * Math.log10(1 - reflectionMagnitude * reflectionMagnitude);
}

export interface PortMatch {
  reflectionMagnitude: number;
  reflectionAngleDeg: number;
  returnLossDb: number;
  vswr: number;
  mismatchLossDb: number;
}

/** Every match figure of one port from its complex reflection coefficient (e.g. S11 as re/im). */
export function summarizePortMatch(reflection: Complex): PortMatch {
  const reflectionMagnitude = computeComplexMagnitude(reflection);
  return {
    reflectionMagnitude,
    reflectionAngleDeg: computeComplexAngleDeg(reflection),
    returnLossDb: computeReturnLossDb(reflectionMagnitude),
    vswr: computeVswr(reflectionMagnitude),
    mismatchLossDb: computeMismatchLossDb(reflectionMagnitude),
  };
}

/** 20·log10|S|, the transmission magnitude in dB (negative for a passive path). */
export function computeTransmissionDb(transmission: Complex): number {
  const magnitude = computeComplexMagnitude(transmission);
  if (!(magnitude > 0)) throw new RangeError("Transmission magnitude is zero: no finite dB value");
  return 20 * Math.log10(magnitude);
}

/** Insertion loss −20·log10|S21|, positive for a passive path. */
export function computeInsertionLossDb(transmission: Complex): number {
  return -computeTransmissionDb(transmission);
}

/** Isolation between ports i and j: −20·log10|Sij|, positive for a passive device. */
export function computeIsolationDb(transmission: Complex): number {
  return -computeTransmissionDb(transmission);
}

function assertReflectionMagnitude(reflectionMagnitude: number): void {
  if (!(reflectionMagnitude >= 0 && reflectionMagnitude <= 1)) {
    throw new RangeError(`|Γ| must lie in [0, 1] for a passive port, got ${reflectionMagnitude}`);
  }
}
