import { findCompressionPoint, type CompressionPoint } from "../rf";
import { AnalysisSettingError } from "./settings";
import { errorMessage, makeParameter, roundCondition } from "./curves";
import type { DeriveOptions, DerivedParameter } from "./types";

/**
 * Input and output P1dB of a sweep, with how the small-signal gain was taken in the figures'
 * conditions: `referenceDbm` (the input of the reference: the stated drive, or the last agreeing
 * leading step), and `referencePoints` (how many leading steps were averaged) or `referenceSource`
 * (who stated the drive). A sweep that does not start in its linear region gets a warning. A stated
 * reference drive outside the sweep is refused (AnalysisSettingError), never moved.
 */
export function addCompressionPoint(input: {
  inputPowerDbm: ArrayLike<number>;
  gainDb: ArrayLike<number>;
  base: Record<string, string | number>;
  options: DeriveOptions;
  parameters: DerivedParameter[];
  warnings: string[];
  /**
   * False where compression cannot be asked of the sweep: a passive multiplier's conversion gain rises
   * with drive below its optimum (square law for a doubler), so it has no linear region to start in,
   * and a sweep that stops before its gain falls 1 dB below the first steps' is what it was meant to
   * be. Neither warning is raised then; a point the sweep does reach is still reported.
   */
  compressionExpected?: boolean;
}): CompressionPoint | undefined {
  const { base, options, parameters, warnings } = input;
  const stated = options.compression?.referenceInputPowerDbm;
  const linearToleranceDb = options.compression?.linearToleranceDb;
  if (!stated && input.inputPowerDbm.length < 3) {
    warnings.push(`Compression point not computed: the sweep has only ${input.inputPowerDbm.length} steps`);
    return undefined;
  }
  let compression: CompressionPoint;
  try {
    compression = findCompressionPoint({
      inputPowerDbm: input.inputPowerDbm,
      gainDb: input.gainDb,
      linearToleranceDb,
      referenceInputPowerDbm: stated?.value,
      describeNonLinearStart: input.compressionExpected !== false,
    });
  } catch (error) {
    if (stated) throw new AnalysisSettingError("compressionReferenceDbm", errorMessage(error));
    warnings.push(`Compression point not computed: ${errorMessage(error)}`);
    return undefined;
  }
  const conditions = Object.assign({}, base, compressionConditions(compression, stated?.source));
  if (compression.nonLinearStart && input.compressionExpected !== false) warnings.push(compression.nonLinearStart);
  if (compression.reached) {
    parameters.push(makeParameter("input-p1db", compression.inputCompressionPointDbm, conditions));
    parameters.push(makeParameter("output-p1db", compression.outputCompressionPointDbm, conditions));
  } else {
    parameters.push(makeParameter("input-p1db", null, conditions));
    parameters.push(makeParameter("output-p1db", null, conditions));
    if (input.compressionExpected !== false) warnings.push(`No 1 dB compression in this sweep: ${compression.reason}`);
  }
  return compression;
}

/** The reference's part of a P1dB figure's conditions. */
export function compressionConditions(compression: CompressionPoint, source?: string): Record<string, string | number> {
  return compression.method === "stated-drive"
    ? { referenceDbm: roundCondition(compression.referenceInputPowerDbm), referenceSource: source ?? "stated" }
    : { referenceDbm: roundCondition(compression.referenceInputPowerDbm), referencePoints: compression.pointCount };
}
