import { spawn } from "node:child_process";
import { readdirSync } from "node:fs";
import path from "node:path";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { describe, expect, it } from "vitest";
import { analyzeWithSettings, tabulateValues } from "@/lib/analysis";
import { parseMeasurementFile } from "@/lib/ingest";
import { frequencyMultiplierTemplate } from "@/templates";

const ROOT = path.resolve(__dirname, "../../..");
const TSX = path.join(ROOT, "node_modules/tsx/dist/cli.mjs");

/** Runs the CLI as a user would; asynchronous so the cases below run side by side. */
function benchfold(...args: string[]): Promise<{ status: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [TSX, "scripts/benchfold.ts", ...args], { cwd: ROOT });
    let stdout = "";
    let stderr = "";
    child.stdout.setEncoding("utf8").on("data", (chunk: string) => (stdout += chunk));
    child.stderr.setEncoding("utf8").on("data", (chunk: string) => (stderr += chunk));
    child.on("error", reject);
    child.on("close", (status) => resolve({ status, stdout, stderr }));
  });
}

const EXAMPLES = readdirSync(path.join(ROOT, "fixtures/examples")).sort();

describe.concurrent("benchfold analyze on every example", () => {
  it.each(EXAMPLES)("%s --json", async (name) => {
    const run = await benchfold("analyze", `fixtures/examples/${name}`, "--json");
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    const output = JSON.parse(run.stdout);
    expect(Object.keys(output)).toEqual(["kind", "settings", "parameters", "warnings", "tables"]);
    expect(output.settings.integrationBand.source).toBe("engine");
    expect(["drive-sweep", "frequency-sweep", "two-tone", "phase-noise", "touchstone"]).toContain(output.kind);
    expect(output.parameters.length).toBeGreaterThan(0);
    for (const parameter of output.parameters) {
      expect(Object.keys(parameter)).toEqual(["name", "value", "unit", "conditions"]);
      expect(parameter.name).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
      expect(parameter.value === null || typeof parameter.value === "number").toBe(true);
      expect(typeof parameter.unit).toBe("string");
      expect(typeof parameter.conditions).toBe("object");
    }
    expect(output.warnings.every((w: unknown) => typeof w === "string")).toBe(true);
  }, 60_000);

  it("prints an aligned table with units and the warnings", async () => {
    const run = await benchfold("analyze", "fixtures/examples/drive-sweep-doubler.csv");
    expect(run.status).toBe(0);
    const lines = run.stdout.split("\n");
    const optimum = lines.find((l) => l.startsWith("optimum-drive"))!;
    expect(optimum).toMatch(/10\.490 dBm$/);
    const header = lines.find((l) => l.startsWith("parameter"))!;
    // Values end in the same column: the unit column starts right after the widest value.
    const valueEnds = lines.filter((l) => /^conversion-loss /.test(l)).map((l) => l.lastIndexOf(" dB"));
    expect(new Set(valueEnds).size).toBe(1);
    expect(header.indexOf("value") + "value".length).toBe(valueEnds[0]);
    // A doubler is not warned that it never compresses; a mixer's two-tone run that does not reach compression is.
    expect(run.stdout).not.toContain("Warnings:");
    const mixer = await benchfold("analyze", "fixtures/examples/two-tone-mixer.tsv");
    expect(mixer.stdout).toContain("Warnings:\n  - No 1 dB compression in this sweep");
  }, 60_000);

  it("honours --kind", async () => {
    const run = await benchfold("analyze", "fixtures/examples/two-tone-mixer.tsv", "--kind", "two-tone", "--json");
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout).kind).toBe("two-tone");
  }, 60_000);
});

describe.concurrent("benchfold analyze on bad input", () => {
  it.each([
    ["drive-text-in-number.csv", "line 10, column 3"],
    ["touchstone-text-in-data.s2p", "line 3, column 5"],
    ["phase-noise-non-monotonic.csv", "line 9"],
    ["freq-too-many-cells.csv", "line"],
  ])("%s exits 2 naming the file and the line", async (name, where) => {
    const run = await benchfold("analyze", `fixtures/malformed/${name}`, "--json");
    expect(run.status).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr).toContain(`fixtures/malformed/${name}`);
    expect(run.stderr).toContain(where);
  }, 60_000);

  it.each([[["analyse", "x.csv"]], [["analyze", "fixtures/examples/two-tone-mixer.tsv", "--bogus"]], [[]]])(
    "%j prints usage on stderr and exits 2",
    async (args) => {
      const run = await benchfold(...args);
      expect(run.status).toBe(2);
      expect(run.stderr).toContain("Usage: benchfold analyze");
    },
    60_000,
  );

  it("--help prints usage on stdout and exits 0", async () => {
    const run = await benchfold("--help");
    expect(run.status).toBe(0);
    expect(run.stdout).toContain("Usage: benchfold analyze");
  }, 60_000);

  it("a missing file exits 2", async () => {
    const run = await benchfold("analyze", "fixtures/examples/no-such-file.csv");
    expect(run.status).toBe(2);
    expect(run.stderr).toContain("no-such-file.csv");
  }, 60_000);
});

/** The same file and settings through the CLI (a child process) and through the engine in this process. */
function inProcess(file: string, layers: Parameters<typeof analyzeWithSettings>[1]) {
  const parsed = parseMeasurementFile({ fileName: file, bytes: readFileSync(path.join(ROOT, file)) });
  const result = analyzeWithSettings(parsed, layers);
  return JSON.parse(JSON.stringify({ kind: result.kind, settings: result.settings, parameters: result.parameters, warnings: result.warnings, tables: tabulateValues(parsed, { impedanceOhm: result.settings.impedance.value, impedanceSource: result.settings.impedance.source }) }));
}

