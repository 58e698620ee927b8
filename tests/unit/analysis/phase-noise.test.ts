import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeExample, analyzeText, EXAMPLES, log10, pick, valueOf } from "./helpers";

/** The trace's rows, read straight from the CSV (no parser), for independent hand calculations. */
function readTrace(): { offsetHz: number[]; lDbcHz: number[] } {
  const rows = readFileSync(path.join(EXAMPLES, "phase-noise-doubler.csv"), "utf8")
    .split("\n")
    .filter((line) => /^[0-9]/.test(line))
    .map((line) => line.split(",").map(Number));
  return { offsetHz: rows.map((r) => r[0]), lDbcHz: rows.map((r) => r[1]) };
}

describe("phase noise of a doubler (phase-noise-doubler.csv)", () => {
  const result = analyzeExample("phase-noise-doubler.csv");
  const p = result.parameters;
  const trace = readTrace();

  it("reads spot L(f) at every decade inside the trace (IEEE Std 1139: L(f) in dBc/Hz)", () => {
    expect(p.filter((x) => x.name === "spot-phase-noise").map((x) => x.conditions.offsetHz)).toEqual([1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7]);
    expect(valueOf(p, "spot-phase-noise", { offsetHz: 1000 })).toBe(-141.88);
    expect(valueOf(p, "spot-phase-noise", { offsetHz: 1e5 })).toBe(-160.74);
  });

  it("integrates L(f) over 10 Hz … 1 MHz and gives φrms = √(2A) and σt = φrms/(2π f0)", () => {
    // Independent check: trapezoids on a fine logarithmic grid of the log-log interpolated trace (IEEE Std 1139-2008).
    const { offsetHz, lDbcHz } = trace;
    const levelAt = (f: number) => {
      let k = 1;
      while (offsetHz[k] < f) k++;
      const t = log10(f / offsetHz[k - 1]) / log10(offsetHz[k] / offsetHz[k - 1]);
      return lDbcHz[k - 1] + t * (lDbcHz[k] - lDbcHz[k - 1]);
    };
    const steps = 400_000;
    let area = 0;
    let previousF = 10;
    let previousL = 10 ** (levelAt(10) / 10);
    for (let i = 1; i <= steps; i++) {
      const f = 10 * 10 ** ((5 * i) / steps);
      const l = 10 ** (levelAt(Math.min(f, 1e6)) / 10);
      area += ((previousL + l) / 2) * (f - previousF);
      previousF = f;
      previousL = l;
    }
    const band = { startHz: 10, stopHz: 1e6 };
    expect(valueOf(p, "integrated-phase-noise", band)).toBeCloseTo(10 * log10(area), 2);
    const phaseRmsRad = Math.sqrt(2 * area);
    expect(valueOf(p, "rms-phase-error", band)).toBeCloseTo((phaseRmsRad * 180) / Math.PI, 6);
    expect(valueOf(p, "rms-jitter", band) / ((phaseRmsRad / (2 * Math.PI * 2e9)) * 1e15)).toBeCloseTo(1, 4);
    expect(pick(p, "rms-jitter").unit).toBe("fs");
  });

  it("compares the far-out floor with kT at 290 K, half of it PM", () => {
    // Last decade, 1 … 10 MHz: 11 points; the 6th of them sorted is −165.53 dBc/Hz.
    const last = trace.lDbcHz.filter((_, i) => trace.offsetHz[i] >= 1e6).sort((a, b) => a - b);
    expect(last).toHaveLength(11);
    expect(valueOf(p, "noise-floor")).toBe(last[5]);
    // kT = −173.975 dBm/Hz (k = 1.380649e-23 J/K exact, SI Brochure 9th ed. 2019; T0 = 290 K) [computed]; PM floor = kT − 3.01 dB − P_carrier (3.2 dBm).
    const ktDbmHz = 10 * log10(1.380649e-23 * 290 * 1000);
    expect(ktDbmHz).toBeCloseTo(-173.975, 3);
    expect(valueOf(p, "noise-floor-above-kt")).toBeCloseTo(-165.53 - (ktDbmHz - 10 * log10(2) - 3.2), 9);
  });

  it("finds the three discrete spurs, in dBc through the file's RBW column, and keeps them in a decimated curve", () => {
    // The plotted peaks −108.5, −121.3 and −142.7 dBc/Hz at RBW 1 Hz, 10 Hz, 1 kHz (the file's column), each
    // + 10·log10(RBW × 1.0645); the conversion itself is checked against outside sources in phase-noise-spurs.test.ts.
    expect(p.filter((x) => x.name === "discrete-spur").map((x) => [x.conditions.offsetHz, x.conditions.resolutionBandwidthHz, x.unit])).toEqual([
      [50, 1, "dBc"],
      [150, 10, "dBc"],
      [25000, 1000, "dBc"],
    ]);
    expect(p.some((x) => x.name === "spur")).toBe(false);
    const small = analyzeExample("phase-noise-doubler.csv", { maxCurvePoints: 20 });
    const points = small.curves[0].series[0].points;
    expect(points.length).toBeLessThanOrEqual(20);
    for (const spur of [50, 150, 25000]) expect(points.some(([x]) => x === spur)).toBe(true);
    expect(small.curves[0].x.scale).toBe("log");
  });

  it("reports only the ideal ×2 penalty without an input reference, and the excess with one", () => {
    // The example without its RBW and L_input columns: offset and L only.
    const twoColumns = readFileSync(path.join(EXAMPLES, "phase-noise-doubler.csv"), "utf8")
      .split("\n")
      .map((line) => (line.startsWith("#") ? line : line.split(",").slice(0, 2).join(",")))
      .join("\n");
    const withoutInput = analyzeText(twoColumns).parameters;
    // 20·log10(2) = 6.021 dB (ideal ×N adds 20·log10 N, IEEE Std 1139-2008) [computed].
    expect(valueOf(withoutInput, "ideal-multiplication-penalty")).toBeCloseTo(6.021, 3);
    expect(withoutInput.some((x) => x.name === "excess-over-ideal-multiplication")).toBe(false);
    const withReference = analyzeExample("phase-noise-doubler.csv", {
      phaseNoise: { inputReference: { offsetHz: [1, 1e7], lDbcHz: [-150, -150] } },
    });
    // L_out − (L_in + 20·log10 N) at 1 kHz: −141.88 − (−150) − 6.0206 = 2.0994 dB.
    expect(valueOf(withReference.parameters, "excess-over-ideal-multiplication", { offsetHz: 1000 })).toBeCloseTo(
      -141.88 + 150 - 20 * log10(2),
      9,
    );
  });

  it("integrates over a requested band", () => {
    const narrow = analyzeExample("phase-noise-doubler.csv", { phaseNoise: { integrationBand: { value: { startHz: 1e4, stopHz: 1e5 }, source: "cli" } } });
    expect(valueOf(narrow.parameters, "integrated-phase-noise", { startHz: 1e4, stopHz: 1e5 })).toBeLessThan(
      valueOf(p, "integrated-phase-noise"),
    );
  });
});
