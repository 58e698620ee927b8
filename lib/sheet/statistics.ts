import { computeCapability, computeCpkConfidenceInterval, computeToleranceFactorExact, decideConformity, describeDecisionRule, summarizeSample } from "../stats";
import { differenceUnit, formatNumber, formatQuantity } from "../format/quantity";
import { emptyValue, formatValue, roundStable } from "./format";
import type { FormattedValue, SampleFigures, SpecLimitInput, StatisticsFlag, UnitResult } from "./types";

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
  /** Cpk is printed only from this many units or more (the organization's setting). */
  cpkMinUnits: number;
  coverage: number;
  confidence: number;
}

export interface GroupStatistics extends SampleFigures {
  meanValue: number | null;
  /** The sample standard deviation unrounded (NaN below two units): what a typical value's digits follow. */
  spreadValue: number;
  /** Why Cpk is left blank although a limit is stated and the units vary: too few of them. */
  cpkAbsentReason: string | null;
  ruleStatement: string | null;
}

/** The organization's default minimum of units behind a printed Cpk (organizations.cpkMinUnits). */
export const DEFAULT_CPK_MIN_UNITS = 10;

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
  const { label, unit, decimals, values, limit, expandedUncertainty, cpkThreshold, cpkMinUnits, coverage, confidence } = options;
  const statDecimals = decimals + 1;
  const flags: StatisticsFlag[] = [];
  const stated = limit !== undefined && (limit.min !== undefined || limit.max !== undefined) ? limit : undefined;
  const sample = describeSample(values, statDecimals, coverage, confidence);

  if (limit && limit.unit !== unit) {
    flags.push({ code: "limit-unit-mismatch", message: `The limit is stated in ${limit.unit || "no unit"}, the parameter in ${unit}.` });
  }
  const capability = stated ? judgeCapability({ sample, limit: stated, cpkThreshold, cpkMinUnits, confidence, flags }) : { cpk: emptyValue, absentReason: null };
  const known = expandedUncertainty !== undefined && expandedUncertainty >= 0 ? expandedUncertainty : undefined;
  const decisions = decideUnits({ values, limit: stated, expandedUncertainty: known, unit, statDecimals, flags });

  return {
    n: sample.n,
    lots: new Set(values.map((v) => v.lot ?? "")).size,
    mean: sample.mean,
    standardDeviation: sample.standardDeviation,
    median: sample.median,
    min: sample.min,
    max: sample.max,
    meanValue: sample.meanValue === null ? null : roundStable(sample.meanValue),
    spreadValue: sample.s,
    toleranceInterval: sample.toleranceInterval,
    cpk: capability.cpk,
    ...(capability.interval ? { cpkInterval: capability.interval } : {}),
    cpkAbsentReason: capability.absentReason,
    expandedUncertainty: known !== undefined ? formatValue(known, statDecimals) : emptyValue,
    decisionRule: decisions.decisionRule,
    ruleStatement: decisions.ruleStatement ? `${label}: ${decisions.ruleStatement}` : null,
    acceptance: decisions.acceptance,
    units: decisions.units,
    passCount: decisions.passCount,
    failCount: decisions.failCount,
    flags,
  };
}

type SampleDescription = Pick<GroupStatistics, "n" | "mean" | "standardDeviation" | "median" | "min" | "max" | "meanValue" | "toleranceInterval"> & {
  /** The sample standard deviation, NaN below two values. */
  s: number;
};

/** n, mean, s, median, extremes and the tolerance interval of the values. */
function describeSample(values: UnitValue[], statDecimals: number, coverage: number, confidence: number): SampleDescription {
  const n = values.length;
  if (n === 0) {
    return { n, mean: emptyValue, standardDeviation: emptyValue, median: emptyValue, min: emptyValue, max: emptyValue, meanValue: null, toleranceInterval: null, s: Number.NaN };
  }
  const summary = summarizeSample(values.map((v) => v.value));
  const s = summary.standardDeviation;
  let toleranceInterval: GroupStatistics["toleranceInterval"] = null;
  if (n >= 2 && s > 0) {
    const factor = toleranceFactor(n, coverage, confidence);
    toleranceInterval = {
      lower: formatValue(summary.mean - factor * s, statDecimals),
      upper: formatValue(summary.mean + factor * s, statDecimals),
      factor: formatValue(factor, 3),
    };
  }
  return {
    n,
    mean: formatValue(summary.mean, statDecimals),
    standardDeviation: formatValue(Number.isFinite(s) ? s : null, statDecimals),
    median: formatValue(summary.median, statDecimals),
    min: formatValue(summary.min, statDecimals),
    max: formatValue(summary.max, statDecimals),
    meanValue: summary.mean,
    toleranceInterval,
    s,
  };
}

/**
 * Cpk against the stated limits, flagging a limit the data cannot judge or do not support. Cpk is
 * printed only from `cpkMinUnits` units or more: from fewer, its estimate is too uncertain to mean
 * something (the approximate standard error sqrt(1/(9n) + Cpk²/(2(n − 1))), Bissell 1990, as given in
 * NIST/SEMATECH §6.1.6, is about 0.49 for Cpk 1.33 from 5 units). It is still judged against the
 * threshold, so a limit whose few units fall short is flagged all the same, without the figure.
 */
