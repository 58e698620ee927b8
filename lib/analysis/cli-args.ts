import { deviceClasses, type DeviceClass } from "../domain/device-classes";
import { findNamedIntegrationBand, impedanceProblem, namedIntegrationBands, spurBandwidthProblem, type StatedAnalysisSettings } from "../domain/analysis-settings";
import { measurementKinds, type MeasurementKind } from "../domain/measurements";
import { parseDecimalText } from "../ingest/number";

export type CliCommand =
  | { command: "help" }
  | {
      command: "analyze";
      file: string;
      kind?: MeasurementKind;
      json: boolean;
      /** What the command line states (the third source, after the file and an upload). */
      settings?: StatedAnalysisSettings;
      /** Take the defaults of this class's template (the fourth source). */
      deviceClass?: DeviceClass;
    }
  | { command: "error"; message: string };

export const CLI_USAGE = `Usage: benchfold analyze <file> [--kind <kind>] [--json] [--integration <start>:<stop>]
                         [--compression-reference <dBm>] [--class <device class>] [--impedance <ohm>]
                         [--resolution-bandwidth <Hz> | --noise-bandwidth <Hz>]
       benchfold --help

Parses a bench measurement file and prints the parameters Benchfold derives from it.

  --kind <kind>      skip detection: ${measurementKinds.join(", ")}
  --json             print {"kind", "settings", "parameters", "warnings", "tables"} as JSON
                     (tables: every value per frequency or per step)
  --integration <b>  phase-noise integration band for rms phase and jitter, in Hz: 12e3:20e6,
                     or a name: ${namedIntegrationBands.map((b) => b.id).join(", ")}
  --compression-reference <dBm>
                     small-signal reference drive for P1dB (the axis input P1dB is reported on)
  --class <class>    use this device class's defaults and plausibility bounds: ${deviceClasses.join(", ")}
  --impedance <ohm>  impedance for dBm, Vrms and dBµV of power readings, 1 to 1000 (50 by default;
                     a Touchstone file keeps its own reference impedance)
  --resolution-bandwidth <Hz>, --noise-bandwidth <Hz>
                     the bandwidth the phase-noise trace was normalised with, for spurs in dBc: the
                     analyzer's 3 dB RBW (times 1.0645, a Gaussian filter's noise bandwidth) or its
                     noise bandwidth as it is; one of the two, 1e-3 to 1e7
  --help, -h         show this help

A setting in the file ("# integration_start:", "# integration_stop:", "# compression_reference:", "# impedance:",
"# resolution_bandwidth:" or "# noise_bandwidth:" and their columns)
wins over the command line, which wins over the class's default.

Exit codes: 0 done, 2 bad usage, a file that does not parse or a setting the data cannot honour, 1 anything else.`;

type Analyze = Extract<CliCommand, { command: "analyze" }>;

/** Reads the CLI's arguments (without node and the script path). Pure, so it can be tested alone. */
export function parseCliArgs(argv: readonly string[]): CliCommand {
  if (argv.length === 0) return { command: "error", message: "No command given" };
  if (argv.includes("--help") || argv.includes("-h")) return { command: "help" };
  const [command, ...rest] = argv;
  if (command === "help") return { command: "help" };
  if (command !== "analyze") return { command: "error", message: `Unknown command "${command}"` };

  let file: string | undefined;
  const out: Omit<Analyze, "command" | "file"> = { kind: undefined, json: false };
  const settings: StatedAnalysisSettings = {};
  for (let i = 0; i < rest.length; i++) {
    const arg = rest[i];
    const option = /^(--[a-z-]+)(?:=(.*))?$/.exec(arg);
    const valueOf = (): string | undefined => (option?.[2] !== undefined ? option[2] : rest[++i]);
    if (arg === "--json") {
      out.json = true;
    } else if (option && ["--kind", "--integration", "--compression-reference", "--class", "--impedance", "--resolution-bandwidth", "--noise-bandwidth"].includes(option[1])) {
      const name = option[1];
      const value = valueOf();
      if (value === undefined || value === "") return { command: "error", message: `${name} needs a value` };
      const problem = readOption(name, value, out, settings);
      if (problem) return { command: "error", message: problem };
    } else if (arg.startsWith("-") && arg !== "-" && !/^-\d/.test(arg)) {
      return { command: "error", message: `Unknown option "${arg}"` };
    } else if (file === undefined) {
      file = arg;
    } else {
      return { command: "error", message: `Only one file can be analyzed at a time; got "${file}" and "${arg}"` };
    }
  }
  if (file === undefined) return { command: "error", message: "analyze needs a file" };
  const result: Analyze = { command: "analyze", file, ...out };
  if (Object.keys(settings).length > 0) result.settings = settings;
  return result;
}

function readOption(name: string, value: string, out: Omit<Analyze, "command" | "file">, settings: StatedAnalysisSettings): string | undefined {
  switch (name) {
    case "--kind":
      if (!(measurementKinds as readonly string[]).includes(value)) return `Unknown kind "${value}"; expected one of ${measurementKinds.join(", ")}`;
      out.kind = value as MeasurementKind;
      return undefined;
    case "--class":
      if (!(deviceClasses as readonly string[]).includes(value)) return `Unknown device class "${value}"; expected one of ${deviceClasses.join(", ")}`;
      out.deviceClass = value as DeviceClass;
      return undefined;
    case "--impedance": {
      const ohm = parseDecimalText(value);
      if (ohm === undefined || impedanceProblem(ohm)) return `--impedance needs a resistance in ohms from 1 to 1000, e.g. 75; found "${value}"`;
      settings.impedanceOhm = ohm;
      return undefined;
    }
    case "--resolution-bandwidth":
    case "--noise-bandwidth": {
      const hz = parseDecimalText(value);
      if (hz === undefined || spurBandwidthProblem(hz)) return `${name} needs a bandwidth in Hz from 1e-3 to 1e7, e.g. 1000; found "${value}"`;
      if (settings.spurBandwidth) return "State --resolution-bandwidth or --noise-bandwidth, once";
      settings.spurBandwidth = { kind: name === "--noise-bandwidth" ? "noise" : "resolution", hz };
      return undefined;
    }
    case "--compression-reference": {
      const dbm = parseDecimalText(value);
      if (dbm === undefined || !Number.isFinite(dbm) || dbm < -200 || dbm > 60) return `--compression-reference needs a drive in dBm from -200 to 60, e.g. -20; found "${value}"`;
      settings.compressionReferenceDbm = dbm;
      return undefined;
    }
    default: {
      const named = findNamedIntegrationBand(value);
      if (named) {
        settings.integrationBandHz = { startHz: named.startHz, stopHz: named.stopHz };
        return undefined;
      }
      const ends = value.split(":");
      const [startHz, stopHz] = ends.map((end) => parseDecimalText(end.trim()));
      if (ends.length !== 2 || startHz === undefined || stopHz === undefined || !Number.isFinite(startHz) || !Number.isFinite(stopHz)) {
        return `--integration needs <start>:<stop> in Hz, e.g. 12e3:20e6, or one of ${namedIntegrationBands.map((b) => b.id).join(", ")}; found "${value}"`;
      }
      if (!(startHz > 0 && stopHz > startHz)) return `--integration needs 0 < start < stop; found "${value}"`;
      settings.integrationBandHz = { startHz, stopHz };
      return undefined;
    }
  }
}
