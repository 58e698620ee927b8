import { computeLogGamma } from "./gamma";
import { computeNormalQuantile } from "./normal";
import { computeMean, computeSampleStandardDeviation } from "./descriptive";

const RELATIVE_EPSILON = 1e-15;
const TINY = 1e-300;

/** Regularized incomplete beta I_x(a, b), continued fraction by modified Lentz (Numerical Recipes 3rd ed. §6.4). */
export function computeRegularizedBeta(x: number, a: number, b: number): number {
  if (!(a > 0 && b > 0)) throw new RangeError(`Beta parameters must be positive, got ${a}, ${b}`);
  if (!(x >= 0 && x <= 1)) throw new RangeError(`x must lie in [0, 1], got ${x}`);
  if (x === 0 || x === 1) return x;
  const logFront =
    computeLogGamma(a + b) - computeLogGamma(a) - computeLogGamma(b) + a * Math.log(x) + b * Math.log(1 - x);
  if (x < (a + 1) / (a + b + 2)) return (Math.exp(logFront) * betaContinuedFraction(x, a, b)) / a;
  return 1 - (Math.exp(logFront) * betaContinuedFraction(1 - x, b, a)) / b;
}

function betaContinuedFraction(x: number, a: number, b: number): number {
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m < 10000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < RELATIVE_EPSILON) break;
  }
  return h;
}

/** Student t CDF with ν degrees of freedom: the tail is ½·I_{ν/(ν+t²)}(ν/2, ½) (Abramowitz & Stegun, ch. 26). */
export function computeStudentTCdf(t: number, degreesOfFreedom: number): number {
  assertDegreesOfFreedom(degreesOfFreedom);
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const tail = 0.5 * computeRegularizedBeta(degreesOfFreedom / (degreesOfFreedom + t * t), degreesOfFreedom / 2, 0.5);
  return t > 0 ? 1 - tail : tail;
}

function computeStudentTDensity(t: number, degreesOfFreedom: number): number {
  const nu = degreesOfFreedom;
  const logDensity =
    computeLogGamma((nu + 1) / 2) -
    computeLogGamma(nu / 2) -
    0.5 * Math.log(nu * Math.PI) -
    ((nu + 1) / 2) * Math.log1p((t * t) / nu);
  return Math.exp(logDensity);
}

/** Student t quantile: Newton's method inside a bisection bracket, started from the normal quantile. */
export function computeStudentTQuantile(probability: number, degreesOfFreedom: number): number {
  assertDegreesOfFreedom(degreesOfFreedom);
  if (!(probability >= 0 && probability <= 1)) throw new RangeError(`Probability must lie in [0, 1], got ${probability}`);
  if (probability === 0) return -Infinity;
  if (probability === 1) return Infinity;
  if (probability < 0.5) return -computeStudentTQuantile(1 - probability, degreesOfFreedom);
  if (probability === 0.5) return 0;
  const upperTail = 1 - probability;
  const tail = (t: number) => 1 - computeStudentTCdf(t, degreesOfFreedom) - upperTail;
  let low = 0;
  let high = Math.max(1, computeNormalQuantile(probability));
  while (tail(high) > 0) high *= 2;
  let t = 0.5 * (low + high);
  for (let iteration = 0; iteration < 200; iteration++) {
    const value = tail(t);
    if (value > 0) low = t;
    else high = t;
    let next = t + value / computeStudentTDensity(t, degreesOfFreedom);
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    if (Math.abs(next - t) < 1e-14 * Math.max(1, t)) return next;
    t = next;
  }
  return t;
}

export interface MeanConfidenceInterval {
  mean: number;
  lower: number;
  upper: number;
  confidence: number;
}

/** Two-sided confidence interval of the mean, mean ± t_{(1+c)/2, n−1}·s/√n (NIST/SEMATECH e-Handbook §7.2.2.1). */
export function computeMeanConfidenceInterval(values: ArrayLike<number>, confidence = 0.95): MeanConfidenceInterval {
  if (values.length < 2) throw new RangeError(`A confidence interval of the mean needs at least 2 values, got ${values.length}`);
  if (!(confidence > 0 && confidence < 1)) throw new RangeError(`Confidence must lie in (0, 1), got ${confidence}`);
  const mean = computeMean(values);
  const halfWidth =
    (computeStudentTQuantile((1 + confidence) / 2, values.length - 1) * computeSampleStandardDeviation(values)) /
    Math.sqrt(values.length);
  return { mean, lower: mean - halfWidth, upper: mean + halfWidth, confidence };
}

function assertDegreesOfFreedom(degreesOfFreedom: number): void {
  if (!(degreesOfFreedom > 0)) throw new RangeError(`Degrees of freedom must be positive, got ${degreesOfFreedom}`);
}
