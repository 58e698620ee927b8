import type { ParsedMeasurement } from "../ingest/types";
import { deriveParameters } from "./derive-parameters";
import { deriveOptionsFor, fileAnalysisSettings, resolveAnalysisSettings, type ResolvedAnalysisSettings, type SettingLayers } from "./settings";
import type { AnalysisResult, DeriveOptions } from "./types";

/**
 * Parse result → resolved settings → derived parameters, one path for the app and the CLI, so
 * both give the same numbers for the same settings. The settings used travel with the result.
 */
export function analyzeWithSettings(
  parsed: ParsedMeasurement,
  layers: Omit<SettingLayers, "file">,
  options: DeriveOptions = {},
): AnalysisResult & { settings: ResolvedAnalysisSettings } {
  const { settings, conflicts } = resolveAnalysisSettings({ file: fileAnalysisSettings(parsed), ...layers });
  const result = deriveParameters(parsed, deriveOptionsFor(settings, options));
  return { ...result, warnings: [...conflicts, ...result.warnings], settings };
}
