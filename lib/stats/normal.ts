import { computeRegularizedGammaQ } from "./gamma";

const SQRT_TWO_PI = Math.sqrt(2 * Math.PI);

export function computeNormalDensity(z: number): number {
  return Math.exp(-0.5 * z * z) / SQRT_TWO_PI;
}

/** Standard normal CDF Φ(z) = ½·erfc(−z/√2), with erfc(t) = Q(½, t²) for t ≥ 0 (Abramowitz & Stegun, ch. 6–7). */
export function computeNormalCdf(z: number): number {
  if (Number.isNaN(z)) return Number.NaN;
  if (z === Infinity) return 1;
  if (z === -Infinity) return 0;
  const tail = 0.5 * computeRegularizedGammaQ(0.5, 0.5 * z * z);
  return z < 0 ? tail : 1 - tail;
}

const ACKLAM_A = [
  -3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1,
  2.506628277459239,
];
const ACKLAM_B = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
const ACKLAM_C = [
  -7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968,
  2.938163982698783,
];
const ACKLAM_D = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
const ACKLAM_LOW = 0.02425;

/**
 * Standard normal quantile z with Φ(z) = p: P. J. Acklam's rational approximation
 * (relative error below 1.2e-9) refined by one Halley step on Φ, which brings it
 * to about full double precision. The upper half uses the symmetry z(p) = −z(1 − p).
 */
export function computeNormalQuantile(probability: number): number {
  if (!(probability >= 0 && probability <= 1)) throw new RangeError(`Probability must lie in [0, 1], got ${probability}`);
  if (probability === 0) return -Infinity;
  if (probability === 1) return Infinity;
  if (probability > 0.5) return -computeNormalQuantile(1 - probability);
  let z: number;
  if (probability < ACKLAM_LOW) {
    const q = Math.sqrt(-2 * Math.log(probability));
    z =
      (((((ACKLAM_C[0] * q + ACKLAM_C[1]) * q + ACKLAM_C[2]) * q + ACKLAM_C[3]) * q + ACKLAM_C[4]) * q + ACKLAM_C[5]) /
      ((((ACKLAM_D[0] * q + ACKLAM_D[1]) * q + ACKLAM_D[2]) * q + ACKLAM_D[3]) * q + 1);
  } else {
    const q = probability - 0.5;
    const r = q * q;
    z =
      ((((((ACKLAM_A[0] * r + ACKLAM_A[1]) * r + ACKLAM_A[2]) * r + ACKLAM_A[3]) * r + ACKLAM_A[4]) * r + ACKLAM_A[5]) *
        q) /
      (((((ACKLAM_B[0] * r + ACKLAM_B[1]) * r + ACKLAM_B[2]) * r + ACKLAM_B[3]) * r + ACKLAM_B[4]) * r + 1);
  }
  const error = computeNormalCdf(z) - probability;
  const u = error * SQRT_TWO_PI * Math.exp(0.5 * z * z);
  return z - u / (1 + 0.5 * z * u);
}
