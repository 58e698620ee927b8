/**
 * Gamma-function family, implemented here so the chi-square and normal quantiles
 * need no dependency. Methods as in Press et al., Numerical Recipes, 3rd ed., §6.1–6.2.
 */

const LANCZOS_G = 7;
const LANCZOS_COEFFICIENTS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];
const RELATIVE_EPSILON = 1e-15;
const TINY = 1e-300;
const MAX_ITERATIONS = 1000;

/** ln Γ(x) for x > 0 (Lanczos approximation, g = 7, nine terms; about 15 significant digits). */
export function computeLogGamma(x: number): number {
  if (!(x > 0)) throw new RangeError(`ln Γ needs x > 0, got ${x}`);
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - computeLogGamma(1 - x);
  const shifted = x - 1;
  let sum = LANCZOS_COEFFICIENTS[0];
  for (let i = 1; i < LANCZOS_COEFFICIENTS.length; i++) sum += LANCZOS_COEFFICIENTS[i] / (shifted + i);
  const t = shifted + LANCZOS_G + 0.5;
  return 0.5 * Math.log(2 * Math.PI) + (shifted + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** Regularized lower incomplete gamma P(a, x) = γ(a, x)/Γ(a). */
export function computeRegularizedGammaP(a: number, x: number): number {
  assertGammaArguments(a, x);
  if (x === 0) return 0;
  return x < a + 1 ? seriesGammaP(a, x) : 1 - continuedFractionGammaQ(a, x);
}

/** Regularized upper incomplete gamma Q(a, x) = 1 − P(a, x), accurate in the far tail. */
export function computeRegularizedGammaQ(a: number, x: number): number {
  assertGammaArguments(a, x);
  if (x === 0) return 1;
  return x < a + 1 ? 1 - seriesGammaP(a, x) : continuedFractionGammaQ(a, x);
}

/**
 * x such that P(a, x) = p: initial guess and Halley iteration as in Numerical
 * Recipes 3rd ed. §6.2.1 (invgammp), iterated to full double precision.
 */
export function computeInverseRegularizedGammaP(a: number, p: number): number {
  if (!(a > 0)) throw new RangeError(`Shape a must be positive, got ${a}`);
  if (!(p >= 0 && p <= 1)) throw new RangeError(`Probability must lie in [0, 1], got ${p}`);
  if (p === 0) return 0;
  if (p === 1) return Infinity;
  const logGammaA = computeLogGamma(a);
  const aMinusOne = a - 1;
  const logAMinusOne = a > 1 ? Math.log(aMinusOne) : 0;
  const scale = a > 1 ? Math.exp(aMinusOne * (logAMinusOne - 1) - logGammaA) : 0;

  let x: number;
  if (a > 1) {
    const tailP = p < 0.5 ? p : 1 - p;
    const t = Math.sqrt(-2 * Math.log(tailP));
    let z = (2.30753 + t * 0.27061) / (1 + t * (0.99229 + t * 0.04481)) - t;
    if (p < 0.5) z = -z;
    x = Math.max(1e-3, a * (1 - 1 / (9 * a) - z / (3 * Math.sqrt(a))) ** 3);
  } else {
    const t = 1 - a * (0.253 + a * 0.12);
    x = p < t ? (p / t) ** (1 / a) : 1 - Math.log(1 - (p - t) / (1 - t));
  }

  for (let iteration = 0; iteration < 100; iteration++) {
    if (x <= 0) return 0;
    const error = computeRegularizedGammaP(a, x) - p;
    const density =
      a > 1
        ? scale * Math.exp(-(x - aMinusOne) + aMinusOne * (Math.log(x) - logAMinusOne))
        : Math.exp(-x + aMinusOne * Math.log(x) - logGammaA);
    if (density === 0) break;
    const newtonStep = error / density;
    const step = newtonStep / (1 - 0.5 * Math.min(1, newtonStep * (aMinusOne / x - 1)));
    x -= step;
    if (x <= 0) x = 0.5 * (x + step);
    if (Math.abs(step) < 1e-15 * x) break;
  }
  return x;
}

/** Lower-tail quantile of the chi-square distribution: P(χ²_ν ≤ x) = p. */
export function computeChiSquareQuantile(probability: number, degreesOfFreedom: number): number {
  if (!(degreesOfFreedom > 0)) throw new RangeError(`Degrees of freedom must be positive, got ${degreesOfFreedom}`);
  return 2 * computeInverseRegularizedGammaP(degreesOfFreedom / 2, probability);
}

/** Upper-tail probability P(χ²_ν > x). */
export function computeChiSquareSurvival(x: number, degreesOfFreedom: number): number {
  if (!(degreesOfFreedom > 0)) throw new RangeError(`Degrees of freedom must be positive, got ${degreesOfFreedom}`);
  return computeRegularizedGammaQ(degreesOfFreedom / 2, Math.max(0, x) / 2);
}

function seriesGammaP(a: number, x: number): number {
  let term = 1 / a;
  let sum = term;
  let denominator = a;
  for (let i = 0; i < MAX_ITERATIONS; i++) {
    denominator += 1;
    term *= x / denominator;
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * RELATIVE_EPSILON) break;
  }
  return sum * Math.exp(-x + a * Math.log(x) - computeLogGamma(a));
}

/** Q(a, x) by the modified Lentz continued fraction. */
function continuedFractionGammaQ(a: number, x: number): number {
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < MAX_ITERATIONS; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < RELATIVE_EPSILON) break;
  }
  return Math.exp(-x + a * Math.log(x) - computeLogGamma(a)) * h;
}

function assertGammaArguments(a: number, x: number): void {
  if (!(a > 0)) throw new RangeError(`Shape a must be positive, got ${a}`);
  if (!(x >= 0)) throw new RangeError(`x must be non-negative, got ${x}`);
}
