import { readFileSync } from "node:fs";
import { analyzeWithSettings, CLI_USAGE, describeBand, formatParameterTable, isAnalysisSettingError, parseCliArgs, tabulateValues } from "../lib/analysis";
import { settingSourceWords } from "../lib/domain/analysis-settings";
import { isIngestError, parseMeasurementFile } from "../lib/ingest";
import { findSheetTemplate, ingestOptionsFor } from "../templates";

/** Batch analysis of one measurement file, through the same parse → settings → derive path as the app. */
function main(argv: string[]): number {
  const command = parseCliArgs(argv);
  if (command.command === "help") {
    process.stdout.write(`${CLI_USAGE}\n`);
    return 0;
  }
  if (command.command === "error") {
    process.stderr.write(`benchfold: ${command.message}\n\n${CLI_USAGE}\n`);
    return 2;
  }

  let bytes: Uint8Array;
  try {
    bytes = readFileSync(command.file);
  } catch (error) {
    process.stderr.write(`benchfold: cannot read ${command.file}: ${(error as NodeJS.ErrnoException).code ?? String(error)}\n`);
    return 2;
  }
  let result;
  let parsed;
  try {
    const sheetTemplate = command.deviceClass ? findSheetTemplate(command.deviceClass) : undefined;
    parsed = parseMeasurementFile({ fileName: command.file, bytes, kind: command.kind, ...ingestOptionsFor(sheetTemplate) });
    result = analyzeWithSettings(parsed, { cli: command.settings, template: sheetTemplate?.analysisDefaults });
  } catch (error) {
    if (isIngestError(error)) {
      process.stderr.write(`${error.message}\n`);
      return 2;
    }
    if (isAnalysisSettingError(error)) {
      process.stderr.write(`benchfold: ${command.file}: ${error.message}\n`);
      return 2;
    }
    throw error;
  }

  if (command.json) {
    const { kind, settings, parameters, warnings } = result;
    const tables = tabulateValues(parsed, { impedanceOhm: settings.impedance.value, impedanceSource: settings.impedance.source });
    process.stdout.write(`${JSON.stringify({ kind, settings, parameters, warnings, tables }, null, 2)}\n`);
    return 0;
  }
  const lines = [`${command.file}: ${result.kind}, ${result.parameters.length} parameters`];
  if (result.kind === "phase-noise") {
    const band = result.settings.integrationBand;
    lines.push(`integration band ${describeBand(band.value, { plain: true })} (set by ${settingSourceWords[band.source]})`);
  }
  lines.push("", formatParameterTable(result.parameters));
  if (result.warnings.length > 0) lines.push("", "Warnings:", ...result.warnings.map((w) => `  - ${w}`));
  process.stdout.write(`${lines.join("\n")}\n`);
  return 0;
}

process.exitCode = main(process.argv.slice(2));
