import { flatDriveCurves } from "./fixture";
import { describe, expect, it } from "vitest";
import { findSheetTemplate } from "@/templates";
import { assessConformity, controlChartData, findingsForSet, type WatchedSet } from "@/lib/sheet/conformity-watch";
import { buildVegaLiteSpec } from "@/lib/charts";
import { doublerCandidateAndRelease } from "./released-fixture";

// The invented doubler released as revision C guarantees conversion loss ≤ 12 dB at 2 GHz in and
// T_A 25 °C (ten units, U = 0.4 dB, guarded acceptance) and ≤ 11.5 dB at 3 GHz; fundamental
// suppression ≥ 27 dBc and third-harmonic suppression ≥ 20 dBc at 2 GHz, and residual phase noise at
// 10 kHz offset from a 4 GHz carrier.
const { released } = doublerCandidateAndRelease();
const template = findSheetTemplate("frequency-multiplier")!;
const group2GHz = released.statistics.groups.find((g) => g.groupId === "conversion-loss-at-drive:drive=10;inputFrequencyHz=2000000000;temperatureC=25")!;
const centre = group2GHz.mean.value!;
const sigma = group2GHz.standardDeviation.value!;

/** A drive sweep of a new unit that yields only the optimum conversion loss at 2 GHz, 25 °C. */
function newSet(index: number, conversionLossDb: number): WatchedSet {
  return {
    id: 1000 + index,
    kind: "drive-sweep",
    serial: `HX-9${String(index).padStart(3, "0")}`,
    lot: "L9",
    temperatureC: 25,
    measuredOn: "2026-12-10",
    parameters: [{ name: "conversion-loss", value: conversionLossDb, unit: "dB", conditions: { inputFrequencyHz: 2e9, drive: "optimum" } }],
    curves: flatDriveCurves({ conversionLossDb }),
  };
}
/** The formatter puts a no-break space between a value and its unit. */
const plain = (text: string) => text.replace(/\u00a0/g, " ");
const setsAt = (zs: number[]) => zs.map((z, i) => newSet(i, centre + z * sigma));
const assess = (sets: WatchedSet[]) => assessConformity({ model: released, template, sets });
const findingsPerSet = (sets: WatchedSet[]) => {
  const a = assess(sets);
  return sets.map((s) => findingsForSet(a, s.id));
};

