import { describe, expect, it } from "vitest";
import { analyzeExample, pick, valueOf } from "./helpers";

describe("frequency sweep of a mixer (frequency-sweep-mixer.csv)", () => {
  const { parameters: p } = analyzeExample("frequency-sweep-mixer.csv");
  // The conversion_loss column, 500 MHz … 3 GHz, 26 rows (decimal commas in the file).
  const cl = [
    6.03, 6.01, 6.14, 6.13, 6.22, 6.27, 6.27, 6.35, 6.42, 6.53, 6.58, 6.53, 6.58, 6.71, 6.86, 6.86, 6.87, 6.96, 7.16, 7.1,
    7.19, 7.35, 7.45, 7.56, 7.65, 7.76,
  ];

  it("gives min / typ (median) / max conversion loss over the band with the band edges", () => {
    const sorted = [...cl].sort((a, b) => a - b);
    expect(valueOf(p, "conversion-loss", { statistic: "min" })).toBe(6.01);
    expect(valueOf(p, "conversion-loss", { statistic: "max" })).toBe(7.76);
    // Median of 26 values: mean of the 13th and 14th sorted (6.58 and 6.71).
    expect(valueOf(p, "conversion-loss", { statistic: "typ" })).toBeCloseTo((sorted[12] + sorted[13]) / 2, 12);
    expect(pick(p, "conversion-loss", { statistic: "typ" }).conditions).toMatchObject({
      startHz: 500e6,
      stopHz: 3e9,
      loPowerDbm: 7,
      ifFrequencyHz: 70e6,
    });
  });

  it("gives the LO–RF isolation minimum and nothing for paths the file lacks", () => {
    expect(valueOf(p, "isolation", { path: "LO-RF" })).toBe(27.99);
    expect(p.filter((x) => x.name === "isolation")).toHaveLength(1);
  });
});

describe("two-tone intercept (two-tone-mixer.tsv)", () => {
  const result = analyzeExample("two-tone-mixer.tsv");
  const p = result.parameters;
  const input = [-20, -18, -16, -14, -12, -10, -8, -6, -4, -2, 0];
  const tone = [-26.4, -24.4, -22.4, -20.4, -18.4, -16.4, -14.4, -12.4, -10.48, -8.72, -7.12];
  const im3 = [-98.16, -92.29, -86.21, -80.29, -74.15, -68.2, -62.2, -56.27, -50.49, -45.15, -40.42];

  it("gives the single-point figures at the lowest drive (Kundert: OIP3 = P_out + ΔIM/2, IIP3 = P_in + ΔIM/2)", () => {
    const deltaImDb = -26.4 - -98.16; // 71.76 dB
    expect(valueOf(p, "delta-im", { inputPowerDbm: -20 })).toBeCloseTo(deltaImDb, 9);
    expect(valueOf(p, "iip3", { method: "single-point" })).toBeCloseTo(-20 + deltaImDb / 2, 9);
    expect(valueOf(p, "oip3", { method: "single-point" })).toBeCloseTo(-26.4 + deltaImDb / 2, 9);
  });

  it("fits slope-1 and slope-3 lines over the small-signal points only", () => {
    // Tone gain is −6.40 dB up to −6 dBm, −6.48 at −4 (within 0.2 dB), −6.72 at −2: the fit stops at −4 dBm (9 points).
    const used = input.filter((x) => x <= -4).length;
    const mean = (values: number[]) => values.reduce((s, v) => s + v, 0) / values.length;
    const b1 = mean(tone.slice(0, used).map((y, i) => y - input[i]));
    const b3 = mean(im3.slice(0, used).map((y, i) => y - 3 * input[i]));
    // Lines y = x + b1 and y = 3x + b3 meet at x = (b1 − b3)/2 (Kundert).
    const iip3 = (b1 - b3) / 2;
    expect(pick(p, "iip3", { method: "slope-fit" }).conditions.maxInputPowerDbm).toBe(-4);
    expect(valueOf(p, "iip3", { method: "slope-fit" })).toBeCloseTo(iip3, 9);
    expect(valueOf(p, "oip3", { method: "slope-fit" })).toBeCloseTo(iip3 + b1, 9);
    expect(valueOf(p, "im3-slope", { method: "slope-fit" })).toBeCloseTo(3, 1);
    expect(valueOf(p, "fundamental-slope", { method: "slope-fit" })).toBeCloseTo(1, 1);
    // The single-point cross-check agrees within 0.1 dB on data this clean.
    expect(Math.abs(iip3 - valueOf(p, "iip3", { method: "single-point" }))).toBeLessThan(0.1);
  });

  it("accepts an explicit fit limit", () => {
    const wide = analyzeExample("two-tone-mixer.tsv", { twoTone: { maxInputPowerDbm: 0 } });
    expect(pick(wide.parameters, "iip3", { method: "slope-fit" }).conditions.maxInputPowerDbm).toBe(0);
    expect(valueOf(wide.parameters, "iip3", { method: "slope-fit" })).not.toBeCloseTo(valueOf(p, "iip3", { method: "slope-fit" }), 2);
  });

  it("reports input P1dB as not reached: tone gain falls only 0.72 dB by 0 dBm", () => {
    expect(pick(p, "input-p1db").value).toBeNull();
    expect(result.warnings.join("\n")).toContain("0 dBm");
  });
});
