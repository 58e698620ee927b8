import { describe, expect, it } from "vitest";
import { jStat } from "jstat";
import * as ss from "simple-statistics";
import {
  computeMeanConfidenceInterval,
  computeRegularizedBeta,
  computeStudentTCdf,
  computeStudentTQuantile,
} from "@/lib/stats/student-t";

describe("Student t distribution", () => {
  // Upper critical values t_{1−α, ν}: NIST/SEMATECH e-Handbook §1.3.6.7.2 (critical values of Student's t).
  it.each([
    { p: 0.975, dof: 1, t: 12.706 },
    { p: 0.975, dof: 9, t: 2.262 },
    { p: 0.95, dof: 9, t: 1.833 },
    { p: 0.995, dof: 30, t: 2.75 },
    { p: 0.975, dof: 100, t: 1.984 },
  ])("t($p, $dof) = $t", ({ p, dof, t }) => {
    expect(computeStudentTQuantile(p, dof)).toBeCloseTo(t, 3);
    expect(computeStudentTQuantile(1 - p, dof)).toBeCloseTo(-t, 3);
  });

  it("ν = 1 is the Cauchy distribution: F(t) = ½ + atan(t)/π", () => {
    for (const t of [-20, -1, 0.3, 5]) expect(computeStudentTCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 13);
  });

  it("I_x(a, 1) = x^a", () => {
    for (const x of [0.1, 0.5, 0.9]) expect(computeRegularizedBeta(x, 2.5, 1)).toBeCloseTo(x ** 2.5, 13);
  });

  it("matches jstat's studentt.inv and studentt.cdf on random arguments", () => {
    // Cross-check: jStat.studentt (jstat 1.9.6).
    let seed = 777;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    for (let trial = 0; trial < 200; trial++) {
      const dof = 1 + Math.floor(random() * 50);
      const p = 0.001 + 0.998 * random();
      const t = computeStudentTQuantile(p, dof);
      expect(Math.abs(t - jStat.studentt.inv(p, dof))).toBeLessThan(1e-7 * Math.max(1, Math.abs(t)));
      expect(computeStudentTCdf(t, dof)).toBeCloseTo(p, 12);
    }
  });

  it("gives the mean's confidence interval, matching simple-statistics for the mean and spread", () => {
    const values = [6.1, 6.4, 6.3, 6.7, 6.2, 6.5, 6.0, 6.6, 6.4, 6.3];
    const interval = computeMeanConfidenceInterval(values);
    // Half-width t_{0.975, 9}·s/√n with t = 2.262 (NIST table above); mean and s from simple-statistics.
    const halfWidth = (2.2622 * ss.sampleStandardDeviation(values)) / Math.sqrt(values.length);
    expect(interval.mean).toBeCloseTo(ss.mean(values), 12);
    expect(interval.upper - interval.mean).toBeCloseTo(halfWidth, 4);
  });
});
