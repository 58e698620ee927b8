import { describe, expect, it } from "vitest";
import { computeInterceptPoint, fitInterceptPoint } from "@/lib/rf/intermod";

describe("third-order intercept, single point", () => {
  // Kundert, "Accurate and Rapid Measurement of IP2 and IP3" (The Designer's Guide):
  // ΔIM = P_out − P_IM3, OIP3 = P_out + ΔIM/2, IIP3 = P_in + ΔIM/2; figures below [computed] from these.
  it.each([
    // Amplifier, 10 dB gain: −20 dBm/tone in, −10 dBm out, IM3 −70 dBm → ΔIM 60, OIP3 +20, IIP3 +10 dBm.
    { inputPowerDbm: -20, outputPowerDbm: -10, im3OutputPowerDbm: -70, deltaImDb: 60, oip3Dbm: 20, iip3Dbm: 10 },
    // Mixer, CL 7 dB: −10 dBm/tone in, −17 dBm out, IM3 −67 dBm → ΔIM 50, OIP3 +8, IIP3 +15 = OIP3 + CL.
    { inputPowerDbm: -10, outputPowerDbm: -17, im3OutputPowerDbm: -67, deltaImDb: 50, oip3Dbm: 8, iip3Dbm: 15 },
  ])("$inputPowerDbm dBm per tone", ({ inputPowerDbm, outputPowerDbm, im3OutputPowerDbm, deltaImDb, oip3Dbm, iip3Dbm }) => {
    const result = computeInterceptPoint({ inputPowerDbm, outputPowerDbm, im3OutputPowerDbm });
    expect(result.deltaImDb).toBeCloseTo(deltaImDb, 12);
    expect(result.oip3Dbm).toBeCloseTo(oip3Dbm, 12);
    expect(result.iip3Dbm).toBeCloseTo(iip3Dbm, 12);
    const conversionLossDb = inputPowerDbm - outputPowerDbm;
    expect(result.iip3Dbm).toBeCloseTo(result.oip3Dbm + conversionLossDb, 12);
  });
});

describe("third-order intercept, slope-fitted", () => {
  // Ideal mixer, CL 7 dB, IIP3 +15 dBm: P_out = P_in − 7, P_IM3 = 3·P_in − 2·15 − 7 [computed from the 3:1 law].
  const inputPowerDbm = [-30, -25, -20, -15, -10];
  const outputPowerDbm = inputPowerDbm.map((p) => p - 7);
  const im3OutputPowerDbm = inputPowerDbm.map((p) => 3 * p - 37);

  it("recovers the intercept and slopes 1 and 3", () => {
    const fit = fitInterceptPoint({ inputPowerDbm, outputPowerDbm, im3OutputPowerDbm });
    expect(fit.iip3Dbm).toBeCloseTo(15, 10);
    expect(fit.oip3Dbm).toBeCloseTo(8, 10);
    expect(fit.fundamentalSlope).toBeCloseTo(1, 10);
    expect(fit.im3Slope).toBeCloseTo(3, 10);
    expect(fit.iip3FreeSlopeDbm).toBeCloseTo(15, 10);
    expect(fit.warnings).toEqual([]);
  });

  it("warns when the points are compressed, and a drive limit fixes it", () => {
    const compressedIn = [...inputPowerDbm, 0, 5];
    const compressedOut = [...outputPowerDbm, -9, -8];
    const compressedIm3 = [...im3OutputPowerDbm, -45, -40];
    const all = fitInterceptPoint({ inputPowerDbm: compressedIn, outputPowerDbm: compressedOut, im3OutputPowerDbm: compressedIm3 });
    expect(all.warnings.length).toBe(2);
    expect(all.warnings[0]).toMatch(/Tone output slope is 0\.\d\d dB\/dB/);
    const smallSignal = fitInterceptPoint({
      inputPowerDbm: compressedIn,
      outputPowerDbm: compressedOut,
      im3OutputPowerDbm: compressedIm3,
      maxInputPowerDbm: -10,
    });
    expect(smallSignal.pointCount).toBe(5);
    expect(smallSignal.iip3Dbm).toBeCloseTo(15, 10);
    expect(smallSignal.warnings).toEqual([]);
  });

  it("averages measurement scatter with the fixed-slope fit", () => {
    // ±0.2 dB alternating scatter on IM3 cancels in the least-squares intercept (mean of P_IM3 − 3·P_in).
    const noisyIm3 = im3OutputPowerDbm.map((p, i) => p + (i % 2 === 0 ? 0.2 : -0.2) * (i === 4 ? 0 : 1));
    const fit = fitInterceptPoint({ inputPowerDbm, outputPowerDbm, im3OutputPowerDbm: noisyIm3 });
    expect(fit.iip3Dbm).toBeCloseTo(15, 10);
  });
});
