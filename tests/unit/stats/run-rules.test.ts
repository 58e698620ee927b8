import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { evaluateRunRules, runRuleNumbers, type RunRuleNumber } from "@/lib/stats/run-rules";

// The tests' definitions are those of Nelson, L. S. (1984), "The Shewhart Control Chart — Tests for
// Special Causes", Journal of Quality Technology 16(4), 237–239 (tests 1–8, zones of one sigma), whose
// tests 1, 5 and 6 are rules 1–3 of the Western Electric Statistical Quality Control Handbook (1956).
// The sequences below are built in sigma units about a centre of 0 (centre 10, sigma 0.5 in the last
// block, to check the scaling). No Python package implementing these tests is installed on this
// machine (numpy and scipy are, but have none), so the incremental implementation is also compared
// with a direct window-by-window reading of the published definitions on random sequences.

const unitLimits = { centre: 0, sigma: 1 };
const rulesFired = (values: number[], limits = unitLimits) => [...new Set(evaluateRunRules(values, limits).map((s) => s.rule))].sort();

/** Alternates small values inside 1σ about the centre with no pattern of any test. */
const inControl = [0.3, -0.5, -0.2, 0.8, 0.1, -0.9, -0.4, 0.4, 1.3, -0.2, -0.7, 0.6, 0.05, 0.2, -1.1, 0.9, -0.4, -0.3, 1.6, 0.5, -0.8, -0.1, 1.2, -1.4];

describe("Nelson's tests on constructed sequences", () => {
  it("finds nothing on in-control data", () => {
    expect(evaluateRunRules(inControl, unitLimits)).toEqual([]);
  });

  it("test 1: one unit beyond 3σ, at that point only", () => {
    const values = [0.2, -0.4, 0.5, 3.4, 0.1, -0.3];
    expect(evaluateRunRules(values, unitLimits)).toEqual([{ rule: 1, index: 3, points: [3] }]);
    // Exactly 3σ is not beyond (the test asks for beyond the control limit).
    expect(rulesFired([0.2, -3, 0.5])).toEqual([]);
    expect(rulesFired([0.2, -3.01, 0.5])).toEqual([1]);
  });

  it("test 2: a run of nine on one side fires at the ninth point, not at the eighth", () => {
    const eight = [-0.2, 0.3, 0.5, 0.2, 0.7, 0.1, 0.4, 0.6, 0.35];
    expect(rulesFired(eight)).toEqual([]);
    const nine = [...eight, 0.45];
    const signals = evaluateRunRules(nine, unitLimits);
    expect(signals).toEqual([{ rule: 2, index: 9, points: [1, 2, 3, 4, 5, 6, 7, 8, 9] }]);
    // A point on the centre line breaks the run.
    expect(rulesFired([0.3, 0.5, 0.2, 0.7, 0, 0.4, 0.6, 0.35, 0.45, 0.2])).toEqual([]);
    // Below the centre line too.
    expect(rulesFired([-0.3, -0.5, -0.2, -0.7, -0.1, -0.4, -0.6, -0.35, -0.45])).toEqual([2]);
  });

  it("test 3: a trend of six fires, a trend of five does not, a tie breaks it", () => {
    expect(rulesFired([-0.9, -0.5, -0.1, 0.2, 0.6])).toEqual([]);
    expect(evaluateRunRules([-0.9, -0.5, -0.1, 0.2, 0.6, 0.8], unitLimits)).toEqual([{ rule: 3, index: 5, points: [0, 1, 2, 3, 4, 5] }]);
    expect(rulesFired([0.8, 0.6, 0.2, -0.1, -0.5, -0.9])).toEqual([3]);
    expect(rulesFired([-0.9, -0.5, -0.1, -0.1, 0.2, 0.6, 0.8])).toEqual([]);
  });

  it("test 4: fourteen points alternating up and down", () => {
    const alternating = Array.from({ length: 14 }, (_, i) => (i % 2 === 0 ? 0.4 : -0.4) + i * 0.001);
    expect(rulesFired(alternating.slice(0, 13))).toEqual([]);
    expect(evaluateRunRules(alternating, unitLimits).filter((s) => s.rule === 4)).toEqual([{ rule: 4, index: 13, points: Array.from({ length: 14 }, (_, i) => i) }]);
  });

  it("test 5: two of three beyond 2σ on the same side", () => {
    expect(evaluateRunRules([0.1, 2.3, 0.4, 2.2, 0.1], unitLimits)).toEqual([{ rule: 5, index: 3, points: [1, 3] }]);
    // Opposite sides do not count together.
    expect(rulesFired([0.1, 2.3, -2.2, 0.1])).toEqual([]);
    // Two beyond with one between, three apart, is not two of three.
    expect(rulesFired([2.3, 0.1, 0.2, 2.2])).toEqual([]);
  });

  it("test 6: four of five beyond 1σ on the same side", () => {
    expect(evaluateRunRules([0.1, 1.2, 1.5, 0.3, 1.1, 1.8], unitLimits)).toEqual([{ rule: 6, index: 5, points: [1, 2, 4, 5] }]);
    expect(rulesFired([0.1, 1.2, 1.5, 0.3, -1.1, 1.8])).toEqual([]);
  });

  it("test 7: fifteen points in a row within 1σ", () => {
    const hugging = Array.from({ length: 15 }, (_, i) => (i % 3 === 0 ? 0.2 : i % 3 === 1 ? -0.3 : 0.1));
    expect(rulesFired(hugging.slice(0, 14))).toEqual([]);
    expect(rulesFired(hugging)).toEqual([7]);
  });

  it("test 8: eight points in a row beyond 1σ, either side, none within", () => {
    const mixture = [1.4, -1.3, -1.6, 1.2, 1.5, -1.2, 1.7, -1.4];
    expect(rulesFired(mixture.slice(0, 7))).toEqual([]);
    expect(evaluateRunRules(mixture, unitLimits).map((s) => s.rule)).toEqual([8]);
  });

  it("scales by the centre and sigma given", () => {
    // Nine points of 10.2 are 0.4σ above a centre of 10 with σ = 0.5: test 2; 11.6 is 3.2σ: test 1.
    expect(rulesFired(Array(9).fill(10.2), { centre: 10, sigma: 0.5 })).toEqual([2]);
    expect(rulesFired([10, 11.6], { centre: 10, sigma: 0.5 })).toEqual([1]);
  });

  it("refuses a sigma that cannot scale a chart and points that are not numbers", () => {
    expect(() => evaluateRunRules([1], { centre: 0, sigma: 0 })).toThrow(/positive, finite sigma/);
    expect(() => evaluateRunRules([1, Number.NaN], unitLimits)).toThrow(/Point 2/);
  });
});

