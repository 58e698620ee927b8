import { describe, expect, it } from "vitest";
import { combineUncertainty, computeStandardUncertainty } from "@/lib/stats/uncertainty";

describe("GUM uncertainty budget", () => {
  // Divisors from JCGM 100:2008 §4.3.7 (rectangular √3), §4.3.9 (triangular √6); U-shaped √2 (EA-4/02).
  it.each([
    { distribution: "rectangular" as const, bound: 0.3, u: 0.3 / Math.sqrt(3) },
    { distribution: "u-shaped" as const, bound: 0.172, u: 0.172 / Math.SQRT2 },
    { distribution: "triangular" as const, bound: 0.6, u: 0.6 / Math.sqrt(6) },
    { distribution: "normal" as const, bound: 0.05, u: 0.05 },
  ])("$distribution bound $bound", ({ distribution, bound, u }) => {
    expect(computeStandardUncertainty({ name: "x", distribution, bound })).toBeCloseTo(u, 14);
  });

  it("divides a normal bound by its stated coverage factor", () => {
    expect(computeStandardUncertainty({ name: "cal", distribution: "normal", bound: 0.1, coverageFactor: 2 })).toBe(0.05);
  });

  it("combines by root-sum-square (GUM eq. 10) and expands with k = 2", () => {
    // Computed per GUM (JCGM 100:2008) eq. 10, rectangular a/√3, U-shaped a/√2: 0.3 dB rectangular, 0.172 dB U-shaped, 0.05 dB normal → u_c 0.2175 dB, U 0.435 dB.
    const budget = combineUncertainty([
      { name: "power sensor", bound: 0.3, distribution: "rectangular" },
      { name: "mismatch", bound: 0.172, distribution: "u-shaped" },
      { name: "repeatability", bound: 0.05, distribution: "normal" },
    ]);
    expect(budget.combinedStandardUncertainty).toBeCloseTo(0.2175, 4);
    expect(budget.expandedUncertainty).toBeCloseTo(0.435, 3);
    expect(budget.coverageFactor).toBe(2);
    expect(budget.contributions.map((c) => c.name)).toEqual(["power sensor", "mismatch", "repeatability"]);
  });

  it("applies sensitivity coefficients", () => {
    // c = −2 on u = 0.1 contributes 0.2; with a second 0.15 term: √(0.04 + 0.0225) = 0.25.
    const budget = combineUncertainty([
      { name: "a", bound: 0.1, distribution: "normal", sensitivity: -2 },
      { name: "b", bound: 0.15, distribution: "normal" },
    ]);
    expect(budget.combinedStandardUncertainty).toBeCloseTo(0.25, 14);
  });
});
