import { readFileSync } from "node:fs";
import { CLI_USAGE, deriveParameters, formatParameterTable, parseCliArgs } from "../lib/analysis";
import { isIngestError, parseMeasurementFile } from "../lib/ingest";

/** Batch analysis of one measurement file, through the same parse → derive path as the app. */
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
  let parsed;
  try {
    parsed = parseMeasurementFile({ fileName: command.file, bytes, kind: command.kind });
  } catch (error) {
    if (isIngestError(error)) {
      process.stderr.write(`${error.message}\n`);
      return 2;
    }
    throw error;
  }
  const result = deriveParameters(parsed);

  if (command.json) {
    const { kind, parameters, warnings } = result;
    process.stdout.write(`${JSON.stringify({ kind, parameters, warnings }, null, 2)}\n`);
    return 0;
  }
  const lines = [`${command.file}: ${result.kind}, ${result.parameters.length} parameters`, "", formatParameterTable(result.parameters)];
  if (result.warnings.length > 0) lines.push("", "Warnings:", ...result.warnings.map((w) => `  - ${w}`));
  process.stdout.write(`${lines.join("\n")}\n`);
  return 0;
}

process.exitCode = main(process.argv.slice(2));