function judgeCapability(options: {
  sample: SampleDescription;
  limit: SpecLimitInput;
  cpkThreshold: number;
  cpkMinUnits: number;
  /** Of the printed Cpk's confidence interval. */
  confidence: number;
  flags: StatisticsFlag[];
}): { cpk: FormattedValue; absentReason: string | null; interval?: { lower: FormattedValue; upper: FormattedValue } } {
  const { sample, limit, cpkThreshold, cpkMinUnits, confidence, flags } = options;
  const { n, s, meanValue } = sample;
  const absent = { cpk: emptyValue, absentReason: null };
  if (n === 0) {
    flags.push({ code: "limit-without-data", message: "A limit is stated but no approved measurement supports it." });
    return absent;
  }
  if (n < 2 || !(s > 0) || meanValue === null) {
    flags.push({
      code: "insufficient-data",
      message: n < 2 ? `Only ${n} unit measured: Cpk and a tolerance interval need at least 2.` : "All units read the same value: Cpk is undefined.",
    });
    return absent;
  }
  const threshold = formatNumber(cpkThreshold, { digits: { maxDecimals: 2 } });
  try {
    const capability = computeCapability({ mean: meanValue, standardDeviation: s, lowerSpecLimit: limit.min, upperSpecLimit: limit.max });
    if (n < cpkMinUnits) {
      if (capability.cpk < cpkThreshold) {
        flags.push({
          code: "cpk-below-threshold",
          message: `Cpk from these ${n} units falls below the threshold ${threshold} (too few units to state it): the data do not support this limit.`,
        });
      }
      return {
        cpk: emptyValue,
        absentReason: `Cpk is not stated: ${n} units were measured, fewer than the ${cpkMinUnits} the organization requires for a capability index to mean something.`,
      };
    }
    if (capability.cpk < cpkThreshold) {
      flags.push({
        code: "cpk-below-threshold",
        message: `Cpk ${formatNumber(capability.cpk, { digits: { maxDecimals: 2 } })} is below the threshold ${threshold}: the data do not support this limit.`,
      });
    }
    const interval = computeCpkConfidenceInterval({ cpk: capability.cpk, sampleSize: n, confidence });
    return { cpk: formatValue(capability.cpk, 2), absentReason: null, interval: { lower: formatValue(interval.lower, 2), upper: formatValue(interval.upper, 2) } };
  } catch (error) {
    flags.push({ code: "insufficient-data", message: error instanceof Error ? error.message : String(error) });
    return absent;
  }
}

interface UnitDecisions {
  decisionRule: GroupStatistics["decisionRule"];
  ruleStatement: string | null;
  acceptance: GroupStatistics["acceptance"];
  units: UnitResult[];
  passCount: number;
  failCount: number;
}

/**
 * Each unit judged against the limit under the stated decision rule: the acceptance zone is the
 * limit moved inwards by U when U is known (guarded acceptance), the limit itself otherwise.
 */
function decideUnits(options: {
  values: UnitValue[];
  limit: SpecLimitInput | undefined;
  expandedUncertainty: number | undefined;
  unit: string;
  statDecimals: number;
  flags: StatisticsFlag[];
}): UnitDecisions {
  const { values, limit, expandedUncertainty, unit, statDecimals, flags } = options;
  const known = expandedUncertainty !== undefined;
  const u = expandedUncertainty ?? 0;
  const result: UnitDecisions = { decisionRule: null, ruleStatement: null, acceptance: null, units: [], passCount: 0, failCount: 0 };
  if (limit) {
    result.decisionRule = known ? "guard-band" : "simple-acceptance";
    result.ruleStatement = known
      ? describeDecisionRule("guard-band", u, unit)
      : "Simple acceptance (ILAC-G8:09/2019 §4.2.1, guard band w = 0): no measurement uncertainty is stated for this " +
        "parameter, so a unit passes when its measured value lies within the specification limits.";
    const guardLower = limit.min === undefined ? null : limit.min + u;
    const guardUpper = limit.max === undefined ? null : limit.max - u;
    result.acceptance = { lower: formatValue(guardLower, statDecimals), upper: formatValue(guardUpper, statDecimals) };
    if (guardLower !== null && guardUpper !== null && guardLower > guardUpper) {
      flags.push({
        code: "guard-band-closes-acceptance",
        message: `Guard bands of U = ${formatQuantity(u, differenceUnit(unit))} leave no acceptance zone between the limits.`,
      });
    }
  }

  for (const v of values) {
    let decision: UnitResult["decision"] = null;
    let conditional = false;
    if (limit) {
      try {
        const judged = decideConformity({
          measuredValue: v.value,
          lowerLimit: limit.min,
          upperLimit: limit.max,
          expandedUncertainty: u,
          rule: known ? "guard-band" : "simple-acceptance",
          unit,
        });
        decision = judged.decision;
        conditional = judged.conditional;
      } catch {
        // The zone is closed (flagged above): no unit can be accepted.
        decision = "fail";
      }
      if (decision === "pass") result.passCount++;
      else result.failCount++;
    }
    result.units.push({ serial: v.serial, lot: v.lot, setId: v.setId, value: formatValue(v.value, statDecimals), decision, conditional });
  }
  if (result.failCount > 0) {
    const rule = result.decisionRule === "guard-band" ? "the guard-banded limit" : "the limit";
    flags.push({
      code: "unit-outside-acceptance",
      message: `${result.failCount} of ${values.length} units fall outside ${rule}: ${result.units
        .filter((unitResult) => unitResult.decision === "fail")
        .map((unitResult) => unitResult.serial)
        .join(", ")}.`,
    });
  }
  return result;
}
