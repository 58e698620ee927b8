import { describe, expect, it } from "vitest";
import * as ss from "simple-statistics";
import {
  computeMean,
  computeMedian,
  computeSampleStandardDeviation,
  summarizeSample,
} from "@/lib/stats/descriptive";

describe("descriptive statistics", () => {
  it.each([
    // n = 1: no spread can be estimated.
    { values: [7.25], mean: 7.25, sd: Number.NaN, median: 7.25, min: 7.25, max: 7.25 },
    // n = 2: s = |a − b|/√2.
    { values: [6.1, 6.5], mean: 6.3, sd: 0.4 / Math.SQRT2, median: 6.3, min: 6.1, max: 6.5 },
    // Classic textbook set 2,4,4,4,5,5,7,9: mean 5, population σ 2, sample s = √(32/7) = 2.13809.
    { values: [2, 4, 4, 4, 5, 5, 7, 9], mean: 5, sd: 2.13809, median: 4.5, min: 2, max: 9 },
  ])("$values", ({ values, mean, sd, median, min, max }) => {
    const summary = summarizeSample(values);
    expect(summary.n).toBe(values.length);
    expect(summary.mean).toBeCloseTo(mean, 12);
    if (Number.isNaN(sd)) expect(summary.standardDeviation).toBeNaN();
    else expect(summary.standardDeviation).toBeCloseTo(sd, 5);
    expect(summary.median).toBeCloseTo(median, 12);
    expect(summary.min).toBe(min);
    expect(summary.max).toBe(max);
  });

  it("refuses an empty sample and non-finite values", () => {
    expect(() => summarizeSample([])).toThrow(RangeError);
    expect(() => computeMean([1, Number.NaN])).toThrow(RangeError);
  });

  it("matches simple-statistics on random data", () => {
    // Cross-check against simple-statistics 7.12 (mean, sampleStandardDeviation, median).
    let seed = 12345;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    for (let trial = 0; trial < 20; trial++) {
      const n = 2 + Math.floor(random() * 40);
      const values = Float64Array.from({ length: n }, () => -7 + 3 * random() + random() * random());
      const plain = Array.from(values);
      expect(computeMean(values)).toBeCloseTo(ss.mean(plain), 12);
      expect(computeSampleStandardDeviation(values)).toBeCloseTo(ss.sampleStandardDeviation(plain), 12);
      expect(computeMedian(values)).toBeCloseTo(ss.median(plain), 12);
    }
  });
});
