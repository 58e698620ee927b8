import { describe, expect, it } from "vitest";
import { jStat } from "jstat";
import {
  computeToleranceFactorExact,
  computeToleranceFactorHowe,
  computeToleranceInterval,
} from "@/lib/stats/tolerance";

// n = 10, 95 % confidence, coverage 90/95/99 %: exact factors 2.8563 / 3.3934 / 4.4369 (computed by the exact method of NIST/SEMATECH e-Handbook §7.2.6.3);
// Berthouex & Brown, Statistics for Environmental Engineers, Table 21.1: 2.86 / 3.39 / 4.44 [source].
const n10 = [
  { coverage: 0.9, exact: 2.8563, table: 2.86 },
  { coverage: 0.95, exact: 3.3934, table: 3.39 },
  { coverage: 0.99, exact: 4.4369, table: 4.44 },
];

describe("two-sided normal tolerance factor", () => {
  it.each(n10)("exact (Odeh/Owen integral), n = 10, coverage $coverage", ({ coverage, exact, table }) => {
    const k = computeToleranceFactorExact({ sampleSize: 10, coverage, confidence: 0.95 });
    expect(k).toBeCloseTo(exact, 4);
    expect(k).toBeCloseTo(table, 2);
  });

  it.each(n10)("Howe's approximation (NIST/SEMATECH §7.2.6.3), n = 10, coverage $coverage", ({ coverage, exact }) => {
    const k = computeToleranceFactorHowe({ sampleSize: 10, coverage, confidence: 0.95 });
    // Howe's method is within 0.7 % of the exact factor at n = 10 (low at 90/95 %, high at 99 % coverage).
    expect(Math.abs(k - exact) / exact).toBeLessThan(0.007);
  });

  it("Howe's formula agrees with jstat quantiles", () => {
    // Cross-check: the same formula from jStat.normal.inv and jStat.chisquare.inv (jstat 1.9.6).
    for (const [n, coverage, confidence] of [
      [5, 0.9, 0.95],
      [10, 0.95, 0.95],
      [30, 0.99, 0.9],
      [100, 0.95, 0.99],
    ]) {
      const z = jStat.normal.inv((1 + coverage) / 2, 0, 1);
      const expected = z * Math.sqrt(((n - 1) * (1 + 1 / n)) / jStat.chisquare.inv(1 - confidence, n - 1));
      expect(computeToleranceFactorHowe({ sampleSize: n, coverage, confidence })).toBeCloseTo(expected, 8);
    }
  });

  it("exact and Howe converge for large n, and both approach z as n grows", () => {
    const exact = computeToleranceFactorExact({ sampleSize: 200, coverage: 0.95, confidence: 0.95 });
    const howe = computeToleranceFactorHowe({ sampleSize: 200, coverage: 0.95, confidence: 0.95 });
    expect(Math.abs(exact - howe) / exact).toBeLessThan(1e-3);
    expect(exact).toBeGreaterThan(1.959964);
    expect(exact).toBeLessThan(2.25);
  });

  it("builds mean ± k·s limits", () => {
    const interval = computeToleranceInterval({
      mean: 6.2,
      standardDeviation: 0.25,
      sampleSize: 10,
      coverage: 0.95,
      confidence: 0.95,
    });
    expect(interval.method).toBe("exact");
    expect(interval.lower).toBeCloseTo(6.2 - 3.3934 * 0.25, 4);
    expect(interval.upper).toBeCloseTo(6.2 + 3.3934 * 0.25, 4);
  });

  it("refuses a single unit", () => {
    expect(() => computeToleranceFactorHowe({ sampleSize: 1, coverage: 0.9, confidence: 0.95 })).toThrow(RangeError);
  });
});
