import { computeNormalQuantile } from "./normal";

export interface CapabilityOptions {
  mean: number;
  standardDeviation: number;
  lowerSpecLimit?: number;
  upperSpecLimit?: number;
}

export interface Capability {
  /** (USL − LSL)/(6σ); null unless both limits are given. */
  cp: number | null;
  /** (USL − μ)/(3σ); null without an upper limit. */
  cpu: number | null;
  /** (μ − LSL)/(3σ); null without a lower limit. */
  cpl: number | null;
  /** min(Cpu, Cpl) over the sides that have a limit: a one-sided spec gives Cpk from that side alone. */
  cpk: number;
}

/**
 * Process capability indices (NIST/SEMATECH e-Handbook of Statistical Methods §6.1.6):
 * Cp = (USL − LSL)/(6σ), Cpk = min[(USL − μ)/(3σ), (μ − LSL)/(3σ)].
 */
export function computeCapability(options: CapabilityOptions): Capability {
  const { mean, standardDeviation, lowerSpecLimit, upperSpecLimit } = options;
  if (lowerSpecLimit === undefined && upperSpecLimit === undefined) {
    throw new RangeError("Capability needs at least one specification limit");
  }
  if (!(standardDeviation > 0)) throw new RangeError(`Standard deviation must be positive, got ${standardDeviation}`);
  if (lowerSpecLimit !== undefined && upperSpecLimit !== undefined && !(upperSpecLimit > lowerSpecLimit)) {
    throw new RangeError(`Upper limit ${upperSpecLimit} must exceed lower limit ${lowerSpecLimit}`);
  }
  const cpu = upperSpecLimit === undefined ? null : (upperSpecLimit - mean) / (3 * standardDeviation);
  const cpl = lowerSpecLimit === undefined ? null : (mean - lowerSpecLimit) / (3 * standardDeviation);
  const cp =
    lowerSpecLimit === undefined || upperSpecLimit === undefined
      ? null
      : (upperSpecLimit - lowerSpecLimit) / (6 * standardDeviation);
  const sides = [cpu, cpl].filter((value): value is number => value !== null);
  return { cp, cpu, cpl, cpk: Math.min(...sides) };
}

/**
 * Two-sided confidence interval of an estimated Cpk by Bissell's normal approximation:
 * Ĉpk ± z_{1−α/2}·√(1/(9n) + Ĉpk²/(2(n − 1))) (A. F. Bissell, "How reliable is your capability index?",
 * Applied Statistics 39 (1990) 331–340; the same interval is given in NIST/SEMATECH e-Handbook §6.1.6;
 * both cited from memory). Normal data and n of about 10 or more; the lower end is not allowed below 0.
 */
export function computeCpkConfidenceInterval(options: { cpk: number; sampleSize: number; confidence: number }): { lower: number; upper: number } {
  const { cpk, sampleSize: n, confidence } = options;
  if (!Number.isInteger(n) || n < 2) throw new RangeError(`Sample size must be an integer of at least 2, got ${n}`);
  if (!(confidence > 0 && confidence < 1)) throw new RangeError(`Confidence must lie between 0 and 1, got ${confidence}`);
  const z = computeNormalQuantile(1 - (1 - confidence) / 2);
  const standardError = Math.sqrt(1 / (9 * n) + (cpk * cpk) / (2 * (n - 1)));
  return { lower: Math.max(0, cpk - z * standardError), upper: cpk + z * standardError };
}
