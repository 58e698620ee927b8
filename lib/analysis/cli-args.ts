import { measurementKinds, type MeasurementKind } from "../domain/measurements";

export type CliCommand =
  | { command: "help" }
  | { command: "analyze"; file: string; kind?: MeasurementKind; json: boolean }
  | { command: "error"; message: string };

export const CLI_USAGE = `Usage: benchfold analyze <file> [--kind <kind>] [--json]
       benchfold --help

Parses a bench measurement file and prints the parameters Benchfold derives from it.

  --kind <kind>  skip detection: ${measurementKinds.join(", ")}
  --json         print {"kind", "parameters", "warnings"} as JSON
  --help, -h     show this help

Exit codes: 0 done, 2 bad usage or a file that does not parse, 1 anything else.`;

/** Reads the CLI's arguments (without node and the script path). Pure, so it can be tested alone. */
export function parseCliArgs(argv: readonly string[]): CliCommand {
  if (argv.length === 0) return { command: "error", message: "No command given" };
  if (argv.includes("--help") || argv.includes("-h")) return { command: "help" };
  const [command, ...rest] = argv;
  if (command === "help") return { command: "help" };
  if (command !== "analyze") return { command: "error", message: `Unknown command "${command}"` };

  let file: string | undefined;
  let kind: MeasurementKind | undefined;
  let json = false;
  for (let i = 0; i < rest.length; i++) {
    const arg = rest[i];
    if (arg === "--json") {
      json = true;
    } else if (arg === "--kind" || arg.startsWith("--kind=")) {
      const value = arg === "--kind" ? rest[++i] : arg.slice("--kind=".length);
      if (value === undefined || value === "") return { command: "error", message: "--kind needs a value" };
      if (!(measurementKinds as readonly string[]).includes(value)) {
        return { command: "error", message: `Unknown kind "${value}"; expected one of ${measurementKinds.join(", ")}` };
      }
      kind = value as MeasurementKind;
    } else if (arg.startsWith("-") && arg !== "-") {
      return { command: "error", message: `Unknown option "${arg}"` };
    } else if (file === undefined) {
      file = arg;
    } else {
      return { command: "error", message: `Only one file can be analyzed at a time; got "${file}" and "${arg}"` };
    }
  }
  if (file === undefined) return { command: "error", message: "analyze needs a file" };
  return { command: "analyze", file, kind, json };
}
