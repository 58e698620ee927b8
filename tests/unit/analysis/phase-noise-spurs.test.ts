import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeWithSettings } from "@/lib/analysis/analyze-with-settings";
import { parseMeasurementFile } from "@/lib/ingest";
import type { PhaseNoiseTrace } from "@/lib/ingest/types";
import { GAUSSIAN_NOISE_BANDWIDTH_PER_RBW, noiseBandwidthHz, spurPowerDbc } from "@/lib/rf";
import { analyzeText, EXAMPLES, log10, pick, valueOf } from "./helpers";

/**
 * Discrete spurs in dBc from the bandwidth the analyzer normalised the trace with, and the excess of a
 * ×N multiplier over the ideal 20·log10 N from the input's own trace (the file's L_input column).
 */

/** A flat −150 dBc/Hz trace, 10 Hz – 1 MHz, 10 points a decade, with one spur of −120 dBc/Hz at 1 kHz. */
function flatTrace(extraLines: string[] = [], extraColumn?: { header: string; value: (offsetHz: number) => string }): string {
  const lines = ["# kind: phase-noise", "# serial: BFD-0900", "# carrier_frequency: 2 GHz", ...extraLines, `offset [Hz],L [dBc/Hz]${extraColumn ? `,${extraColumn.header}` : ""}`];
  for (let d = 10; d <= 60; d++) {
    const f = Number((10 ** (d / 10)).toPrecision(4));
    lines.push(`${f},${f === 1000 ? -120 : -150}${extraColumn ? `,${extraColumn.value(f)}` : ""}`);
  }
  return lines.join("\n") + "\n";
}

const parseText = (text: string) => parseMeasurementFile({ fileName: "trace.csv", bytes: new Uint8Array(Buffer.from(text, "utf8")) });

describe("the conversion of a plotted spur to dBc (lib/rf/spurs.ts)", () => {
  it("adds 10·log10 of the noise bandwidth: the worked example of a noise level moved between bandwidths", () => {
    // Worked example (designers-guide.org forum, "phase noise unit dBc/Hz", 2015): a power of −80 dBm read in a
    // 1 kHz bandwidth is −110 dBm/Hz normalised to 1 Hz (subtract 30 dB). Read backwards for a discrete tone, which
    // the filter passes whole: a spur plotted at −110 dBc/Hz through a 1 kHz noise bandwidth is −80 dBc.
    expect(spurPowerDbc(-110, 1000)).toBeCloseTo(-80, 12);
    // A 1 Hz noise bandwidth leaves the reading as it is; 10 Hz adds 10 dB (10·log10(BW₂/BW₁), Keysight AN 150 ch. 5).
    expect(spurPowerDbc(-97.5, 1)).toBe(-97.5);
    expect(spurPowerDbc(-97.5, 10)).toBeCloseTo(-87.5, 12);
    expect(() => spurPowerDbc(-100, 0)).toThrow(RangeError);
  });

  it("turns a 3 dB RBW into the noise bandwidth of a Gaussian filter, checked by numerical integration in NumPy", () => {
    // Independent: integrate |H(f)|² = exp(−a f²) with a 3 dB bandwidth of 1 (a·0.5² = ln 2) with numpy.trapz
    // (Debian python3-numpy) over ±20; ENBW = ∫|H|² df / |H(0)|².
    const script = "import numpy as np; f = np.linspace(-20, 20, 400001); a = np.log(2) / 0.25; print(repr(float(np.trapz(np.exp(-a * f * f), f))))";
    const numpyEnbw = Number(execFileSync("/usr/bin/python3", ["-c", script], { encoding: "utf8" }).trim());
    expect(GAUSSIAN_NOISE_BANDWIDTH_PER_RBW).toBeCloseTo(numpyEnbw, 9);
    expect(GAUSSIAN_NOISE_BANDWIDTH_PER_RBW).toBeCloseTo(1.0645, 4);
    // Keysight AN 150 ch. 5: near-Gaussian analyzer filters have a noise bandwidth 1.05 to 1.13 times the 3 dB bandwidth.
    expect(GAUSSIAN_NOISE_BANDWIDTH_PER_RBW).toBeGreaterThanOrEqual(1.05);
    expect(GAUSSIAN_NOISE_BANDWIDTH_PER_RBW).toBeLessThanOrEqual(1.13);
    expect(noiseBandwidthHz({ kind: "resolution", hz: 1000 })).toBeCloseTo(1000 * numpyEnbw, 6);
    expect(noiseBandwidthHz({ kind: "noise", hz: 1000 })).toBe(1000);
  });
});

