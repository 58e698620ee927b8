import { describe, expect, it } from "vitest";
import { computeHarmonicSuppressions, computeSuppressionDbc, findOptimumDrive } from "@/lib/rf/harmonics";
import { computeConversionLossDb } from "@/lib/rf/conversion";

describe("harmonic suppression (positive dBc = below the wanted output)", () => {
  it("reproduces the doubler worked example", () => {
    // Doubler example computed from the dBc definition (suppression = P(2f) − P(nf), common practice): +10 dBm in, 2f −3 dBm, f −33 dBm, 3f −28 dBm
    // → CL 13 dB, fundamental 30 dBc, 3rd 25 dBc.
    const levels = [
      { order: 3, outputPowerDbm: -28 },
      { order: 1, outputPowerDbm: -33 },
      { order: 2, outputPowerDbm: -3 },
    ];
    const suppressions = computeHarmonicSuppressions({ levels, wantedOrder: 2 });
    expect(suppressions.map((s) => [s.order, s.suppressionDbc])).toEqual([
      [1, 30],
      [3, 25],
    ]);
    expect(computeConversionLossDb(10, -3)).toBe(13);
  });

  it("gives a negative figure when the unwanted order is stronger", () => {
    expect(computeSuppressionDbc(-20, -15)).toBe(-5);
  });

  it("refuses a missing or duplicated wanted order", () => {
    expect(() => computeHarmonicSuppressions({ levels: [{ order: 1, outputPowerDbm: 0 }], wantedOrder: 2 })).toThrow(
      RangeError,
    );
    expect(() =>
      computeHarmonicSuppressions({
        levels: [
          { order: 2, outputPowerDbm: 0 },
          { order: 2, outputPowerDbm: 1 },
        ],
        wantedOrder: 2,
      }),
    ).toThrow(RangeError);
  });
});

describe("optimum drive", () => {
  // Constructed parabola CL = 10 + 0.05·(P − 13.4)²: vertex known analytically at 13.4 dBm, 10 dB
  // (a diode doubler losing about 10 dB at best drive: common practice).
  const parabola = (inputPowerDbm: number) => 10 + 0.05 * (inputPowerDbm - 13.4) ** 2;

  it.each([
    { name: "even 2 dB steps", steps: [6, 8, 10, 12, 14, 16, 18, 20] },
    { name: "uneven steps", steps: [7, 10, 12.5, 13, 15, 19] },
    { name: "unsorted input", steps: [20, 8, 16, 12, 10, 14, 18] },
  ])("finds the vertex of a parabola, $name", ({ steps }) => {
    const optimum = findOptimumDrive({ inputPowerDbm: steps, conversionLossDb: steps.map(parabola) });
    expect(optimum.method).toBe("parabolic");
    expect(optimum.atSweepEnd).toBe(false);
    expect(optimum.inputPowerDbm).toBeCloseTo(13.4, 10);
    expect(optimum.conversionLossDb).toBeCloseTo(10, 10);
  });

  it("flags an optimum at the end of the sweep and keeps the measured step", () => {
    const steps = [0, 2, 4, 6, 8];
    const optimum = findOptimumDrive({ inputPowerDbm: steps, conversionLossDb: steps.map(parabola) });
    expect(optimum).toEqual({ inputPowerDbm: 8, conversionLossDb: parabola(8), method: "sweep-step", atSweepEnd: true });
  });

  it("accepts Float64Array input", () => {
    const steps = Float64Array.from([10, 12, 14, 16]);
    const losses = Float64Array.from(steps, parabola);
    expect(findOptimumDrive({ inputPowerDbm: steps, conversionLossDb: losses }).inputPowerDbm).toBeCloseTo(13.4, 10);
  });

  it("refuses mismatched or duplicated sweeps", () => {
    expect(() => findOptimumDrive({ inputPowerDbm: [1, 2], conversionLossDb: [1] })).toThrow(RangeError);
    expect(() => findOptimumDrive({ inputPowerDbm: [1, 1, 2], conversionLossDb: [3, 2, 3] })).toThrow(RangeError);
  });
});
