import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { IngestError, parseTouchstone, sParameter, type TouchstoneData } from "@/lib/ingest";
import { fixtureBytes } from "./fixture-files";

const rad = (deg: number) => (deg * Math.PI) / 180;

function s(d: TouchstoneData, i: number, j: number, k = 0): [number, number] {
  const v = sParameter(d, i, j);
  return [v.re[k], v.im[k]];
}

function expectPolar(d: TouchstoneData, i: number, j: number, mag: number, deg: number, k = 0) {
  const [re, im] = s(d, i, j, k);
  expect(re).toBeCloseTo(mag * Math.cos(rad(deg)), 12);
  expect(im).toBeCloseTo(mag * Math.sin(rad(deg)), 12);
}

// Layout tests use marker values (S21 = 121) and the specification's amplifier example: not a passive part.
const ACTIVE = { passive: false };

describe("Touchstone specification examples", () => {
  it("v1 1-port: '# MHz S MA R 50' and '2.000 0.894 -12.136' is 2 MHz, S11 = 0.894∠−12.136°", () => {
    // IBIS Open Forum, Touchstone File Format Specification Rev 1.1, Example 1
    // ("1-port S-parameter file, single frequency point").
    const text = "!1-port S-parameter file, single frequency point\n# MHz S MA R 50\n!freq magS11 angS11\n2.000 0.894 -12.136\n";
    const { data } = parseTouchstone("example1.s1p", text);
    expect(Array.from(data.frequencyHz)).toEqual([2e6]);
    expect(data.referenceOhm).toEqual([50]);
    expectPolar(data, 1, 1, 0.894, -12.136);
    // Same value as printed by an independent reader (JosephsonCircuits.jl docs): 0.874020294860635 − 0.18794819544685323i
    expect(s(data, 1, 1)[0]).toBeCloseTo(0.874020294860635, 14);
    expect(s(data, 1, 1)[1]).toBeCloseTo(-0.18794819544685323, 14);
  });

  it("v2 '[Two-Port Data Order] 21_12' with '1 111 0 121 0 112 0 122 0' gives S11 111, S21 121, S12 112, S22 122", () => {
    // IBIS Open Forum, Touchstone File Format Specification Version 2.0, [Two-Port Data Order]:
    // 21_12 means the data order N11 N21 N12 N22.
    const text = [
      "[Version] 2.0",
      "# GHz S RI R 50",
      "[Number of Ports] 2",
      "[Two-Port Data Order] 21_12",
      "[Number of Frequencies] 1",
      "[Network Data]",
      "1 111 0 121 0 112 0 122 0",
      "[End]",
    ].join("\n");
    const { data } = parseTouchstone("order-21-12.ts", text, ACTIVE);
    expect(s(data, 1, 1)).toEqual([111, 0]);
    expect(s(data, 2, 1)).toEqual([121, 0]);
    expect(s(data, 1, 2)).toEqual([112, 0]);
    expect(s(data, 2, 2)).toEqual([122, 0]);
    const swapped = parseTouchstone("order-12-21.ts", text.replace("21_12", "12_21"), ACTIVE).data;
    expect(s(swapped, 1, 2)).toEqual([121, 0]);
    expect(s(swapped, 2, 1)).toEqual([112, 0]);
  });

  it("v1 2-port order is N11 N21 N12 N22, and noise parameters after the S data are skipped", () => {
    // IBIS Open Forum, Touchstone File Format Specification Rev 1.1, Example 8
    // ("2-port network, S-parameter and noise data"): noise data starts where the frequency drops.
    const text = [
      "!2-port network, S-parameter and noise data",
      "# GHZ S MA R 50",
      "2 .95 -26 3.57 157 .04 76 .66 -14",
      "22 .60 -144 1.30 40 .14 40 .56 -85",
      "! NOISE PARAMETERS",
      "4 .7 .64 69 .38",
      "18 2.7 .46 -33 .40",
    ].join("\n");
    const { data, warnings } = parseTouchstone("example8.s2p", text, ACTIVE);
    expect(Array.from(data.frequencyHz)).toEqual([2e9, 22e9]);
    expectPolar(data, 1, 1, 0.95, -26);
    expectPolar(data, 2, 1, 3.57, 157);
    expectPolar(data, 1, 2, 0.04, 76);
    expectPolar(data, 2, 2, 0.66, -14);
    expectPolar(data, 2, 1, 1.3, 40, 1);
    expect(warnings.join(" ")).toContain("noise parameters from line 6");
  });
});