describe("the phase-noise file's bandwidth and input trace (lib/ingest/phase-noise.ts)", () => {
  it("reads a noise-bandwidth line, a resolution-bandwidth line, a per-offset column and an L_input column", () => {
    const noise = parseText(flatTrace(["# noise_bandwidth: 1 kHz"])).data as PhaseNoiseTrace;
    expect(noise.spurBandwidth).toEqual({ kind: "noise", hz: 1000 });
    expect(noise.spurBandwidthColumn).toBeUndefined();
    const resolution = parseText(flatTrace(["# resolution_bandwidth: 0.3 Hz"])).data as PhaseNoiseTrace;
    expect(resolution.spurBandwidth).toEqual({ kind: "resolution", hz: 0.3 });

    const example = parseMeasurementFile({ fileName: "phase-noise-doubler.csv", bytes: new Uint8Array(readFileSync(path.join(EXAMPLES, "phase-noise-doubler.csv"))) });
    const trace = example.data as PhaseNoiseTrace;
    expect(example.warnings).toEqual([]);
    expect(trace.spurBandwidth).toBeUndefined();
    expect(trace.spurBandwidthColumn?.kind).toBe("resolution");
    expect(trace.spurBandwidthColumn?.hz[trace.offsetHz.indexOf(50)]).toBe(1);
    expect(trace.spurBandwidthColumn?.hz[trace.offsetHz.indexOf(25000)]).toBe(1000);
    expect(trace.inputLDbcHz).toHaveLength(trace.offsetHz.length);
    expect(trace.inputLDbcHz?.[0]).toBe(-119.46);
  });

  it.each([
    [["# noise_bandwidth: 1 kHz", "# resolution_bandwidth: 1 kHz"], undefined, "bad-metadata", 5, undefined, "resolution_bandwidth"],
    [["# resolution_bandwidth: 20 MHz"], undefined, "out-of-range", 4, undefined, "resolution_bandwidth"],
    [["# noise_bandwidth: 1"], undefined, "bad-metadata", 4, undefined, "noise_bandwidth"],
    [[], { header: "noise_bandwidth", value: () => "1" }, "missing-unit", 4, 3, "noise_bandwidth"],
    [[], { header: "resolution_bandwidth [Hz]", value: (f: number) => (f === 100 ? "0" : "1") }, "out-of-range", 15, 3, "resolution_bandwidth [Hz]"],
  ])("refuses %j %j as %s at line %s, column %s, naming %s", (lines, column, code, line, columnNo, field) => {
    let caught: unknown;
    try {
      parseText(flatTrace(lines, column));
    } catch (error) {
      caught = error;
    }
    expect(caught).toMatchObject({ code, line, field, ...(columnNo ? { column: columnNo } : {}) });
    expect(String((caught as Error).message)).toMatch(/^trace\.csv line \d+/);
  });
});

describe("spurs through the engine", () => {
  it("with a stated noise bandwidth: the spur in dBc with its offset and bandwidth, and the worst over the offsets searched", () => {
    const result = analyzeWithSettings(parseText(flatTrace(["# noise_bandwidth: 10 Hz"])), {});
    const spur = pick(result.parameters, "discrete-spur");
    // −120 dBc/Hz plotted through a 10 Hz noise bandwidth: −120 + 10·log10(10) = −110 dBc.
    expect(spur.value).toBeCloseTo(-110, 9);
    expect(spur.unit).toBe("dBc");
    expect(spur.conditions).toEqual({ carrierFrequencyHz: 2e9, offsetHz: 1000, noiseBandwidthHz: 10, bandwidthSource: "file" });
    expect(valueOf(result.parameters, "worst-discrete-spur", { startHz: 10, stopHz: 1e6 })).toBeCloseTo(-110, 9);
    expect(result.parameters.some((p) => p.name === "spur")).toBe(false);
    expect(result.warnings.join("\n")).not.toContain("bandwidth");
  });

  it("without one: the spur as plotted in dBc/Hz, a warning, and no figure in dBc", () => {
    const result = analyzeWithSettings(parseText(flatTrace()), {});
    const spur = pick(result.parameters, "spur");
    expect(spur).toMatchObject({ value: -120, unit: "dBc/Hz", conditions: { offsetHz: 1000 } });
    expect(result.parameters.some((p) => p.name === "discrete-spur" || p.name === "worst-discrete-spur")).toBe(false);
    expect(result.warnings.join("\n").replaceAll("\u00a0", " ")).toContain("No noise or resolution bandwidth stated: the spur at 1 kHz is given as plotted, in dBc/Hz, not in dBc");
  });

  it("the upload's resolution bandwidth when the file states none; the file's line wins over it, and the conflict is said", () => {
    const upload = { spurBandwidth: { kind: "resolution" as const, hz: 100 } };
    const fromUpload = analyzeWithSettings(parseText(flatTrace()), { upload });
    const spur = pick(fromUpload.parameters, "discrete-spur");
    // −120 + 10·log10(100 × 1.0645) = −99.7288 dBc (Gaussian factor checked above).
    expect(spur.value).toBeCloseTo(-120 + 10 * log10(100 * GAUSSIAN_NOISE_BANDWIDTH_PER_RBW), 9);
    expect(spur.conditions).toMatchObject({ resolutionBandwidthHz: 100, bandwidthSource: "upload" });
    expect(fromUpload.settings.spurBandwidth).toEqual({ value: upload.spurBandwidth, source: "upload" });

    const fromFile = analyzeWithSettings(parseText(flatTrace(["# noise_bandwidth: 1 Hz"])), { upload });
    expect(valueOf(fromFile.parameters, "discrete-spur")).toBeCloseTo(-120, 9);
    expect(fromFile.warnings.map((w) => w.replaceAll("\u00a0", " "))).toContain(
      "Analyzer bandwidth: the file says noise bandwidth 1 Hz, the upload said resolution bandwidth 100 Hz; the file's is used",
    );
  });

  it("a per-offset column wins over the upload's bandwidth: each spur takes the bandwidth at its own offset", () => {
    const column = { header: "noise_bandwidth [kHz]", value: (f: number) => (f < 1000 ? "0.001" : "0.1") };
    const result = analyzeWithSettings(parseText(flatTrace([], column)), { upload: { spurBandwidth: { kind: "noise", hz: 1 } } });
    // The spur sits at 1 kHz, where the column says 0.1 kHz = 100 Hz: −120 + 20 = −100 dBc.
    expect(pick(result.parameters, "discrete-spur")).toMatchObject({ conditions: { noiseBandwidthHz: 100, bandwidthSource: "file" } });
    expect(valueOf(result.parameters, "discrete-spur")).toBeCloseTo(-100, 9);
    expect(result.warnings.map((w) => w.replaceAll("\u00a0", " "))).toContain(
      "Analyzer bandwidth: the file's noise_bandwidth column is used at each offset; the upload's noise bandwidth 1 Hz is not",
    );
  });
});

