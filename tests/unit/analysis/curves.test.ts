import { describe, expect, it } from "vitest";
import { decimateSeries, parameterCatalog } from "@/lib/analysis";
import { analyzeExample } from "./helpers";
import { readdirSync } from "node:fs";
import { EXAMPLES } from "./helpers";

describe("curve decimation", () => {
  const n = 100_000;
  const xs = Array.from({ length: n }, (_, i) => 1 + i);
  const ys = xs.map((x) => Math.sin(x / 500));
  ys[31_337] = 50;
  ys[77_777] = -50;

  it("keeps at most the requested points, the ends, the extremes and forced indices", () => {
    const points = decimateSeries(xs, ys, { maxPoints: 2000, keep: [12_345] });
    expect(points.length).toBeLessThanOrEqual(2000);
    expect(points.length).toBeGreaterThan(1000);
    expect(points[0]).toEqual([1, ys[0]]);
    expect(points[points.length - 1]).toEqual([n, ys[n - 1]]);
    expect(points).toContainEqual([31_338, 50]);
    expect(points).toContainEqual([77_778, -50]);
    expect(points).toContainEqual([12_346, ys[12_345]]);
    for (let i = 1; i < points.length; i++) expect(points[i][0]).toBeGreaterThan(points[i - 1][0]);
  });

  it("leaves short series alone", () => {
    expect(decimateSeries([1, 2, 3], [4, 5, 6], { maxPoints: 10 })).toEqual([
      [1, 4],
      [2, 5],
      [3, 6],
    ]);
  });
});

describe("every example", () => {
  for (const name of readdirSync(EXAMPLES)) {
    it(`${name}: every parameter is in the catalog with its unit`, () => {
      const result = analyzeExample(name);
      expect(result.parameters.length).toBeGreaterThan(0);
      for (const parameter of result.parameters) {
        const entry = parameterCatalog[parameter.name as keyof typeof parameterCatalog];
        expect(entry, parameter.name).toBeDefined();
        expect(parameter.unit).toBe(entry.unit);
        expect(parameter.value === null || Number.isFinite(parameter.value)).toBe(true);
      }
      for (const curve of result.curves) for (const s of curve.series) expect(s.points.length).toBeLessThanOrEqual(2000);
    });
  }
});
