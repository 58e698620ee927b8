import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseTouchstone } from "@/lib/ingest";
import { writeTouchstone } from "@/lib/ingest/touchstone/write-touchstone";
import { medianNetwork, unwrapPhase } from "@/lib/rf/median-network";
import { perturbedNetwork } from "./perturbed-network";

const dir = mkdtempSync(path.join(tmpdir(), "benchfold-median-"));
const unitFile = (u: number) => perturbedNetwork(readFileSync("fixtures/examples/hybrid-4port.s4p", "utf8"), u);

describe("unwrapPhase", () => {
  it("removes jumps of more than π like numpy.unwrap", () => {
    // numpy.unwrap([3.0, -3.0, -2.9]) = [3.0, 3.2831853, 3.3831853] (2π − 3 = 3.2831853…; numpy docs' rule).
    expect(Array.from(unwrapPhase([3.0, -3.0, -2.9])).map((x) => x.toFixed(7))).toEqual(["3.0000000", "3.2831853", "3.3831853"]);
  });
});

describe("the median network", () => {
  it("written as Touchstone, is read back by the engine and by scikit-rf to the median numpy takes of the units", () => {
    const files = [0, 1, 2, 3].map((u) => {
      const file = path.join(dir, `unit-${u}.s4p`);
      writeFileSync(file, unitFile(u));
      return file;
    });
    const units = files.map((file) => parseTouchstone(path.basename(file), readFileSync(file, "utf8")).data);
    const median = medianNetwork(units);
    const text = writeTouchstone({ ...median, referenceOhm: 50 }, ["Median of 4 units"]);
    const merged = path.join(dir, "merged.s4p");
    writeFileSync(merged, text);

    // The engine reads its own file back: |S| of the median unit at the first frequency, S21.
    const back = parseTouchstone("merged.s4p", text).data;
    expect(back.portCount).toBe(4);
    expect(Array.from(back.frequencyHz)).toEqual(median.frequencyHz);
    const f = back.frequencyHz.length;
    const s21 = 20 * Math.log10(Math.hypot(back.sRe[(1 * 4 + 0) * f], back.sIm[(1 * 4 + 0) * f]));
    // Units 1 and 2 scale |S| by 1.03 and 1.06: the median is the mean of their dB figures.
    const base = 20 * Math.log10(Math.hypot(-0.698088, 0));
    expect(s21).toBeCloseTo(base + (20 * Math.log10(1.03) + 20 * Math.log10(1.06)) / 2, 9);

    // scikit-rf and numpy (Debian python3-scikit-rf): the same median from the unit files.
    // scikit-rf prints a note about matplotlib on stdout first: the answer is the last line.
    const out = execFileSync("/usr/bin/python3", ["scripts/reference/skrf-median-network.py", merged, ...files], { encoding: "utf8", stdio: ["ignore", "pipe", "ignore"] });
    const reference = JSON.parse(out.trim().split("\n").pop()!);
    expect(reference.ports).toBe(4);
    expect(reference.frequencyHz).toEqual(median.frequencyHz);
    expect(reference.maxDbDifference).toBeLessThan(1e-9);
    expect(reference.maxDegDifference).toBeLessThan(1e-7);
  });

  it("keeps to the span every unit covers and refuses networks of different port counts", () => {
    const a = { portCount: 1, frequencyHz: [1, 2, 3, 4], sRe: [1, 1, 1, 1], sIm: [0, 0, 0, 0] };
    const b = { portCount: 1, frequencyHz: [2.5, 4.5], sRe: [0.5, 0.5], sIm: [0, 0] };
    expect(medianNetwork([a, b]).frequencyHz).toEqual([3, 4]);
    expect(() => medianNetwork([a, { ...b, portCount: 2 }])).toThrow(/port counts/);
  });
});
