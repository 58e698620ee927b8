import { describe, expect, it } from "vitest";
import { createComplexFromPolar } from "@/lib/rf/complex";
import {
  computeAmplitudeBalanceDb,
  computePhaseBalanceDeg,
  computePhaseBalanceSweepDeg,
  unwrapPhaseDeg,
} from "@/lib/rf/balance";

describe("amplitude and phase balance", () => {
  it("an ideal 90° hybrid is balanced", () => {
    // Ideal quadrature hybrid: S21 = −j/√2, S31 = −1/√2 (Pozar, Microwave Engineering, §7.5).
    const through = { re: 0, im: -Math.SQRT1_2 };
    const coupled = { re: -Math.SQRT1_2, im: 0 };
    expect(computeAmplitudeBalanceDb(through, coupled)).toBeCloseTo(0, 14);
    expect(computePhaseBalanceDeg({ outputA: through, outputB: coupled, nominalPhaseDifferenceDeg: 90 })).toBeCloseTo(
      0,
      12,
    );
  });

  it.each([
    // Constructed: |A| = 0.7, |B| = 0.68 → 20·log10(0.7/0.68) = 0.25178 dB; phases −91.5° and 0.2° → −1.7° from −90°.
    { magA: 0.7, degA: -91.5, magB: 0.68, degB: 0.2, nominal: -90, ampDb: 0.25178, phaseDeg: -1.7 },
    // Across the ±180° cut: 179° and −179° differ by −2°, not 358°.
    { magA: 0.5, degA: 179, magB: 0.5, degB: -179, nominal: 0, ampDb: 0, phaseDeg: -2 },
  ])("A $degA°, B $degB°, nominal $nominal°", ({ magA, degA, magB, degB, nominal, ampDb, phaseDeg }) => {
    const outputA = createComplexFromPolar(magA, degA);
    const outputB = createComplexFromPolar(magB, degB);
    expect(computeAmplitudeBalanceDb(outputA, outputB)).toBeCloseTo(ampDb, 5);
    expect(computePhaseBalanceDeg({ outputA, outputB, nominalPhaseDifferenceDeg: nominal })).toBeCloseTo(phaseDeg, 10);
  });

  it("unwraps a phase ramp", () => {
    expect(unwrapPhaseDeg([170, -170, -150, 170])).toEqual([170, 190, 210, 170]);
  });

  it("keeps a sweep's balance continuous past ±180°", () => {
    // Output A lags B by 90° plus an error that grows from 0° to 200°.
    const errorsDeg = [0, 50, 100, 150, 200];
    const delaysDeg = [0, -120, -240, -360, -480];
    const outputB = delaysDeg.map((d) => createComplexFromPolar(0.7, d));
    const outputA = delaysDeg.map((d, i) => createComplexFromPolar(0.7, d - 90 + errorsDeg[i]));
    const balance = computePhaseBalanceSweepDeg({ outputA, outputB, nominalPhaseDifferenceDeg: -90 });
    balance.forEach((value, i) => expect(value).toBeCloseTo(errorsDeg[i], 10));
  });
});