describe("Touchstone options and keywords", () => {
  it("defaults to GHz S MA R 50 for an empty option line; keywords and units are case-insensitive", () => {
    // Touchstone 1.1, option line: "# <frequency unit> <parameter> <format> R <n>", defaults GHz S MA R 50.
    const { data } = parseTouchstone("defaults.S1P", "#\n1 0.5 90\n");
    expect(data.frequencyHz[0]).toBe(1e9);
    expect(data.referenceOhm).toEqual([50]);
    expect(s(data, 1, 1)[1]).toBeCloseTo(0.5, 15);
    const lower = parseTouchstone("lower.s1p", "# khz s ri r 75\n1 0.1 0.2\n").data;
    expect(lower.frequencyHz[0]).toBe(1e3);
    expect(lower.referenceOhm).toEqual([75]);
    expect(s(lower, 1, 1)).toEqual([0.1, 0.2]);
  });

  it("only the first option line counts; comments are allowed anywhere; CRLF is fine", () => {
    const text = "! header\r\n# Hz S DB R 50 ! dB and angle\r\n100 -20 0 ! S11 = 0.1\r\n# GHz S RI R 75\r\n200 -6.0205999132796239 180\r\n";
    const { data, warnings } = parseTouchstone("two-options.s1p", text);
    expect(Array.from(data.frequencyHz)).toEqual([100, 200]);
    expect(data.referenceOhm).toEqual([50]);
    expect(s(data, 1, 1, 0)[0]).toBeCloseTo(0.1, 15);
    expect(s(data, 1, 1, 1)[0]).toBeCloseTo(-0.5, 12);
    expect(warnings.join(" ")).toContain("only the first option line counts");
  });

  it("reads v1 3- and 4-port rows with each matrix row on its own line, row by row", () => {
    const text = ["# GHz S RI R 50", "1 11 0 12 0 13 0", "21 0 22 0 23 0", "31 0 32 0 33 0"].join("\n");
    const { data } = parseTouchstone("rows.s3p", text, ACTIVE);
    for (let i = 1; i <= 3; i++) for (let j = 1; j <= 3; j++) expect(s(data, i, j)).toEqual([10 * i + j, 0]);
  });

  it("wraps v1 rows at 4 pairs per line for more than 4 ports", () => {
    // Touchstone 1.1: no more than four pairs of network data per line.
    const n = 5;
    const lines = ["# Hz S RI R 50"];
    for (let i = 1; i <= n; i++) {
      const row = Array.from({ length: n }, (_, j) => `${10 * i + j + 1} 0`);
      lines.push((i === 1 ? "7 " : "") + row.slice(0, 4).join(" "), row.slice(4).join(" "));
    }
    const { data } = parseTouchstone("five.s5p", lines.join("\n"), ACTIVE);
    expect(s(data, 5, 5)).toEqual([55, 0]);
    expect(s(data, 3, 5)).toEqual([35, 0]);
  });

  it("v2: [Reference] over several lines, [Matrix Format] Lower, information block, [Noise Data] skipped", () => {
    const text = [
      "[Version] 2.0",
      "# MHz S RI R 50",
      "[Number of Ports] 3",
      "[Number of Frequencies] 2",
      "[Reference] 50 75",
      "100",
      "[Matrix Format] Lower",
      "[Begin Information]",
      "anything here is not network data 1 2 3",
      "[End Information]",
      "[Network Data]",
      "10 11 1",
      "   21 2 22 2",
      "   31 3 32 3 33 3",
      "20 11 1 21 2 22 2 31 3 32 3 33 3",
      "[Noise Data]",
      "10 1 0.5 10 0.3",
      "[End]",
    ].join("\n");
    const { data, warnings } = parseTouchstone("lower.ts", text, ACTIVE);
    expect(data.referenceOhm).toEqual([50, 75, 100]);
    expect(Array.from(data.frequencyHz)).toEqual([10e6, 20e6]);
    expect(s(data, 1, 2)).toEqual([21, 2]);
    expect(s(data, 2, 1)).toEqual([21, 2]);
    expect(s(data, 1, 3, 1)).toEqual([31, 3]);
    expect(s(data, 3, 3, 1)).toEqual([33, 3]);
    expect(warnings.join(" ")).toContain("[Noise Data]");
  });

  it("accepts 0 Hz (DC) but not a frequency above 3 THz", () => {
    expect(parseTouchstone("dc.s1p", "# Hz S RI R 50\n0 1 0\n1 1 0\n").data.frequencyHz[0]).toBe(0);
    expect(() => parseTouchstone("thz.s1p", "# GHz S RI R 50\n4000 1 0\n")).toThrowError(/outside 0 to 3 THz/);
  });

  it("rejects Z, H and G parameters with a specific code", () => {
    for (const p of ["Z", "H", "G"]) {
      try {
        parseTouchstone("p.s2p", `# GHz ${p} RI R 50\n1 0 0 0 0 0 0 0 0\n`);
        expect.unreachable();
      } catch (e) {
        expect((e as IngestError).code).toBe("unsupported-parameter");
      }
    }
  });
});

