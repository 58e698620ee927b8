import { computeChiSquareQuantile, computeChiSquareSurvival } from "./gamma";
import { computeNormalCdf, computeNormalDensity, computeNormalQuantile } from "./normal";

export interface ToleranceFactorOptions {
  sampleSize: number;
  /** Proportion of the population the interval should cover, e.g. 0.95. */
  coverage: number;
  /** Confidence that it does, e.g. 0.95. */
  confidence: number;
}

export type ToleranceMethod = "howe" | "exact";

/**
 * Two-sided normal tolerance factor by Howe's approximation, as given in the
 * NIST/SEMATECH e-Handbook of Statistical Methods §7.2.6.3:
 *   k = z_{(1+p)/2} · √[(n − 1)(1 + 1/n) / χ²_{1−γ, n−1}]
 * where χ²_{1−γ, n−1} is the lower (1 − γ) quantile. Slightly low for small n:
 * 2.838 against the exact 2.856 for n = 10, p = 0.90, γ = 0.95.
 */
export function computeToleranceFactorHowe(options: ToleranceFactorOptions): number {
  const { sampleSize: n, coverage, confidence } = validate(options);
  const z = computeNormalQuantile((1 + coverage) / 2);
  const chiSquare = computeChiSquareQuantile(1 - confidence, n - 1);
  return z * Math.sqrt(((n - 1) * (1 + 1 / n)) / chiSquare);
}

const INTEGRATION_LIMIT_Z = 8.5;
const INTEGRATION_INTERVALS = 1000;

/**
 * Exact two-sided normal tolerance factor (Odeh & Owen, Tables for Normal
 * Tolerance Limits, 1980; Krishnamoorthy & Mathew, Statistical Tolerance Regions,
 * 2009, §2.3): k solves
 *   γ = 2 ∫₀^∞ φ(z) · P(χ²_{n−1} > (n−1)·r²(z/√n; p) / k²) dz,
 * where r(x; p) solves Φ(x + r) − Φ(x − r) = p. The integral is taken by
 * composite Simpson over z ∈ [0, 8.5] and k by bisection; about 6 significant digits.
 */
export function computeToleranceFactorExact(options: ToleranceFactorOptions): number {
  const { sampleSize: n, coverage, confidence } = validate(options);
  const degreesOfFreedom = n - 1;
  const step = INTEGRATION_LIMIT_Z / INTEGRATION_INTERVALS;
  const weights: number[] = [];
  const squaredHalfWidths: number[] = [];
  for (let i = 0; i <= INTEGRATION_INTERVALS; i++) {
    const z = i * step;
    const simpson = i === 0 || i === INTEGRATION_INTERVALS ? 1 : i % 2 === 1 ? 4 : 2;
    weights.push(((2 * step) / 3) * simpson * computeNormalDensity(z));
    squaredHalfWidths.push(solveCoverageHalfWidth(z / Math.sqrt(n), coverage) ** 2);
  }
  const achievedConfidence = (k: number) => {
    let sum = 0;
    for (let i = 0; i < weights.length; i++) {
      sum += weights[i] * computeChiSquareSurvival((degreesOfFreedom * squaredHalfWidths[i]) / (k * k), degreesOfFreedom);
    }
    return sum;
  };

  const howe = computeToleranceFactorHowe(options);
  let low = 0.5 * howe;
  let high = 2 * howe;
  while (achievedConfidence(high) < confidence) high *= 2;
  for (let iteration = 0; iteration < 60 && high - low > 1e-10 * high; iteration++) {
    const middle = 0.5 * (low + high);
    if (achievedConfidence(middle) < confidence) low = middle;
    else high = middle;
  }
  return 0.5 * (low + high);
}

export function computeToleranceFactor(options: ToleranceFactorOptions & { method: ToleranceMethod }): number {
  return options.method === "exact" ? computeToleranceFactorExact(options) : computeToleranceFactorHowe(options);
}

export interface ToleranceIntervalOptions extends ToleranceFactorOptions {
  mean: number;
  standardDeviation: number;
  method?: ToleranceMethod;
}

export interface ToleranceInterval {
  lower: number;
  upper: number;
  factor: number;
  method: ToleranceMethod;
  coverage: number;
  confidence: number;
}

/** mean ± k·s: proposed min/max limits that cover `coverage` of units with `confidence`. */
export function computeToleranceInterval(options: ToleranceIntervalOptions): ToleranceInterval {
  const { mean, standardDeviation, method = "exact", coverage, confidence } = options;
  if (!(standardDeviation >= 0)) throw new RangeError(`Standard deviation must be non-negative, got ${standardDeviation}`);
  const factor = computeToleranceFactor({ ...options, method });
  return {
    lower: mean - factor * standardDeviation,
    upper: mean + factor * standardDeviation,
    factor,
    method,
    coverage,
    confidence,
  };
}

/** Half-width r with Φ(x + r) − Φ(x − r) = p, by Newton's method kept inside a bisection bracket. */
function solveCoverageHalfWidth(x: number, coverage: number): number {
  const target = (value: number) => computeNormalCdf(x + value) - computeNormalCdf(x - value) - coverage;
  let low = 0;
  let high = Math.abs(x) + computeNormalQuantile((1 + coverage) / 2) + 1;
  let r = Math.abs(x) + computeNormalQuantile(coverage);
  if (!(r > low && r < high)) r = 0.5 * (low + high);
  for (let iteration = 0; iteration < 100; iteration++) {
    const value = target(r);
    if (value > 0) high = r;
    else low = r;
    const slope = computeNormalDensity(x + r) + computeNormalDensity(x - r);
    let next = r - value / slope;
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    if (Math.abs(next - r) < 1e-14 * Math.max(1, r)) return next;
    r = next;
  }
  return r;
}

function validate(options: ToleranceFactorOptions): ToleranceFactorOptions {
  const { sampleSize, coverage, confidence } = options;
  if (!Number.isInteger(sampleSize) || sampleSize < 2) {
    throw new RangeError(`A tolerance interval needs an integer sample size of at least 2, got ${sampleSize}`);
  }
  if (!(coverage > 0 && coverage < 1)) throw new RangeError(`Coverage must lie in (0, 1), got ${coverage}`);
  if (!(confidence > 0 && confidence < 1)) throw new RangeError(`Confidence must lie in (0, 1), got ${confidence}`);
  return options;
}
