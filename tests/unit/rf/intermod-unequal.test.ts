import { describe, expect, it } from "vitest";
import { deriveParameters } from "@/lib/analysis";
import { computeUnequalToneOip3Dbm, predictThirdOrderProducts } from "@/lib/rf/intermod";

/**
 * Unequal tones against an independent computation: two cosines through the memoryless cubic
 * y = a1·x + a3·x³, sampled and transformed with a plain DFT, and the output powers read at the tone and
 * product bins. Nothing of lib/rf is used to make the reference. OIP3 is the equal-tone output intercept of
 * that cubic: A_IIP3² = (4/3)·|a1/a3| (Razavi, RF Microelectronics, §2.2; from memory), OIP3 = a1·A_IIP3.
 */
const a1 = 3.16227766; // 10 dB voltage gain
const a3 = -4;
const R = 50;
const N = 4096;
const k1 = 200; // bins of f1 and f2; 2f1 − f2 at 190, 2f2 − f1 at 220
const k2 = 210;
const dbmOfAmplitude = (amplitudeV: number) => 10 * Math.log10((amplitudeV * amplitudeV) / (2 * R) / 1e-3);
const amplitudeOfDbm = (dbm: number) => Math.sqrt(2 * R * 1e-3 * 10 ** (dbm / 10));

/** Output power in dBm at the given bins, from the DFT of the cubic's output. */
function cubicSpectrumDbm(tone1Dbm: number, tone2Dbm: number, bins: number[]): number[] {
  const A1 = amplitudeOfDbm(tone1Dbm);
  const A2 = amplitudeOfDbm(tone2Dbm);
  const y = new Float64Array(N);
  for (let n = 0; n < N; n++) {
    const x = A1 * Math.cos((2 * Math.PI * k1 * n) / N) + A2 * Math.cos((2 * Math.PI * k2 * n) / N);
    y[n] = a1 * x + a3 * x * x * x;
  }
  return bins.map((k) => {
    let re = 0;
    let im = 0;
    for (let n = 0; n < N; n++) {
      re += y[n] * Math.cos((2 * Math.PI * k * n) / N);
      im -= y[n] * Math.sin((2 * Math.PI * k * n) / N);
    }
    return dbmOfAmplitude((2 * Math.hypot(re, im)) / N);
  });
}

const oip3Dbm = dbmOfAmplitude(a1 * Math.sqrt((4 / 3) * Math.abs(a1 / a3)));

describe("third-order products of unequal tones", () => {
  it("worked example: equal tones reduce to P_IM3 = 3·P − 2·OIP3 (Kundert's ΔIM = 2·(OIP3 − P))", () => {
    // Tones of −10 dBm out, OIP3 +20 dBm: ΔIM = 60 dB, so both products at −70 dBm.
    expect(predictThirdOrderProducts({ oip3Dbm: 20, tone1OutputDbm: -10, tone2OutputDbm: -10 })).toEqual({ lowerDbm: -70, upperDbm: -70 });
    // Tone 2 six dB lower: the product beside tone 1 falls 6 dB, the one beside tone 2 12 dB.
    expect(predictThirdOrderProducts({ oip3Dbm: 20, tone1OutputDbm: -10, tone2OutputDbm: -16 })).toEqual({ lowerDbm: -76, upperDbm: -82 });
  });

  it.each([
    [-30, -30],
    [-30, -36],
    [-25, -28.5],
  ])("tones at %d and %d dBm in: both products as the DFT of the cubic", (tone1Dbm, tone2Dbm) => {
    const [out1, out2, lower, upper] = cubicSpectrumDbm(tone1Dbm, tone2Dbm, [k1, k2, 2 * k1 - k2, 2 * k2 - k1]);
    const predicted = predictThirdOrderProducts({ oip3Dbm, tone1OutputDbm: out1, tone2OutputDbm: out2 });
    // The tone outputs carry a little self-compression (3/4·a3·A³ terms), the only gap: under 0.01 dB here.
    expect(predicted.lowerDbm).toBeCloseTo(lower, 1);
    expect(predicted.upperDbm).toBeCloseTo(upper, 1);
    expect(Math.abs(predicted.lowerDbm - lower)).toBeLessThan(0.02);
    expect(Math.abs(predicted.upperDbm - upper)).toBeLessThan(0.02);
    expect(computeUnequalToneOip3Dbm({ tone1OutputDbm: out1, tone2OutputDbm: out2, lowerProductDbm: lower })).toBeCloseTo(oip3Dbm, 1);
  });

  it("a two-tone file with tone 2 3 dB down: OIP3 and both predicted products from the engine", () => {
    const offsetDb = -3;
    const input = Array.from({ length: 8 }, (_, i) => -40 + 2 * i);
    const spectra = input.map((p) => cubicSpectrumDbm(p, p + offsetDb, [k1, 2 * k1 - k2, 2 * k2 - k1]));
    const result = deriveParameters({
      kind: "two-tone",
      warnings: [],
      data: {
        serial: "CUBIC-1",
        metadata: {},
        inputPowerPerToneDbm: input,
        fundamentalOutputDbm: spectra.map((s) => s[0]),
        im3OutputDbm: spectra.map((s) => s[1]),
        tone2RelativeLevelDb: offsetDb,
      },
    });
    const fitted = result.parameters.find((p) => p.name === "oip3" && p.conditions.method === "slope-fit")!;
    expect(Math.abs(fitted.value! - oip3Dbm)).toBeLessThan(0.02);
    input.forEach((p, i) => {
      const at = (product: string) => result.parameters.find((x) => x.name === "im3-predicted" && x.conditions.inputPowerDbm === p && x.conditions.product === product)!.value!;
      expect(Math.abs(at("2f1-f2") - spectra[i][1])).toBeLessThan(0.05);
      expect(Math.abs(at("2f2-f1") - spectra[i][2])).toBeLessThan(0.05);
    });
  });
});