/** Direct reading of each definition: does the pattern end at point i? */
function definitionHolds(rule: RunRuleNumber, z: number[], v: number[], i: number): boolean {
  const window = (n: number) => (i - n + 1 >= 0 ? z.slice(i - n + 1, i + 1) : null);
  const diffs = (n: number) => (i - n + 1 >= 0 ? v.slice(i - n + 1, i + 1).slice(1).map((x, k) => x - v[i - n + 1 + k]) : null);
  switch (rule) {
    case 1:
      return Math.abs(z[i]) > 3;
    case 2: {
      const w = window(9);
      return !!w && (w.every((x) => x > 0) || w.every((x) => x < 0));
    }
    case 3: {
      const d = diffs(6);
      return !!d && (d.every((x) => x > 0) || d.every((x) => x < 0));
    }
    case 4: {
      const d = diffs(14);
      return !!d && d.every((x, k) => x !== 0 && (k === 0 || Math.sign(x) === -Math.sign(d[k - 1])));
    }
    case 5:
    case 6: {
      const [n, need, beyond] = rule === 5 ? [3, 2, 2] : [5, 4, 1];
      const w = z.slice(Math.max(0, i - n + 1), i + 1);
      return [1, -1].some((s) => s * z[i] > beyond && w.filter((x) => s * x > beyond).length >= need);
    }
    case 7: {
      const w = window(15);
      return !!w && w.every((x) => Math.abs(x) < 1);
    }
    case 8: {
      const w = window(8);
      return !!w && w.every((x) => Math.abs(x) > 1);
    }
  }
}

describe("the incremental evaluation against the definitions read window by window", () => {
  it("signals exactly where a definition holds, on random sequences", () => {
    // Values on a 0.25σ grid make ties, points on the centre line and long runs common.
    const sequence = fc.array(fc.integer({ min: -14, max: 14 }).map((k) => k / 4), { minLength: 1, maxLength: 60 });
    fc.assert(
      fc.property(sequence, (values) => {
        const found = new Set(evaluateRunRules(values, unitLimits).map((s) => `${s.rule}@${s.index}`));
        for (let i = 0; i < values.length; i++) {
          for (const rule of runRuleNumbers) {
            expect(found.has(`${rule}@${i}`), `test ${rule} at point ${i + 1} of ${values.join(", ")}`).toBe(definitionHolds(rule, values, values, i));
          }
        }
      }),
      { seed: 19840401, numRuns: 400 },
    );
  });

  it("sees tests 2 and 3 on sequences made to hold them", () => {
    // Runs of 9 and trends of 6 are rare in uniform data: build them on purpose.
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 11 }), { minLength: 9, maxLength: 9 }), fc.boolean(), (ks, below) => {
        const run = ks.map((k) => ((below ? -1 : 1) * k) / 4);
        expect(evaluateRunRules(run, unitLimits).some((s) => s.rule === 2 && s.index === 8)).toBe(true);
        const trend = [...ks.slice(0, 6)].sort((a, b) => a - b).map((k, j) => k + j * 12);
        expect(evaluateRunRules(trend.map((t) => t / 100), unitLimits).some((s) => s.rule === 3 && s.index === 5)).toBe(true);
      }),
      { seed: 1956, numRuns: 200 },
    );
  });
});
