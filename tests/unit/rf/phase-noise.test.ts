import { describe, expect, it } from "vitest";
import {
  computeExcessOverIdealMultiplicationDb,
  computeMultiplicationPenaltyDb,
  computeSpotPhaseNoise,
  integratePhaseNoise,
  interpolatePhaseNoiseDbcHz,
} from "@/lib/rf/phase-noise";

describe("ideal multiplication", () => {
  // 20·log10(N): ideal multiplication, IEEE Std 1139-2008 [computed].
  it.each([
    { factor: 2, penaltyDb: 6.021 },
    { factor: 3, penaltyDb: 9.542 },
    { factor: 4, penaltyDb: 12.041 },
  ])("×$factor adds $penaltyDb dB", ({ factor, penaltyDb }) => {
    expect(computeMultiplicationPenaltyDb(factor)).toBeCloseTo(penaltyDb, 3);
  });

  it("excess of a doubler over the ideal 6.02 dB (common practice: ideal doubling adds 6.02 dB)", () => {
    // Input −150 dBc/Hz, output −141 dBc/Hz: 9 dB rise, 2.979 dB of it added by the doubler.
    const excessDb = computeExcessOverIdealMultiplicationDb({
      inputPhaseNoiseDbcHz: -150,
      outputPhaseNoiseDbcHz: -141,
      multiplicationFactor: 2,
    });
    expect(excessDb).toBeCloseTo(2.979, 3);
  });
});

describe("spot phase noise", () => {
  const trace = { offsetHz: [100, 1e3, 1e5, 1e6], phaseNoiseDbcHz: [-110, -130, -150, -155] };

  it("interpolates linearly in log10(offset) (IEEE Std 1139-2008 log-log plot)", () => {
    // 10 kHz is half-way in log between 1 kHz and 100 kHz: (−130 − 150)/2 = −140.
    expect(interpolatePhaseNoiseDbcHz(trace, 1e4)).toBeCloseTo(-140, 12);
    // 316.23 Hz = 10^2.5: half-way between −110 and −130.
    expect(interpolatePhaseNoiseDbcHz(trace, 10 ** 2.5)).toBeCloseTo(-120, 12);
    expect(interpolatePhaseNoiseDbcHz(trace, 1e6)).toBe(-155);
  });

  it("reports decade offsets inside the trace only", () => {
    expect(computeSpotPhaseNoise(trace)).toEqual([
      { offsetHz: 100, phaseNoiseDbcHz: -110 },
      { offsetHz: 1e3, phaseNoiseDbcHz: -130 },
      { offsetHz: 1e4, phaseNoiseDbcHz: expect.closeTo(-140, 12) },
      { offsetHz: 1e5, phaseNoiseDbcHz: -150 },
      { offsetHz: 1e6, phaseNoiseDbcHz: -155 },
    ]);
  });

  it("refuses to extrapolate", () => {
    expect(() => interpolatePhaseNoiseDbcHz(trace, 10)).toThrow(RangeError);
  });
});

describe("integrated phase noise and jitter", () => {
  it("MathWorks phaseNoiseToJitter documentation example", () => {
    // [source: MathWorks phaseNoiseToJitter documentation] f0 = 100 MHz; (100 Hz, −125), (1 kHz, −150),
    // (10 kHz, −174), (200 MHz, −174) dBc/Hz → 4.0430e-5 rad, 6.4346e-14 s.
    const result = integratePhaseNoise({
      trace: { offsetHz: [100, 1e3, 1e4, 200e6], phaseNoiseDbcHz: [-125, -150, -174, -174] },
      startOffsetHz: 100,
      stopOffsetHz: 200e6,
      carrierFrequencyHz: 100e6,
    });
    expect(result.phaseRmsRad / 4.043e-5).toBeCloseTo(1, 4);
    expect(result.jitterRmsS / 6.4346e-14).toBeCloseTo(1, 4);
  });

  it("flat −120 dBc/Hz from 10 kHz to 1 MHz at 100 MHz", () => {
    // [computed from the power-law integral]: A = 1e-12·990e3 → −60.04 dBc, 1.4071 mrad, 2.2395 ps.
    const result = integratePhaseNoise({
      trace: { offsetHz: [1e3, 1e7], phaseNoiseDbcHz: [-120, -120] },
      startOffsetHz: 1e4,
      stopOffsetHz: 1e6,
      carrierFrequencyHz: 100e6,
    });
    expect(result.integratedPhaseNoiseDbc).toBeCloseTo(-60.04, 2);
    expect(result.phaseRmsRad * 1e3).toBeCloseTo(1.4071, 4);
    expect(result.phaseRmsDeg).toBeCloseTo((1.4071e-3 * 180) / Math.PI, 5);
    expect(result.jitterRmsS * 1e12).toBeCloseTo(2.2395, 4);
  });

  it("integrates a −10 dB/decade (1/f) segment as a logarithm", () => {
    // L = 1e-10·(100 Hz/f) from 100 Hz to 10 kHz: A = 1e-10·100·ln(100) = 4.6052e-8 [computed, exact integral].
    const result = integratePhaseNoise({
      trace: { offsetHz: [100, 1e4], phaseNoiseDbcHz: [-100, -120] },
      startOffsetHz: 100,
      stopOffsetHz: 1e4,
      carrierFrequencyHz: 1e9,
    });
    expect(10 ** (result.integratedPhaseNoiseDbc / 10)).toBeCloseTo(1e-8 * Math.log(100), 20);
  });

  it("a −20 dB/decade segment integrates to L1·f1·(1 − f1/f2)", () => {
    // L = 1e-9·(1 kHz/f)² from 1 kHz to 100 kHz: A = 1e-9·1e3·(1 − 0.01) = 9.9e-7 [computed].
    const result = integratePhaseNoise({
      trace: { offsetHz: [1e3, 1e5], phaseNoiseDbcHz: [-90, -130] },
      startOffsetHz: 1e3,
      stopOffsetHz: 1e5,
      carrierFrequencyHz: 1e9,
    });
    expect(10 ** (result.integratedPhaseNoiseDbc / 10) / 9.9e-7).toBeCloseTo(1, 12);
  });

  it("jitter is unchanged by ideal multiplication (IEEE Std 1139-2008)", () => {
    const base = { offsetHz: [1e3, 1e6], phaseNoiseDbcHz: [-120, -140] };
    const doubled = { offsetHz: base.offsetHz, phaseNoiseDbcHz: base.phaseNoiseDbcHz.map((l) => l + 20 * Math.log10(2)) };
    const options = { startOffsetHz: 1e3, stopOffsetHz: 1e6 };
    const input = integratePhaseNoise({ ...options, trace: base, carrierFrequencyHz: 1e9 });
    const output = integratePhaseNoise({ ...options, trace: doubled, carrierFrequencyHz: 2e9 });
    expect(output.jitterRmsS / input.jitterRmsS).toBeCloseTo(1, 12);
  });

  it("refuses a reversed span", () => {
    expect(() =>
      integratePhaseNoise({ trace: { offsetHz: [1, 10], phaseNoiseDbcHz: [0, 0] }, startOffsetHz: 10, stopOffsetHz: 1, carrierFrequencyHz: 1 }),
    ).toThrow(RangeError);
  });
});