describe("the conformity watch against a released sheet", () => {
  it("reads the release's guaranteed limits, its decision rule and its key conditions", () => {
    const a = assess([]);
    expect(a.groups.map((g) => g.groupId)).toEqual([
      "conversion-loss-at-drive:drive=10;inputFrequencyHz=2000000000;temperatureC=25",
      "conversion-loss-at-drive:drive=10;inputFrequencyHz=3000000000;temperatureC=25",
      "fundamental-suppression:drive=10;inputFrequencyHz=2000000000;order=1;temperatureC=25",
      "third-harmonic-suppression:drive=10;inputFrequencyHz=2000000000;order=3;temperatureC=25",
      "residual-phase-noise:carrierFrequencyHz=4000000000;offsetHz=10000;temperatureC=25",
    ]);
    const cl = a.groups[0];
    // Guarded acceptance, ILAC-G8:09/2019 §4.2.2 with w = U: acceptance limit = 12 dB − 0.4 dB = 11.6 dB.
    expect(cl).toMatchObject({ max: 12, min: null, decisionRule: "guard-band", expandedUncertainty: 0.4 });
    expect(cl.acceptanceUpper).toBeCloseTo(11.6, 12);
    // The key condition of conversion loss: of its two guaranteed groups (ten units each), the first.
    expect(a.charts.map((c) => c.groupId)).toEqual([
      cl.groupId,
      "fundamental-suppression:drive=10;inputFrequencyHz=2000000000;order=1;temperatureC=25",
      "third-harmonic-suppression:drive=10;inputFrequencyHz=2000000000;order=3;temperatureC=25",
      "residual-phase-noise:carrierFrequencyHz=4000000000;offsetHz=10000;temperatureC=25",
    ]);
    // Centre and sigma are the release's mean and s (n − 1) as the annex states them.
    expect(a.charts[0]).toMatchObject({ centre, sigma, releaseUnitCount: 10 });
    expect(a.charts[0].upperControlLimit).toBeCloseTo(centre + 3 * sigma, 12);
  });

  it("raises nothing on in-control units", () => {
    const sets = setsAt([0.3, -0.5, -0.2, 0.8, 0.1, -0.9, -0.4, 0.4, 1.3, -0.2, -0.7, 0.6]);
    expect(findingsPerSet(sets).flat()).toEqual([]);
    const cl = assess(sets).groups[0];
    expect([cl.insideCount, cl.outsideCount]).toEqual([12, 0]);
  });

  it("one unit outside the guard-banded limit: a finding for that unit alone", () => {
    // 11.7 dB is inside the 12 dB limit but outside the 11.6 dB acceptance limit: it fails under w = U.
    const sets = [...setsAt([0.2, -0.3]), newSet(2, 11.7), ...setsAt([0.1]).map((s) => ({ ...s, id: 2000, serial: "HX-9100" }))];
    const found = findingsPerSet(sets);
    expect(found[0]).toEqual([]);
    expect(found[3]).toEqual([]);
    const kinds = found[2].map((f) => (f.kind === "run-rule" ? `test ${f.rule}` : f.kind));
    // The same unit is also 5σ above the release mean: Nelson's test 1 signals with it.
    expect(kinds).toEqual(["outside-limit", "test 1"]);
    expect(plain(found[2][0].message)).toBe(
      "Unit HX-9002 (set #1002): Conversion loss at Frequency 2 GHz in, Drive +10 dBm per port, T_A 25 °C reads 11.7 dB, outside the guaranteed max 12 dB (accepted up to 11.6 dB, guarded acceptance w = U).",
    );
    expect(assess(sets).groups[0]).toMatchObject({ insideCount: 3, outsideCount: 1 });
    // 11.5 dB is accepted (below 11.6 dB).
    expect(assess([newSet(0, 11.5)]).groups[0].outsideCount).toBe(0);
  });

  it("a run of nine on one side of the release mean signals at the ninth unit", () => {
    const found = findingsPerSet(setsAt([0.4, 0.6, 0.2, 0.9, 0.5, 0.3, 0.7, 0.4, 0.6]));
    expect(found.slice(0, 8).flat()).toEqual([]);
    expect(found[8].map((f) => f.kind === "run-rule" && f.rule)).toEqual([2]);
    expect(plain(found[8][0].message)).toMatch(/^Conversion loss at Frequency 2 GHz in, Drive \+10 dBm per port, T_A 25 °C: Nelson test 2, nine points in a row on one side of the centre line, ends at unit HX-9008 \(set #1008\)/);
  });

  it("a trend of six signals at the sixth unit", () => {
    const found = findingsPerSet(setsAt([-1.2, -0.8, -0.3, 0.1, 0.6, 1.1]));
    expect(found.slice(0, 5).flat()).toEqual([]);
    expect(found[5].map((f) => f.kind === "run-rule" && f.rule)).toEqual([3]);
  });

  it("counts a set that measured nothing of a group nowhere", () => {
    const other: WatchedSet = { ...newSet(0, 10), parameters: [{ name: "conversion-loss", value: 30, unit: "dB", conditions: { inputFrequencyHz: 1e9, drive: "optimum" } }], curves: flatDriveCurves({ conversionLossDb: 30 }) };
    const a = assess([other]);
    expect(a.groups.every((g) => g.units.length === 0)).toBe(true);
    expect(findingsForSet(a, other.id)).toEqual([]);
  });

  it("draws the chart through lib/charts: points, centre, 3σ limits, the guaranteed limit and the signals", () => {
    const chart = assess(setsAt([0.4, 0.6, 0.2, 0.9, 0.5, 0.3, 0.7, 0.4, 0.6])).charts[0];
    const data = controlChartData(chart);
    expect(data.traces[0].points.map((p) => p[0])).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
    expect(data.rules!.map((r) => r.label)).toEqual(["UCL (+3σ)", "Centre (release mean)", "LCL (−3σ)", "Guaranteed max"]);
    expect(data.rules![0].y).toBeCloseTo(centre + 3 * sigma, 12);
    expect(data.markers).toEqual([{ x: 9, y: chart.points[8].value, label: "Nelson test 2", inCorner: false }]);
    const built = buildVegaLiteSpec(data, { medium: "screen", width: "container", height: 240, points: true });
    expect(built?.unitCount).toBe(1);
    expect(built?.markerCount).toBe(1);
  });
});
