import { computeCapability, computeToleranceFactorExact, decideConformity, describeDecisionRule, summarizeSample } from "../stats";
import { emptyValue, formatTrimmed, formatValue, roundStable } from "./format";
import type { FormattedValue, SpecLimitInput, StatisticsFlag, UnitResult } from "./types";

export interface UnitValue {
  serial: string;
  lot: string | null;
  setId: string;
  value: number;
}

export interface GroupStatisticsOptions {
  label: string;
  unit: string;
  decimals: number;
  values: UnitValue[];
  limit: SpecLimitInput | undefined;
  /** Expanded uncertainty U (k = 2); undefined when none was stated. */
  expandedUncertainty: number | undefined;
  cpkThreshold: number;
  coverage: number;
  confidence: number;
}

export interface GroupStatistics {
  n: number;
  lots: number;
  mean: FormattedValue;
  standardDeviation: FormattedValue;
  median: FormattedValue;
  min: FormattedValue;
  max: FormattedValue;
  meanValue: number | null;
  toleranceInterval: { lower: FormattedValue; upper: FormattedValue; factor: FormattedValue } | null;
  cpk: FormattedValue;
  expandedUncertainty: FormattedValue;
  decisionRule: "guard-band" | "simple-acceptance" | null;
  ruleStatement: string | null;
  acceptance: { lower: FormattedValue; upper: FormattedValue } | null;
  units: UnitResult[];
  passCount: number;
  failCount: number;
  flags: StatisticsFlag[];
}

const toleranceFactors = new Map<string, number>();

/** The exact factor takes a numerical integration; a sheet asks for the same n many times. */
function toleranceFactor(sampleSize: number, coverage: number, confidence: number): number {
  const key = `${sampleSize}|${coverage}|${confidence}`;
  let factor = toleranceFactors.get(key);
  if (factor === undefined) {
    factor = computeToleranceFactorExact({ sampleSize, coverage, confidence });
    toleranceFactors.set(key, factor);
  }
  return factor;
}

/**
 * Statistics of one parameter in one condition group across units:
 * n, mean, s (n − 1), median, extremes; the two-sided normal tolerance
 * interval mean ± k·s with the exact factor (NIST/SEMATECH e-Handbook
 * §7.2.6.3); Cpk against the stated limits (NIST/SEMATECH §6.1.6); and a
 * conformity decision per unit: guarded acceptance w = U when U is known
 * (ILAC-G8:09/2019 §4.2.2), simple acceptance otherwise (§4.2.1).
 */
