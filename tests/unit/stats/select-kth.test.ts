import { describe, expect, it } from "vitest";
import * as ss from "simple-statistics";
import { medianInPlace, selectKth } from "@/lib/stats/select-kth";
import { mulberry32 } from "@/lib/stats/seeded-random";

describe("selection without a full sort", () => {
  // Seeded arrays of 1 to 400 values, some on a coarse grid (many ties), some already sorted or reversed.
  const random = mulberry32(7);
  const arrays = Array.from({ length: 200 }, (_, n) => {
    const size = 1 + Math.floor(random() * 400);
    const values = Array.from({ length: size }, () => (n % 3 === 0 ? Math.round(random() * 5) : random() * 200 - 100));
    if (n % 7 === 1) values.sort((a, b) => a - b);
    if (n % 7 === 2) values.sort((a, b) => b - a);
    return values;
  });

  it.each(arrays.map((values, n) => [n, values] as const))("array %i: every order statistic, and the median as simple-statistics computes it", (_, values) => {
    const sorted = [...values].sort((a, b) => a - b);
    for (const k of new Set([0, values.length >> 1, values.length - 1, Math.floor(values.length / 3)])) {
      const copy = Float64Array.from(values);
      expect(selectKth(copy, copy.length, k)).toBe(sorted[k]);
      for (let j = 0; j < k; j++) expect(copy[j]).toBeLessThanOrEqual(sorted[k]);
      for (let j = k + 1; j < copy.length; j++) expect(copy[j]).toBeGreaterThanOrEqual(sorted[k]);
    }
    // simple-statistics 7 (npm) sorts and takes the middle or the mean of the two middles.
    expect(medianInPlace(Float64Array.from(values), values.length)).toBe(ss.median(values));
  });
});
