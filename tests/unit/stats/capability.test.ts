import { describe, expect, it } from "vitest";
import { computeCapability, computeCpkConfidenceInterval } from "@/lib/stats/capability";

describe("process capability", () => {
  it("NIST/SEMATECH e-Handbook §6.1.6 example (from memory: USL 20, LSL 8, mean 16, s 2)", () => {
    // Recalled from the handbook, not re-read: Cp 1.00, Cpk 0.667.
    const result = computeCapability({ mean: 16, standardDeviation: 2, lowerSpecLimit: 8, upperSpecLimit: 20 });
    expect(result.cp).toBeCloseTo(1, 12);
    expect(result.cpk).toBeCloseTo(0.667, 3);
    expect(result.cpu).toBeCloseTo(0.667, 3);
    expect(result.cpl).toBeCloseTo(1.333, 3);
  });

  // One-sided specs: Cpk from the one side (same handbook formulas).
  it.each([
    { name: "max only (an upper limit of 8)", upperSpecLimit: 8, lowerSpecLimit: undefined, cpk: (8 - 6.5) / 0.9 },
    { name: "min only (a lower limit of 5)", upperSpecLimit: undefined, lowerSpecLimit: 5, cpk: (6.5 - 5) / 0.9 },
  ])("$name", ({ upperSpecLimit, lowerSpecLimit, cpk }) => {
    const result = computeCapability({ mean: 6.5, standardDeviation: 0.3, upperSpecLimit, lowerSpecLimit });
    expect(result.cp).toBeNull();
    expect(result.cpk).toBeCloseTo(cpk, 12);
  });

  it("refuses no limits and zero spread", () => {
    expect(() => computeCapability({ mean: 1, standardDeviation: 1 })).toThrow(RangeError);
    expect(() => computeCapability({ mean: 1, standardDeviation: 0, upperSpecLimit: 2 })).toThrow(RangeError);
  });
});

describe("confidence interval of Cpk (Bissell 1990, normal approximation)", () => {
  // scipy 1.17.1: z = norm.ppf(1 − (1 − c)/2); Ĉpk ± z·sqrt(1/(9n) + Ĉpk²/(2(n − 1))).
  it.each([
    [1.33, 30, 0.95, 0.9675286272156964, 1.6924713727843037],
    [1.5, 10, 0.95, 0.7769057956446782, 2.2230942043553217],
    [2.0, 50, 0.9, 1.6587630385611818, 2.341236961438818],
  ])("Ĉpk %f from %i units at %f confidence", (cpk, sampleSize, confidence, lower, upper) => {
    const interval = computeCpkConfidenceInterval({ cpk, sampleSize, confidence });
    expect(interval.lower).toBeCloseTo(lower, 6);
    expect(interval.upper).toBeCloseTo(upper, 6);
  });

  it("refuses fewer than 2 units or a confidence outside (0, 1), and keeps the lower end at 0 or above", () => {
    expect(() => computeCpkConfidenceInterval({ cpk: 1, sampleSize: 1, confidence: 0.95 })).toThrow(RangeError);
    expect(() => computeCpkConfidenceInterval({ cpk: 1, sampleSize: 10, confidence: 1 })).toThrow(RangeError);
    expect(computeCpkConfidenceInterval({ cpk: 0.1, sampleSize: 3, confidence: 0.95 }).lower).toBe(0);
  });
});