export function computeGroupStatistics(options: GroupStatisticsOptions): GroupStatistics {
  const { label, unit, decimals, values, limit, expandedUncertainty, cpkThreshold, coverage, confidence } = options;
  const statDecimals = decimals + 1;
  const flags: StatisticsFlag[] = [];
  const hasLimit = limit !== undefined && (limit.min !== undefined || limit.max !== undefined);
  const n = values.length;
  const lots = new Set(values.map((v) => v.lot ?? "")).size;

  let mean = emptyValue;
  let standardDeviation = emptyValue;
  let median = emptyValue;
  let min = emptyValue;
  let max = emptyValue;
  let meanValue: number | null = null;
  let toleranceInterval: GroupStatistics["toleranceInterval"] = null;
  let cpk = emptyValue;
  let s = Number.NaN;

  if (n > 0) {
    const summary = summarizeSample(values.map((v) => v.value));
    meanValue = summary.mean;
    s = summary.standardDeviation;
    mean = formatValue(summary.mean, statDecimals);
    standardDeviation = formatValue(Number.isFinite(s) ? s : null, statDecimals);
    median = formatValue(summary.median, statDecimals);
    min = formatValue(summary.min, statDecimals);
    max = formatValue(summary.max, statDecimals);
    if (n >= 2 && s > 0) {
      const factor = toleranceFactor(n, coverage, confidence);
      toleranceInterval = {
        lower: formatValue(summary.mean - factor * s, statDecimals),
        upper: formatValue(summary.mean + factor * s, statDecimals),
        factor: formatValue(factor, 3),
      };
    }
  }

  if (limit && limit.unit !== unit) {
    flags.push({ code: "limit-unit-mismatch", message: `The limit is stated in ${limit.unit || "no unit"}, the parameter in ${unit}.` });
  }

  if (hasLimit && n === 0) {
    flags.push({ code: "limit-without-data", message: "A limit is stated but no approved measurement supports it." });
  } else if (hasLimit && (n < 2 || !(s > 0))) {
    flags.push({
      code: "insufficient-data",
      message: n < 2 ? `Only ${n} unit measured: Cpk and a tolerance interval need at least 2.` : "All units read the same value: Cpk is undefined.",
    });
  } else if (hasLimit && meanValue !== null) {
    try {
      const capability = computeCapability({ mean: meanValue, standardDeviation: s, lowerSpecLimit: limit.min, upperSpecLimit: limit.max });
      cpk = formatValue(capability.cpk, 2);
      if (capability.cpk < cpkThreshold) {
        flags.push({
          code: "cpk-below-threshold",
          message: `Cpk ${formatTrimmed(capability.cpk, 2)} is below the threshold ${formatTrimmed(cpkThreshold, 2)}: the data do not support this limit.`,
        });
      }
    } catch (error) {
      flags.push({ code: "insufficient-data", message: error instanceof Error ? error.message : String(error) });
    }
  }

  let decisionRule: GroupStatistics["decisionRule"] = null;
  let ruleStatement: string | null = null;
  let acceptance: GroupStatistics["acceptance"] = null;
  const units: UnitResult[] = [];
  let passCount = 0;
  let failCount = 0;
  const known = expandedUncertainty !== undefined && expandedUncertainty >= 0;
  if (hasLimit) {
    decisionRule = known ? "guard-band" : "simple-acceptance";
    const u = known ? expandedUncertainty : 0;
    ruleStatement = known
      ? describeDecisionRule("guard-band", u, unit)
      : "Simple acceptance (ILAC-G8:09/2019 §4.2.1, guard band w = 0): no measurement uncertainty is stated for this " +
        "parameter, so a unit passes when its measured value lies within the specification limits.";
    const guardLower = limit.min === undefined ? null : limit.min + (known ? u : 0);
    const guardUpper = limit.max === undefined ? null : limit.max - (known ? u : 0);
    acceptance = { lower: formatValue(guardLower, statDecimals), upper: formatValue(guardUpper, statDecimals) };
    if (guardLower !== null && guardUpper !== null && guardLower > guardUpper) {
      flags.push({
        code: "guard-band-closes-acceptance",
        message: `Guard bands of U = ${formatTrimmed(u, 3)} ${unit} leave no acceptance zone between the limits.`,
      });
    }
  }

  for (const v of values) {
    let decision: UnitResult["decision"] = null;
    let conditional = false;
    if (hasLimit) {
      try {
        const result = decideConformity({
          measuredValue: v.value,
          lowerLimit: limit.min,
          upperLimit: limit.max,
          expandedUncertainty: known ? expandedUncertainty : 0,
          rule: known ? "guard-band" : "simple-acceptance",
          unit,
        });
        decision = result.decision;
        conditional = result.conditional;
      } catch {
        // The zone is closed (flagged above): no unit can be accepted.
        decision = "fail";
      }
      if (decision === "pass") passCount++;
      else failCount++;
    }
    units.push({ serial: v.serial, lot: v.lot, setId: v.setId, value: formatValue(v.value, statDecimals), decision, conditional });
  }
  if (failCount > 0) {
    const rule = decisionRule === "guard-band" ? "the guard-banded limit" : "the limit";
    flags.push({
      code: "unit-outside-acceptance",
      message: `${failCount} of ${n} units fall outside ${rule}: ${units
        .filter((u) => u.decision === "fail")
        .map((u) => u.serial)
        .join(", ")}.`,
    });
  }

  return {
    n,
    lots,
    mean,
    standardDeviation,
    median,
    min,
    max,
    meanValue: meanValue === null ? null : roundStable(meanValue),
    toleranceInterval,
    cpk,
    expandedUncertainty: known ? formatValue(expandedUncertainty, statDecimals) : emptyValue,
    decisionRule,
    ruleStatement: ruleStatement ? `${label}: ${ruleStatement}` : null,
    acceptance,
    units,
    passCount,
    failCount,
    flags,
  };
}
