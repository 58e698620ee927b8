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
    // The reference averages the leading points within 0.1 dB of the first, so it lies at most 0.1 dB below the
    // true small-signal gain: the point found lies between the analytic 1 dB and 1.1 dB compression points
    // (the same Rapp formula with x = 1.1), plus a little for linear interpolation between 0.5 dB steps.
    const analytic11Dbm = saturationDbm - smallSignalGainDb + 10 * Math.log10(10 ** 0.11 - 1);
    expect(result.inputCompressionPointDbm).toBeGreaterThan(analyticInputDbm - 0.01);
    expect(result.inputCompressionPointDbm).toBeLessThan(analytic11Dbm + 0.01);
    expect(result.pointCount).toBeGreaterThan(3);
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

  it("refuses a sweep of one point and a reference drive outside the sweep", () => {
    expect(() => findCompressionPoint({ inputPowerDbm: [-20], gainDb: [1] })).toThrow(RangeError);
    expect(() => findCompressionPoint({ inputPowerDbm: [-20, -15, -10], gainDb: [1, 1, 1], referenceInputPowerDbm: -25 })).toThrow(
      /reference drive −25 dBm lies outside the sweep, which runs from −20 dBm to −10 dBm/,
    );
  });
});

/**
 * The memoryless cubic y = a1·x + a3·x³ (a3 < 0): a tone of amplitude A comes out at a1·A + (3/4)·a3·A³, so
 * the gain in dB is 20·log10(1 − (3/4)·|a3/a1|·A²) and falls 1 dB at A² = (1 − 10^(−1/20))/(0.75·|a3/a1|).
 * Razavi, RF Microelectronics (2nd ed., §2.2.2; from memory) gives A_1dB = √(0.145·|a1/a3|), and defines
 * P1dB as the input at which the small-signal gain has dropped by 1 dB (Pozar, Microwave Engineering,
 * gain compression, the same definition; from memory). Powers are A²/(2·50 Ω) in dBm.
 */
describe("1 dB compression against the cubic-nonlinearity textbook value", () => {
  const a1 = 10;
  const a3 = -10; // |a1/a3| = 1 V²
  const toDbm = (amplitudeV: number) => 10 * Math.log10((amplitudeV * amplitudeV) / (2 * 50) / 1e-3);
  const gainDbAt = (inputDbm: number) => {
    const amplitudeV = Math.sqrt(2 * 50 * 1e-3 * 10 ** (inputDbm / 10));
    return 20 * Math.log10(a1 + 0.75 * a3 * amplitudeV * amplitudeV);
  };
  const exactAmplitudeV = Math.sqrt((1 - 10 ** (-1 / 20)) / (0.75 * Math.abs(a3 / a1)));
  const exactP1dbDbm = toDbm(exactAmplitudeV);
  const sweep = (fromDbm: number, toDbm_: number, stepDb: number) => {
    const inputPowerDbm: number[] = [];
    for (let p = fromDbm; p <= toDbm_ + 1e-9; p += stepDb) inputPowerDbm.push(Math.round(p * 1000) / 1000);
    return { inputPowerDbm, gainDb: inputPowerDbm.map(gainDbAt) };
  };

  it("the exact 1 dB amplitude is Razavi's √(0.145·|a1/a3|)", () => {
    expect(exactAmplitudeV).toBeCloseTo(Math.sqrt(0.145 * Math.abs(a1 / a3)), 3);
    expect(exactP1dbDbm).toBeCloseTo(1.614, 3); // 10·log10(0.145 V² / (2·50 Ω) / 1 mW) dBm
  });

  it("a sweep that starts in its linear region finds the textbook point, with no warning", () => {
    const result = findCompressionPoint(sweep(-30, 5, 0.25));
    expect(result.nonLinearStart).toBeUndefined();
    expect(result.method).toBe("leading-points");
    expect(result.reached).toBe(true);
    if (!result.reached) return;
    // The leading points within 0.1 dB stretch the reference at most 0.05 dB low on average; a 0.25 dB grid adds
    // interpolation error: within 0.1 dB of the exact value.
    expect(Math.abs(result.inputCompressionPointDbm - exactP1dbDbm)).toBeLessThan(0.1);
  });

  it("a sweep that compresses early is warned about and biased less than a three-point mean", () => {
    // Starts 3 dB below P1dB in 1 dB steps, where the gain is already 0.4 dB down and falls more than 0.1 dB a step.
    const early = sweep(-1.5, 5, 1);
    const startCompressionDb = gainDbAt(-1e3) - gainDbAt(-1.5);
    expect(startCompressionDb).toBeGreaterThan(0.3);
    const result = findCompressionPoint(early);
    expect(result.pointCount).toBe(1);
    expect(result.nonLinearStart).toMatch(/does not start in its linear region: the gain changes by −0\.\d\d dB from −1\.5 dBm to −0\.5 dBm/);
    // A caller that never shows the message (a multiplier) gets the same figures without it.
    const { nonLinearStart, ...figures } = result;
    expect(nonLinearStart).toBeDefined();
    expect(findCompressionPoint({ ...early, describeNonLinearStart: false })).toEqual(figures);
    expect(result.reached).toBe(true);
    if (!result.reached) return;
    // The first point's gain is the reference: P1dB comes out late, at the point where gain is 1 dB below the
    // first point's, i.e. (1 + startCompressionDb) dB below the true small-signal gain.
    const expectedAmplitude = Math.sqrt((1 - 10 ** (-(1 + startCompressionDb) / 20)) / 0.75);
    expect(Math.abs(result.inputCompressionPointDbm - toDbm(expectedAmplitude))).toBeLessThan(0.1);
    expect(result.inputCompressionPointDbm).toBeGreaterThan(exactP1dbDbm);
    // The former rule (mean of the three lowest points) read the reference lower still, so P1dB later.
    const threePointGainDb = (early.gainDb[0] + early.gainDb[1] + early.gainDb[2]) / 3;
    expect(threePointGainDb).toBeLessThan(result.smallSignalGainDb - 0.05);
  });

  it("a stated reference drive inside the linear region recovers the textbook point from a long sweep", () => {
    // The sweep starts with an expansion artefact (a badly levelled first step) that the leading-point rule
    // cannot get past; the engineer states −20 dBm as the reference.
    const data = sweep(-30, 5, 0.25);
    data.gainDb[0] += 0.5;
    const automatic = findCompressionPoint(data);
    expect(automatic.nonLinearStart).toBeDefined();
    const stated = findCompressionPoint({ ...data, referenceInputPowerDbm: -20 });
    expect(stated.method).toBe("stated-drive");
    expect(stated.nonLinearStart).toBeUndefined();
    expect(stated.smallSignalGainDb).toBeCloseTo(gainDbAt(-20), 12);
    expect(stated.reached && Math.abs(stated.inputCompressionPointDbm - exactP1dbDbm)).toBeLessThan(0.05);
  });
});
