import { describe, expect, it } from "vitest";
import { computeComplexMagnitude, createComplexFromPolar } from "@/lib/rf/complex";
import {
  computeInsertionLossDb,
  computeIsolationDb,
  computeLoadImpedanceOhm,
  computeMismatchLossDb,
  computeReflectionCoefficient,
  computeReturnLossDb,
  computeVswr,
  convertReturnLossToReflectionMagnitude,
  convertVswrToReflectionMagnitude,
  summarizePortMatch,
} from "@/lib/rf/mismatch";

describe("port match", () => {
  it("25 Ω on 50 Ω (an unmatched tee feeding two 50 Ω ports)", () => {
    // Computed from Γ = (ZL − Z0)/(ZL + Z0), VSWR = (1+|Γ|)/(1−|Γ|), RL = −20·log|Γ|, ML = −10·log(1−|Γ|²) (Pozar, Microwave Engineering §2.3): |Γ| 1/3, VSWR 2.000, RL 9.5424 dB, ML 0.5115 dB.
    const gamma = computeReflectionCoefficient(25);
    expect(gamma.re).toBeCloseTo(-1 / 3, 14);
    expect(gamma.im).toBe(0);
    const match = summarizePortMatch(gamma);
    expect(match.reflectionMagnitude).toBeCloseTo(1 / 3, 14);
    expect(match.vswr).toBeCloseTo(2, 12);
    expect(match.returnLossDb).toBeCloseTo(9.5424, 4);
    expect(match.mismatchLossDb).toBeCloseTo(0.5115, 4);
    expect(match.reflectionAngleDeg).toBeCloseTo(180, 12);
  });

  it("VSWR 1.5", () => {
    // Published VSWR conversion tables (from memory; the same values follow from Pozar §2.3): |Γ| 0.2, RL 13.979 dB, ML 0.1773 dB.
    const magnitude = convertVswrToReflectionMagnitude(1.5);
    expect(magnitude).toBeCloseTo(0.2, 14);
    expect(computeReturnLossDb(magnitude)).toBeCloseTo(13.979, 3);
    expect(computeMismatchLossDb(magnitude)).toBeCloseTo(0.1773, 4);
    expect(computeVswr(magnitude)).toBeCloseTo(1.5, 14);
  });

  it("complex load 50 + j50 Ω", () => {
    // Pozar, Microwave Engineering, §2.3 formula by hand [computed]: Γ = j50/(100 + j50) = 0.2 + j0.4,
    // |Γ| = 0.44721, VSWR = 2.6180 (the golden ratio squared).
    const gamma = computeReflectionCoefficient({ re: 50, im: 50 });
    expect(gamma.re).toBeCloseTo(0.2, 14);
    expect(gamma.im).toBeCloseTo(0.4, 14);
    expect(computeVswr(computeComplexMagnitude(gamma))).toBeCloseTo(2.618034, 6);
    const impedance = computeLoadImpedanceOhm(gamma);
    expect(impedance.re).toBeCloseTo(50, 12);
    expect(impedance.im).toBeCloseTo(50, 12);
  });

  it("a perfect match has infinite return loss and VSWR 1", () => {
    const match = summarizePortMatch({ re: 0, im: 0 });
    expect(match.returnLossDb).toBe(Infinity);
    expect(match.vswr).toBe(1);
    expect(match.mismatchLossDb).toBeCloseTo(0, 15);
  });

  it("round-trips return loss", () => {
    // RL 20 dB ↔ |Γ| 0.1 (definition RL = −20·log10|Γ|).
    expect(convertReturnLossToReflectionMagnitude(20)).toBeCloseTo(0.1, 14);
  });

  it("refuses an active (|Γ| > 1) reflection", () => {
    expect(() => computeVswr(1.2)).toThrow(RangeError);
  });
});

describe("transmission", () => {
  it("insertion loss and isolation are −20·log10|S|", () => {
    // |S21| = 0.5 → 6.0206 dB; |S31| = 0.01 → 40 dB (definition).
    expect(computeInsertionLossDb(createComplexFromPolar(0.5, -73))).toBeCloseTo(6.0206, 4);
    expect(computeIsolationDb({ re: 0, im: 0.01 })).toBeCloseTo(40, 12);
  });
});