describe.concurrent("the CLI and the engine give the same numbers for the same settings", () => {
  const phaseNoise = "fixtures/examples/phase-noise-doubler.csv";

  it("--integration 12e3:1e6", async () => {
    const run = await benchfold("analyze", phaseNoise, "--integration", "12e3:1e6", "--json");
    expect(run.stderr).toBe("");
    const cli = JSON.parse(run.stdout);
    expect(cli).toEqual(inProcess(phaseNoise, { cli: { integrationBandHz: { startHz: 12e3, stopHz: 1e6 } } }));
    const jitter = cli.parameters.find((p: { name: string }) => p.name === "rms-jitter");
    expect(jitter.conditions).toMatchObject({ startHz: 12e3, stopHz: 1e6, bandSource: "cli" });
    // Narrower than the default 10 Hz – 1 MHz, so less jitter (the default's 1.361 fs is in the table snapshot).
    expect(jitter.value).toBeLessThan(1.361);
  }, 60_000);

  it("--impedance 75: the tables' Vrms and dBµV of power readings into 75 Ω, the same as the engine's", async () => {
    const twoTone = "fixtures/examples/two-tone-mixer.tsv";
    const run = await benchfold("analyze", twoTone, "--impedance", "75", "--json");
    expect(run.stderr).toBe("");
    const cli = JSON.parse(run.stdout);
    expect(cli).toEqual(inProcess(twoTone, { cli: { impedanceOhm: 75 } }));
    expect(cli.settings.impedance).toEqual({ value: 75, source: "cli" });
    expect(cli.tables[0]).toMatchObject({ impedanceOhm: 75, impedanceSource: "cli" });
    // V = √(P·R) and dBµV = 20·log10(V / 1 µV): 0 dBm into 75 Ω is 0.273861 Vrms, 108.7506 dBµV (computed by hand, python3 math).
    const [, dbm, vrms, dbuv] = cli.tables[0].rows[0];
    expect(vrms).toBeCloseTo(0.27386127875 * 10 ** (dbm / 20), 12);
    expect(dbuv).toBeCloseTo(dbm + 108.750613, 5);
  }, 60_000);

  it("a named band, the class default, and the table output name the band and its source", async () => {
    const named = await benchfold("analyze", phaseNoise, "--integration=100-1m");
    expect(named.stdout).toContain("integration band 100 Hz - 1 MHz (set by the command line)");
    const byClass = await benchfold("analyze", phaseNoise, "--class", "frequency-multiplier", "--json");
    const cli = JSON.parse(byClass.stdout);
    expect(cli).toEqual(inProcess(phaseNoise, { template: frequencyMultiplierTemplate.analysisDefaults }));
    expect(cli.settings.integrationBand).toEqual({ value: { startHz: 10, stopHz: 1e6 }, source: "template" });
  }, 60_000);

  it("the file's own band wins over the command line, and the CLI says so", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "benchfold-cli-"));
    const file = path.join(dir, "band-in-file.csv");
    const text = readFileSync(path.join(ROOT, phaseNoise), "utf8").replace("# temperature: 25 C", "# temperature: 25 C\n# integration_start: 1 kHz\n# integration_stop: 100 kHz");
    writeFileSync(file, text);
    const run = await benchfold("analyze", file, "--integration", "12e3:1e6", "--json");
    expect(run.stderr).toBe("");
    const cli = JSON.parse(run.stdout);
    expect(cli.settings.integrationBand).toEqual({ value: { startHz: 1e3, stopHz: 1e5 }, source: "file" });
    // Messages print quantities as every page does: a no-break space between number and unit.
    expect(cli.warnings[0].replaceAll("\u00a0", " ")).toBe("Integration band: the file says 1 kHz – 100 kHz, the command line said 12 kHz – 1 MHz; the file's is used");
    const jitter = cli.parameters.find((p: { name: string }) => p.name === "rms-jitter");
    expect(jitter.conditions).toMatchObject({ startHz: 1e3, stopHz: 1e5, bandSource: "file" });
  }, 60_000);

  it("a band outside the trace exits 2 naming the band and the trace's span", async () => {
    const run = await benchfold("analyze", phaseNoise, "--integration", "12e3:20e6");
    expect(run.status).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr.replaceAll("\u00a0", " ")).toContain("The integration band 12 kHz – 20 MHz (set by the command line) reaches outside the trace, which spans 1 Hz – 10 MHz");
  }, 60_000);

  it("--compression-reference on a two-tone file", async () => {
    const file = "fixtures/examples/two-tone-mixer.tsv";
    const run = await benchfold("analyze", file, "--compression-reference", "-16", "--json");
    expect(run.stderr).toBe("");
    const cli = JSON.parse(run.stdout);
    expect(cli).toEqual(inProcess(file, { cli: { compressionReferenceDbm: -16 } }));
    const p1db = cli.parameters.find((p: { name: string }) => p.name === "input-p1db");
    expect(p1db.conditions).toMatchObject({ referenceDbm: -16, referenceSource: "cli" });
    const outside = await benchfold("analyze", file, "--compression-reference", "-40");
    expect(outside.status).toBe(2);
    expect(outside.stderr.replaceAll("\u00a0", " ")).toContain("The reference drive −40 dBm lies outside the sweep, which runs from −20 dBm to 0 dBm");
  }, 60_000);
});
