import type { ParsedMeasurement } from "../ingest/types";
import { DEFAULT_MAX_CURVE_POINTS } from "./curves";
import { analyzeDriveSweep } from "./drive-sweep";
import { analyzeFrequencySweep } from "./frequency-sweep";
import { analyzePhaseNoise } from "./phase-noise";
import type { Section } from "./section";
import { analyzeTouchstone } from "./touchstone";
import { analyzeTwoTone } from "./two-tone";
import type { AnalysisResult, DeriveOptions } from "./types";

/**
 * Everything Benchfold derives from one parsed measurement file: named parameters
 * with their conditions, plot-ready curves, and the parser's warnings followed
 * by the analysis's own.
 */
export function deriveParameters(parsed: ParsedMeasurement, options: DeriveOptions = {}): AnalysisResult {
  const maxPoints = options.maxCurvePoints ?? DEFAULT_MAX_CURVE_POINTS;
  let section: Section;
  switch (parsed.kind) {
    case "drive-sweep":
      section = analyzeDriveSweep(parsed.data, options, maxPoints);
      break;
    case "frequency-sweep":
      section = analyzeFrequencySweep(parsed.data, maxPoints);
      break;
    case "two-tone":
      section = analyzeTwoTone(parsed.data, options, maxPoints);
      break;
    case "phase-noise":
      section = analyzePhaseNoise(parsed.data, options, maxPoints);
      break;
    case "touchstone":
      section = analyzeTouchstone(parsed.data, options, maxPoints);
      break;
  }
  return {
    kind: parsed.kind,
    parameters: section.parameters,
    warnings: parsed.warnings.concat(section.warnings),
    curves: section.curves,
  };
}