interface SkrfPoint {
  index: number;
  frequencyHz: number;
  re: number[][];
  im: number[][];
}
interface SkrfFile {
  portCount: number;
  frequencyCount: number;
  referenceOhm: number[];
  points: SkrfPoint[];
}

// Regenerate with: /usr/bin/python3 scripts/reference/skrf-touchstone.py
// (Debian python3-scikit-rf 0.15 reads fixtures/examples and writes this JSON.)
const skrf = JSON.parse(readFileSync(path.join(__dirname, "reference", "touchstone-skrf.json"), "utf8")) as {
  files: Record<string, SkrfFile>;
};

describe("cross-check against scikit-rf", () => {
  it.each(Object.entries(skrf.files))("%s matches scikit-rf within 1e-9 relative", (name, ref) => {
    const { data } = parseTouchstone(name, fixtureBytes("examples", name));
    expect(data.portCount).toBe(ref.portCount);
    expect(data.frequencyHz.length).toBe(ref.frequencyCount);
    expect(data.referenceOhm).toEqual(ref.referenceOhm);
    for (const p of ref.points) {
      expect(Math.abs(data.frequencyHz[p.index] - p.frequencyHz)).toBeLessThanOrEqual(1e-9 * p.frequencyHz);
      for (let i = 0; i < ref.portCount; i++) {
        for (let j = 0; j < ref.portCount; j++) {
          const [re, im] = s(data, i + 1, j + 1, p.index);
          const scale = Math.max(Math.hypot(p.re[i][j], p.im[i][j]), 1e-12);
          expect(Math.abs(re - p.re[i][j])).toBeLessThanOrEqual(1e-9 * scale);
          expect(Math.abs(im - p.im[i][j])).toBeLessThanOrEqual(1e-9 * scale);
        }
      }
    }
  });
});

describe("large files", () => {
  it("reads a 4-port file with 10,001 frequencies", () => {
    const lines = ["# Hz S RI R 50"];
    for (let k = 0; k <= 10_000; k++) {
      for (let i = 0; i < 4; i++) {
        const row = Array.from({ length: 4 }, (_, j) => `${(0.1 * (i + 1) + 0.01 * j).toFixed(4)} ${(k * 1e-5).toFixed(5)}`).join(" ");
        lines.push(i === 0 ? `${1e6 + k * 1e5} ${row}` : `  ${row}`);
      }
    }
    const { data } = parseTouchstone("big.s4p", lines.join("\n"));
    expect(data.frequencyHz.length).toBe(10_001);
    expect(data.frequencyHz[10_000]).toBe(1e6 + 1e9);
    expect(s(data, 4, 3, 10_000)).toEqual([0.42, 0.1]);
  });
});
