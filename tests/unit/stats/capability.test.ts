import { describe, expect, it } from "vitest";
import { computeCapability } from "@/lib/stats/capability";

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