describe("excess over ideal ×N from the file's L_input column", () => {
  /** Offsets off the decades, so every decade spot is an interpolation of both traces. */
  const offsets = [3, 7, 40, 300, 2500, 20000, 150000, 900000];
  const outputL = [-118.2, -124.9, -133.4, -142.6, -151.1, -158.3, -163.9, -165.2];
  const inputL = [-128.9, -135.1, -144.0, -153.2, -161.4, -169.0, -175.3, -178.8];
  const file = (factor: number) =>
    [
      "# kind: phase-noise",
      "# serial: BFD-0901",
      "# carrier_frequency: 3 GHz",
      `# multiplication_factor: ${factor}`,
      "offset [Hz];L [dBc/Hz];L_input [dBc/Hz]",
      ...offsets.map((f, i) => `${f};${String(outputL[i]).replace(".", ",")};${String(inputL[i]).replace(".", ",")}`),
    ].join("\n");

  it("matches an independent computation: numpy.interp of both traces in log10 offset", () => {
    const result = analyzeText(file(3));
    // Independent: NumPy (Debian python3-numpy) interpolates L linearly in log10(offset), the log-log
    // interpolation of IEEE Std 1139-2008 traces, at each decade inside the trace, and subtracts 20·log10(3).
    const script = [
      "import json, sys, numpy as np",
      "d = json.load(sys.stdin)",
      "x = np.log10(d['offsets'])",
      "spots = [10.0, 100.0, 1e3, 1e4, 1e5]",
      "print(json.dumps([[f, float(np.interp(np.log10(f), x, d['out']) - np.interp(np.log10(f), x, d['inp']) - 20 * np.log10(3))] for f in spots]))",
    ].join("\n");
    const expected = JSON.parse(
      execFileSync("/usr/bin/python3", ["-c", script], { input: JSON.stringify({ offsets, out: outputL, inp: inputL }), encoding: "utf8" }),
    ) as [number, number][];
    const excess = result.parameters.filter((p) => p.name === "excess-over-ideal-multiplication");
    expect(excess.map((p) => p.conditions.offsetHz)).toEqual(expected.map(([f]) => f));
    for (const [offsetHz, value] of expected) {
      expect(valueOf(result.parameters, "excess-over-ideal-multiplication", { offsetHz, multiplicationFactor: 3 })).toBeCloseTo(value, 9);
    }
    // By hand at 10 Hz: between 7 Hz and 40 Hz, t = log10(10/7)/log10(40/7) = 0.20463; L_out = −124.9 − 0.20463·8.5 = −126.639,
    // L_in = −135.1 − 0.20463·8.9 = −136.921; excess = 10.282 − 9.542 = 0.739 dB (invented numbers, a test only).
    expect(valueOf(result.parameters, "excess-over-ideal-multiplication", { offsetHz: 10 })).toBeCloseTo(0.739, 3);
    expect(result.warnings.join("\n")).not.toContain("No input reference trace");
  });

  it("an input reference given to the engine wins over the column", () => {
    const result = analyzeText(file(2), { phaseNoise: { inputReference: { offsetHz: [1, 1e7], lDbcHz: [-180, -180] } } });
    // At 1 kHz: L_out between 300 Hz and 2.5 kHz, against a flat −180 dBc/Hz input.
    const t = log10(1000 / 300) / log10(2500 / 300);
    expect(valueOf(result.parameters, "excess-over-ideal-multiplication", { offsetHz: 1000 })).toBeCloseTo(-142.6 + t * (-151.1 + 142.6) + 180 - 20 * log10(2), 9);
  });
});
