import { describe, expect, it } from "vitest";
import { findCompressionPoint } from "@/lib/rf/compression";

describe("1 dB compression point", () => {
  it("piecewise-linear gain: answer known exactly", () => {
    // Constructed: gain 10 dB up to −10 dBm, then falls 0.4 dB per dB → gain 9 dB at −7.5 dBm exactly,
    // between the −8 and −7 dBm steps; linear interpolation (Kundert, The Designer's Guide) is exact here.
    const inputPowerDbm = Array.from({ length: 21 }, (_, i) => -20 + i);
    const gainDb = inputPowerDbm.map((p) => 10 - 0.4 * Math.max(0, p + 10));
    const result = findCompressionPoint({ inputPowerDbm, gainDb });
    expect(result.reached).toBe(true);
    if (!result.reached) return;
    expect(result.smallSignalGainDb).toBe(10);
    expect(result.inputCompressionPointDbm).toBeCloseTo(-7.5, 12);
    expect(result.outputCompressionPointDbm).toBeCloseTo(1.5, 12);
  });

  it("Rapp limiter model, smoothness 1: close to the analytic point", () => {
    // Rapp model |Vout| = G·v/(1 + (G·v/Vsat)²)^½, i.e. P_out = G·P_in/(1 + G·P_in/P_sat). Gain drops 1 dB
    // where G·P_in/P_sat = 10^0.1 − 1, so IP1dB = P_sat − G + 10·log10(10^0.1 − 1) [computed]; with
    // P_sat = +10 dBm, G = 6 dB: IP1dB = 10 − 6 − 5.8683 = −1.8683 dBm.
    const smallSignalGainDb = 6;
    const saturationDbm = 10;
    const inputPowerDbm = Array.from({ length: 61 }, (_, i) => -25 + 0.5 * i);
    const gainDb = inputPowerDbm.map((p) => {
      const linearOutput = 10 ** ((p + smallSignalGainDb - saturationDbm) / 10);
      return smallSignalGainDb - 10 * Math.log10(1 + linearOutput);
    });
    const analyticInputDbm = saturationDbm - smallSignalGainDb + 10 * Math.log10(10 ** 0.1 - 1);
    expect(analyticInputDbm).toBeCloseTo(-1.8683, 4);
    const result = findCompressionPoint({ inputPowerDbm, gainDb });
    expect(result.reached).toBe(true);
    if (!result.reached) return;
    // Small-signal gain from the first three points is 0.0075 dB low and interpolation adds a little: 0.05 dB bound.
    expect(Math.abs(result.inputCompressionPointDbm - analyticInputDbm)).toBeLessThan(0.05);
    expect(result.outputCompressionPointDbm).toBeCloseTo(result.inputCompressionPointDbm + result.smallSignalGainDb - 1, 12);
  });

  it("works on conversion gain (negative) and unsorted steps", () => {
    // Mixer with CL 7 dB: gain −7 dB, compressing from 0 dBm at 0.5 dB/dB → −8 dB at +2 dBm.
    const inputPowerDbm = [4, -10, 2, -6, 0, -8, 6];
    const gainDb = inputPowerDbm.map((p) => -7 - 0.5 * Math.max(0, p));
    const result = findCompressionPoint({ inputPowerDbm, gainDb });
    expect(result.reached && result.inputCompressionPointDbm).toBeCloseTo(2, 12);
    expect(result.reached && result.outputCompressionPointDbm).toBeCloseTo(-6, 12);
  });

  it("reports when the sweep never compresses", () => {
    const inputPowerDbm = [-20, -15, -10, -5, 0];
    const gainDb = [10, 10, 10, 9.8, 9.4];
    const result = findCompressionPoint({ inputPowerDbm, gainDb });
    expect(result.reached).toBe(false);
    if (result.reached) return;
    expect(result.maxCompressionSeenDb).toBeCloseTo(0.6, 12);
    expect(result.maxInputPowerDbm).toBe(0);
    expect(result.reason).toMatch(/never fell 1 dB/);
  });

  it("refuses a sweep with only small-signal points", () => {
    expect(() => findCompressionPoint({ inputPowerDbm: [-20, -15, -10], gainDb: [1, 1, 1] })).toThrow(RangeError);
  });
});
