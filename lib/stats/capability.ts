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
