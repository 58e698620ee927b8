import { describe, expect, it } from "vitest";
import reference from "./reference/skrf-rf.json";
import { type Complex, computeComplexAngleDeg } from "@/lib/rf/complex";
import { computeAmplitudeBalanceDb, computePhaseBalanceDeg } from "@/lib/rf/balance";
import { computeReflectionCoefficient, computeTransmissionDb, computeVswr, summarizePortMatch } from "@/lib/rf/mismatch";

// Reference figures from scikit-rf 0.15 (Debian python3-scikit-rf): s_db, s_deg, s_vswr, zl_2_Gamma0,
// Gamma0_2_swr. Regenerate with `/usr/bin/python3 scripts/reference/skrf-rf.py`.

interface ReferencePoint {
  frequencyHz: number;
  sRe: number[][];
  sIm: number[][];
  sDb: number[][];
  sDeg: number[][];
  vswr: number[];
  returnLossDb: number[];
  mismatchLossDb: number[];
}

const networks = reference.networks as { name: string; ports: number; points: ReferencePoint[] }[];

function entry(point: ReferencePoint, i: number, j: number): Complex {
  return { re: point.sRe[i][j], im: point.sIm[i][j] };
}

describe("S-parameter figures against scikit-rf", () => {
  it("the reference file holds the expected networks", () => {
    expect(reference.skrfVersion).toMatch(/^0\.15\./);
    expect(networks.map((n) => n.ports)).toEqual([2, 4, 3]);
  });

  describe.each(networks)("$name", ({ ports, points }) => {
    it.each(points)("port match at $frequencyHz Hz", (point) => {
      for (let i = 0; i < ports; i++) {
        const match = summarizePortMatch(entry(point, i, i));
        expect(match.returnLossDb).toBeCloseTo(point.returnLossDb[i], 10);
        expect(match.vswr).toBeCloseTo(point.vswr[i], 10);
        expect(match.mismatchLossDb).toBeCloseTo(point.mismatchLossDb[i], 10);
      }
    });

    it.each(points)("transmission dB and phase at $frequencyHz Hz", (point) => {
      for (let i = 0; i < ports; i++) {
        for (let j = 0; j < ports; j++) {
          if (i === j) continue;
          expect(computeTransmissionDb(entry(point, i, j))).toBeCloseTo(point.sDb[i][j], 10);
          expect(computeComplexAngleDeg(entry(point, i, j))).toBeCloseTo(point.sDeg[i][j], 10);
        }
      }
    });
  });

  it.each(networks[1].points)("hybrid balance at $frequencyHz Hz from skrf's s_db and s_deg", (point) => {
    // Through S21 (index [1][0]) and coupled S31 ([2][0]); the ideal hybrid has ∠S21 − ∠S31 = 90°.
    const through = entry(point, 1, 0);
    const coupled = entry(point, 2, 0);
    expect(computeAmplitudeBalanceDb(through, coupled)).toBeCloseTo(point.sDb[1][0] - point.sDb[2][0], 10);
    const skrfDifferenceDeg = point.sDeg[1][0] - point.sDeg[2][0] - 90;
    const wrapped = skrfDifferenceDeg - 360 * Math.round(skrfDifferenceDeg / 360);
    expect(computePhaseBalanceDeg({ outputA: through, outputB: coupled, nominalPhaseDifferenceDeg: 90 })).toBeCloseTo(
      wrapped,
      10,
    );
    expect(Math.abs(wrapped)).toBeLessThan(2);
  });

  it.each(reference.loads)("Γ and VSWR of $loadRe + j$loadIm Ω", (load) => {
    const gamma = computeReflectionCoefficient({ re: load.loadRe, im: load.loadIm }, load.z0Ohm);
    expect(gamma.re).toBeCloseTo(load.gammaRe, 12);
    expect(gamma.im).toBeCloseTo(load.gammaIm, 12);
    expect(computeVswr(Math.hypot(gamma.re, gamma.im))).toBeCloseTo(load.vswr, 10);
  });
});
