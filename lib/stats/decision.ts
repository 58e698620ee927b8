import { differenceUnit, formatQuantity } from "../format/quantity";
/**
 * Conformity decisions against specification limits, with the decision rule
 * stated beside each result as ISO/IEC 17025:2017 §7.8.6 requires. Rules follow
 * ILAC-G8:09/2019: §4.2.1 simple acceptance (guard band w = 0) and §4.2.2
 * guarded acceptance with w = U (acceptance limit = tolerance limit − U).
 */

export type DecisionRule = "simple-acceptance" | "guard-band";

export interface ConformityOptions {
  measuredValue: number;
  lowerLimit?: number;
  upperLimit?: number;
  /** Expanded uncertainty U (k = 2) of the measurement, in the measurand's unit. */
  expandedUncertainty: number;
  rule: DecisionRule;
  /** Unit written into the rule statement, e.g. "dB". */
  unit?: string;
}

export interface ConformityDecision {
  decision: "pass" | "fail";
  /**
   * Simple acceptance only: the value lies within U of a limit, so the decision
   * carries a real risk of being wrong (ILAC-G8 §4.2.1 "conditional"). Always false under guard band.
   */
  conditional: boolean;
  rule: DecisionRule;
  guardBand: number;
  acceptanceLowerLimit: number | null;
  acceptanceUpperLimit: number | null;
  /** The decision rule in words, to print with the result. */
  ruleStatement: string;
}

export function decideConformity(options: ConformityOptions): ConformityDecision {
  const { measuredValue, lowerLimit, upperLimit, expandedUncertainty: u, rule, unit = "" } = options;
  if (lowerLimit === undefined && upperLimit === undefined) {
    throw new RangeError("A conformity decision needs at least one limit");
  }
  if (!(u >= 0)) throw new RangeError(`Expanded uncertainty must be non-negative, got ${u}`);
  if (!Number.isFinite(measuredValue)) throw new RangeError(`Measured value must be finite, got ${measuredValue}`);
  const guardBand = rule === "guard-band" ? u : 0;
  const acceptanceLowerLimit = lowerLimit === undefined ? null : lowerLimit + guardBand;
  const acceptanceUpperLimit = upperLimit === undefined ? null : upperLimit - guardBand;
  if (acceptanceLowerLimit !== null && acceptanceUpperLimit !== null && acceptanceLowerLimit > acceptanceUpperLimit) {
    throw new RangeError(
      `Guard bands of U = ${formatQuantity(u, differenceUnit(unit), { digits: { maxSignificant: 6 } })} close the acceptance zone between ${lowerLimit} and ${upperLimit}`,
    );
  }
  const passes =
    (acceptanceLowerLimit === null || measuredValue >= acceptanceLowerLimit) &&
    (acceptanceUpperLimit === null || measuredValue <= acceptanceUpperLimit);
  const nearLimit =
    (lowerLimit !== undefined && Math.abs(measuredValue - lowerLimit) < u) ||
    (upperLimit !== undefined && Math.abs(measuredValue - upperLimit) < u);
  return {
    decision: passes ? "pass" : "fail",
    conditional: rule === "simple-acceptance" && nearLimit,
    rule,
    guardBand,
    acceptanceLowerLimit,
    acceptanceUpperLimit,
    ruleStatement: describeDecisionRule(rule, u, unit),
  };
}

/** The decision rule in words, for the sheet and for each per-unit result. */
export function describeDecisionRule(rule: DecisionRule, expandedUncertainty: number, unit = ""): string {
  // The uncertainty of a level in dBm, dBc or dBc/Hz is a ratio, in dB.
  const uText = `U = ${formatQuantity(expandedUncertainty, differenceUnit(unit), { digits: { maxSignificant: 3 } })} (k = 2)`;
  if (rule === "simple-acceptance") {
    return (
      `Simple acceptance (ILAC-G8:09/2019 §4.2.1, guard band w = 0): a unit passes when its measured value lies ` +
      `within the specification limits; ${uText} is reported but not subtracted, and results within U of a limit ` +
      `are marked conditional.`
    );
  }
  return (
    `Guarded acceptance (ILAC-G8:09/2019 §4.2.2, guard band w = U): a unit passes when its measured value lies ` +
    `within the specification limits tightened by ${uText}; otherwise it fails.`
  );
}

