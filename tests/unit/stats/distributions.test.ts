import { describe, expect, it } from "vitest";
import { jStat } from "jstat";
import * as ss from "simple-statistics";
import {
  computeChiSquareQuantile,
  computeChiSquareSurvival,
  computeLogGamma,
  computeRegularizedGammaP,
} from "@/lib/stats/gamma";
import { computeNormalCdf, computeNormalQuantile } from "@/lib/stats/normal";

describe("normal distribution", () => {
  // Abramowitz & Stegun, Handbook of Mathematical Functions, ch. 26 (percentage points of the normal distribution).
  it.each([
    { p: 0.5, z: 0 },
    { p: 0.95, z: 1.644853627 },
    { p: 0.975, z: 1.959963985 },
    { p: 0.995, z: 2.575829304 },
    { p: 0.999, z: 3.090232306 },
    { p: 1e-9, z: -5.997807015 },
  ])("Φ⁻¹($p) = $z", ({ p, z }) => {
    expect(computeNormalQuantile(p)).toBeCloseTo(z, 8);
    expect(computeNormalCdf(z)).toBeCloseTo(p, 9);
  });

  it("round-trips Φ(Φ⁻¹(p)) to near machine precision", () => {
    for (const p of [1e-12, 1e-5, 0.001, 0.02425, 0.1, 0.3, 0.5, 0.7, 0.97575, 0.999]) {
      expect(Math.abs(computeNormalCdf(computeNormalQuantile(p)) - p) / Math.min(p, 1 - p)).toBeLessThan(1e-12);
    }
  });

  it("matches jstat and simple-statistics on random probabilities", () => {
    // Cross-check: jStat.normal.inv (jstat 1.9.6) and probit (simple-statistics 7.12).
    let seed = 987654;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    for (let trial = 0; trial < 200; trial++) {
      const p = 0.0005 + 0.999 * random();
      const z = computeNormalQuantile(p);
      expect(z).toBeCloseTo(jStat.normal.inv(p, 0, 1), 8);
      // simple-statistics' probit rests on an approximate inverse erf: within 5e-3 in z for 0.01 ≤ p ≤ 0.99.
      if (p >= 0.01 && p <= 0.99) expect(Math.abs(z - ss.probit(p))).toBeLessThan(5e-3);
      expect(computeNormalCdf(z)).toBeCloseTo(jStat.normal.cdf(z, 0, 1), 12);
    }
  });

  it("refuses probabilities outside [0, 1]", () => {
    expect(() => computeNormalQuantile(1.5)).toThrow(RangeError);
  });
});

describe("gamma and chi-square", () => {
  it("ln Γ at known points", () => {
    // Γ(5) = 24, Γ(½) = √π, Γ(10.5) = 1133278.3889487856 (Abramowitz & Stegun, ch. 6).
    expect(computeLogGamma(5)).toBeCloseTo(Math.log(24), 13);
    expect(computeLogGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 13);
    expect(computeLogGamma(10.5)).toBeCloseTo(Math.log(1133278.3889487856), 12);
  });

  it("P(1, x) = 1 − e^(−x) (exponential distribution)", () => {
    for (const x of [0.01, 0.5, 2, 10, 30]) expect(computeRegularizedGammaP(1, x)).toBeCloseTo(1 - Math.exp(-x), 14);
  });

  // Lower-tail χ² quantiles: NIST/SEMATECH e-Handbook §1.3.6.7.4 (critical values of the chi-square distribution).
  it.each([
    { p: 0.05, dof: 9, x: 3.325 },
    { p: 0.95, dof: 9, x: 16.919 },
    { p: 0.05, dof: 1, x: 0.004 },
    { p: 0.95, dof: 1, x: 3.841 },
    { p: 0.05, dof: 29, x: 17.708 },
    { p: 0.99, dof: 100, x: 135.807 },
  ])("χ²($p, $dof) = $x", ({ p, dof, x }) => {
    expect(computeChiSquareQuantile(p, dof)).toBeCloseTo(x, 3);
    expect(computeChiSquareSurvival(computeChiSquareQuantile(p, dof), dof)).toBeCloseTo(1 - p, 12);
  });

  it("matches jstat's chisquare.inv and gammaln on random arguments", () => {
    // Cross-check: jStat.chisquare.inv and jStat.gammaln (jstat 1.9.6).
    let seed = 4242;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    for (let trial = 0; trial < 200; trial++) {
      const dof = 1 + Math.floor(random() * 60);
      const p = 0.001 + 0.998 * random();
      const ours = computeChiSquareQuantile(p, dof);
      expect(Math.abs(ours - jStat.chisquare.inv(p, dof)) / ours).toBeLessThan(1e-8);
      expect(computeLogGamma(dof / 2 + 0.3)).toBeCloseTo(jStat.gammaln(dof / 2 + 0.3), 10);
    }
  });
});
