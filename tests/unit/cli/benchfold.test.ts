import { spawn } from "node:child_process";
import { readdirSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

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
    expect(Object.keys(output)).toEqual(["kind", "parameters", "warnings"]);
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
    expect(run.stdout).toContain("Warnings:");
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
