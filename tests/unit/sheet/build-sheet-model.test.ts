import { describe, expect, it } from "vitest";
import { buildSheetModel, serializeSheetModel, type SheetInput } from "@/lib/sheet";
import { computeToleranceInterval } from "@/lib/stats";
import { readAtStatedDrive } from "@/lib/sheet/stated-drive";
import { findSheetTemplate } from "@/templates";
import { flatDriveCurves, loadDoublerInput, shuffled } from "./fixture";

const CL_2GHZ = "drive=10;inputFrequencyHz=2000000000;temperatureC=25";
const CL_3GHZ = "drive=10;inputFrequencyHz=3000000000;temperatureC=25";

/** The fixture's values for one group, read straight from the sets (one per unit, 25 °C sets only). */
function rawValues(input: SheetInput, name: string, conditions: Record<string, number | string>, temperatureC: number): number[] {
  const values: number[] = [];
  for (const set of input.approvedSets) {
    if (set.temperatureC !== temperatureC) continue;
    for (const p of set.parameters) {
      if (p.name !== name || p.value === null) continue;
      if (Object.entries(conditions).every(([k, v]) => p.conditions[k] === v)) values.push(p.value);
    }
  }
  return values;
}

describe("buildSheetModel on the doubler fixture", () => {
  const input = loadDoublerInput();
  const model = buildSheetModel(input);
  const group = (rowId: string, key: string) => {
    const found = model.statistics.groups.find((g) => g.rowId === rowId && g.conditionsKey === key);
    if (!found) throw new Error(`no group ${rowId} ${key}`);
    return found;
  };

  it("computes n, mean, s, median, min, max by hand", () => {
    // Each unit's figure at +10 dBm per port, read off its sweep (checked against numpy.interp in stated-drive.test.ts).
    const clRow = findSheetTemplate("frequency-multiplier")!.specifications.rows.find((r) => r.id === "conversion-loss-at-drive")!;
    const atDrive = { ...input, approvedSets: input.approvedSets.map((set) => ({ ...set, parameters: readAtStatedDrive(clRow, set).parameters })) };
    const values = rawValues(atDrive, "conversion-loss", { drive: 10, inputFrequencyHz: 2e9 }, 25);
    expect(values).toHaveLength(10);
    const n = values.length;
    const mean = values.reduce((a, b) => a + b, 0) / n;
    const s = Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (n - 1));
    const sorted = [...values].sort((a, b) => a - b);
    const g = group("conversion-loss-at-drive", CL_2GHZ);
    expect(g.n).toBe(10);
    expect(g.lots).toBe(2);
    expect(g.mean.value).toBeCloseTo(mean, 8);
    expect(g.standardDeviation.value).toBeCloseTo(s, 8);
    expect(g.median.value).toBeCloseTo((sorted[4] + sorted[5]) / 2, 8);
    expect(g.min.value).toBeCloseTo(sorted[0], 8);
    expect(g.max.value).toBeCloseTo(sorted[9], 8);
    // Cpk against the one-sided max limit 12 dB: (USL − mean)/(3s), NIST/SEMATECH §6.1.6.
    expect(g.cpk.value).toBeCloseTo((12 - mean) / (3 * s), 8);
    expect(g.mean.text).toMatch(/^\d+\.\d{3}$/);
  });

  it("gives the exact two-sided tolerance interval (99 % coverage, 95 % confidence)", () => {
    const g = group("conversion-loss-at-drive", CL_2GHZ);
    // Exact factor for n = 10, p = 0.99, γ = 0.95: 4.4369 (Berthouex & Brown Table 21.1 gives 4.44).
    expect(g.toleranceInterval?.factor.value).toBeCloseTo(4.4369, 3);
    const expected = computeToleranceInterval({
      sampleSize: 10,
      coverage: 0.99,
      confidence: 0.95,
      mean: g.mean.value!,
      standardDeviation: g.standardDeviation.value!,
    });
    expect(g.toleranceInterval?.lower.value).toBeCloseTo(expected.lower, 6);
    expect(g.toleranceInterval?.upper.value).toBeCloseTo(expected.upper, 6);
  });

  it("flags a limit whose Cpk is below the threshold", () => {
    const g = group("fundamental-suppression", "drive=10;inputFrequencyHz=2000000000;order=1;temperatureC=25");
    expect(g.cpk.value!).toBeLessThan(1.33);
    expect(g.flags.map((f) => f.code)).toContain("cpk-below-threshold");
    expect(g.supported).toBe(false);
    expect(model.specifications.rows.find((r) => r.groupId === g.groupId)?.supported).toBe(false);
  });

  it("passes a well-supported limit without flags and states the guard-band rule", () => {
    const g = group("conversion-loss-at-drive", CL_2GHZ);
    expect(g.flags).toEqual([]);
    expect(g.decisionRule).toBe("guard-band");
    expect(g.acceptance?.upper.value).toBeCloseTo(12 - 0.4, 10);
    expect(g.passCount).toBe(10);
    expect(model.statistics.decisionRules.some((r) => r.includes("ILAC-G8:09/2019 §4.2.2"))).toBe(true);
  });

  it("fails every unit above the guard-banded limit (max − U) and flags the group", () => {
    const g = group("conversion-loss-at-drive", CL_3GHZ);
    const acceptance = 11.5 - 0.4;
    const outside = g.units.filter((u) => u.value.value! > acceptance).map((u) => u.serial);
    expect(outside.length).toBeGreaterThan(0);
    expect(g.units.filter((u) => u.decision === "fail").map((u) => u.serial)).toEqual(outside);
    expect(g.flags.map((f) => f.code)).toContain("unit-outside-acceptance");
  });

  it("prints limits, the measured mean as typ when none is stated, basis marks and footnotes", () => {
    const row = model.specifications.rows.find((r) => r.groupId === `conversion-loss-at-drive:${CL_3GHZ}`)!;
    expect(row.max.text).toBe("11.5");
    expect(row.typIsMeasuredMean).toBe(true);
    expect(row.basisMark).toBe("T");
    expect(row.conditions).toEqual(["3\u00a0GHz in", "+10\u00a0dBm per port", "", "25\u00a0°C"]);
    const marks = row.footnoteMarks.map((m) => model.specifications.footnotes.find((f) => f.mark === m)?.text);
    expect(marks).toContain("At 3 GHz input the limit applies to lots from L24-07 on.");
    const pn = model.specifications.rows.find((r) => r.rowId === "residual-phase-noise" && r.max.text)!;
    expect(pn.max.text).toBe("\u2212155");
  });

  it("keeps ratings from the device data and reports the missing one", () => {
    expect(model.absoluteMaximumRatings.find((r) => r.label.startsWith("RF input"))?.value).toBe("+20");
    const esd = model.absoluteMaximumRatings.find((r) => r.label.startsWith("ESD"));
    expect(esd).toMatchObject({ value: "", missing: true });
    expect(model.issues.map((i) => i.code)).toContain("rating-missing");
  });

  it("lists a used set's plausibility warning among the open issues, and none for a clean set", () => {
    expect(model.issues.map((i) => i.code)).not.toContain("implausible-value");
    const warning = 'Plausibility: "p2_out [dBm]" is above "input_power [dBm]" on 1 row, by up to 0.37 dB (line 14: 15.37 dBm out, 15.00 dBm in)';
    const [first, ...rest] = input.approvedSets;
    const flagged = buildSheetModel({ ...input, approvedSets: [{ ...first, plausibilityWarnings: [warning] }, ...rest] });
    const issues = flagged.issues.filter((i) => i.code === "implausible-value");
    expect(issues).toEqual([
      {
        code: "implausible-value",
        message: `Measurement set ${String(first.id)} (${first.kind}, ${first.serial}) carries a plausibility warning: "p2_out [dBm]" is above "input_power [dBm]" on 1 row, by up to 0.37 dB (line 14: 15.37 dBm out, 15.00 dBm in).`,
      },
    ]);
  });

  it("carries charts as Vega-Lite specs with the data inlined", () => {
    expect(model.charts.map((c) => c.id)).toEqual([
      "conversion-loss-vs-drive",
      "output-spectrum-vs-drive",
      "harmonic-suppression-vs-drive",
      "phase-noise",
      "conversion-loss-vs-input-frequency",
      "fundamental-suppression-vs-input-frequency",
    ]);
    const spec = model.charts[0].vegaLite as { $schema: string; data: { values: { unit: string }[] } };
    expect(spec.$schema).toContain("vega-lite/v6");
    expect(new Set(spec.data.values.map((v) => v.unit)).size).toBe(10);
  });

  it("marks each unit's optimum drive on the conversion-loss chart, at the engine's optimum", () => {
    type Layered = { layer: { data?: { values: { x: number; y: number; label: string; unit: string }[] } }[] };
    const chart = model.charts.find((c) => c.id === "conversion-loss-vs-drive")!;
    const markers = (chart.vegaLite as Layered).layer[1].data!.values;
    expect(markers).toHaveLength(10);
    expect(new Set(markers.map((m) => m.label))).toEqual(new Set(["optimum drive"]));
    expect(chart.caption).toContain("Open circles: optimum drive (10)");
    // Four frequencies with ten units each at 25 °C: the chart shows the lower middle one.
    expect(chart.caption).toContain("at 2\u00a0GHz in, 25\u00a0°C");
    // Each circle sits at the optimum-drive and conversion-loss parameters of that unit's 2 GHz, 25 °C set.
    for (const marker of markers) {
      const set = input.approvedSets.find((s) => s.serial === marker.unit && s.temperatureC === 25 && s.parameters.some((p) => p.conditions.inputFrequencyHz === 2e9))!;
      const optimum = set.parameters.find((p) => p.name === "optimum-drive")!.value!;
      const loss = set.parameters.find((p) => p.name === "conversion-loss" && p.conditions.drive === "optimum")!.value!;
      expect(marker.x).toBeCloseTo(optimum, 4);
      expect(marker.y).toBeCloseTo(loss, 4);
    }
  });

  it("draws conversion loss against input frequency from the same values as the statistics", () => {
    const chart = model.charts.find((c) => c.id === "conversion-loss-vs-input-frequency")!;
    const values = (chart.vegaLite as { data: { values: { x: number; y: number; unit: string }[] } }).data.values;
    expect(chart.caption).toContain("at 25\u00a0°C");
    for (const [key, xGhz] of [[CL_2GHZ, 2], [CL_3GHZ, 3]] as const) {
      const g = group("conversion-loss-at-drive", key);
      const drawn = values.filter((v) => v.x === xGhz);
      expect(drawn).toHaveLength(g.n);
      for (const unit of g.units) expect(drawn.find((v) => v.unit === unit.serial)?.y).toBeCloseTo(unit.value.value!, 4);
    }
  });

  it("shows the preliminary banner until released, and not after", () => {
    expect(model.header.banner).toBe("PRELIMINARY — NOT RELEASED");
    const released = buildSheetModel({ ...input, revision: { ...input.revision, label: "C", state: "released" } });
    expect(released.header.banner).toBeNull();
    expect(released.header.revisionText).toBe("Rev. C");
  });

  it("lists instruments once, with uncertainty and calibration dates", () => {
    const { instruments } = model.traceability;
    // Sorted by kind: phase-noise test set, signal generator, spectrum analyzer.
    expect(instruments.map((i) => i.serial)).toEqual(["QPN-0042", "TSG-2291", "CSA-0815"]);
    expect(instruments.find((i) => i.serial === "CSA-0815")?.setCount).toBe(49);
    expect(instruments[1].uncertainty[0]).toBe("output level: ±0.5\u00a0dB (k = 2)");
    expect(instruments[1]).toMatchObject({ calibratedOn: "2025-09-02", calibrationDueOn: "2026-09-02", calibrationLapsed: false });
  });
});

describe("decisions per unit", () => {
  const base = loadDoublerInput();
  const cases = [
    { name: "guard band w = U rejects a unit inside the limit but within U of it", u: 0.4, max: 11.0, value: 10.8, decision: "fail", rule: "guard-band" },
    { name: "guard band accepts a unit more than U inside", u: 0.4, max: 11.5, value: 10.8, decision: "pass", rule: "guard-band" },
    { name: "simple acceptance (no U stated) accepts the same unit", u: undefined, max: 11.0, value: 10.8, decision: "pass", rule: "simple-acceptance" },
    { name: "simple acceptance rejects a unit beyond the limit", u: undefined, max: 10.7, value: 10.8, decision: "fail", rule: "simple-acceptance" },
  ] as const;
  for (const c of cases) {
    it(c.name, () => {
      const set = base.approvedSets[0];
      const input: SheetInput = {
        ...base,
        approvedSets: [
          { ...set, parameters: [{ name: "conversion-loss", value: c.value, unit: "dB", conditions: { drive: "optimum", inputFrequencyHz: 2e9 } }], curves: flatDriveCurves({ conversionLossDb: c.value }) },
        ],
        limits: [{ parameter: "conversion-loss", conditionsKey: CL_2GHZ, max: c.max, unit: "dB", basis: "test" }],
        settings: { ...base.settings, measurementUncertainty: c.u === undefined ? {} : { "conversion-loss": c.u } },
      };
      const g = buildSheetModel(input).statistics.groups.find((x) => x.conditionsKey === CL_2GHZ)!;
      expect(g.units[0].decision).toBe(c.decision);
      expect(g.decisionRule).toBe(c.rule);
      expect(g.flags.map((f) => f.code)).toContain("insufficient-data");
    });
  }

  it("flags a limit that no data supports and keeps it in the table", () => {
    const input: SheetInput = {
      ...base,
      limits: [...base.limits, { parameter: "optimum-drive", conditionsKey: "inputFrequencyHz=6000000000;temperatureC=25", max: 12, unit: "dBm", basis: "design" }],
    };
    const model = buildSheetModel(input);
    const g = model.statistics.groups.find((x) => x.rowId === "optimum-drive" && x.conditionsKey.startsWith("inputFrequencyHz=6000000000"))!;
    expect(g.n).toBe(0);
    expect(g.flags.map((f) => f.code)).toEqual(["limit-without-data"]);
    expect(model.specifications.rows.some((r) => r.groupId === g.groupId && r.max.text === "12")).toBe(true);
  });
});

describe("determinism", () => {
  const input = loadDoublerInput();

  it("builds byte-identical JSON twice", () => {
    expect(serializeSheetModel(buildSheetModel(input))).toBe(serializeSheetModel(buildSheetModel(input)));
  });

  it("gives the same bytes when every input array is shuffled", () => {
    const reordered: SheetInput = {
      ...input,
      approvedSets: shuffled(input.approvedSets, 7).map((set, i) => ({
        ...set,
        parameters: shuffled(set.parameters, i + 11),
        instruments: shuffled(set.instruments, i + 13),
      })),
      limits: shuffled(input.limits, 3),
      revision: { ...input.revision, history: shuffled(input.revision.history, 5) },
    };
    expect(reordered.approvedSets.map((s) => s.id)).not.toEqual(input.approvedSets.map((s) => s.id));
    expect(serializeSheetModel(buildSheetModel(reordered))).toBe(serializeSheetModel(buildSheetModel(input)));
  });

  it("sorts object keys in the serialized JSON", () => {
    const json = serializeSheetModel(buildSheetModel(input));
    expect(json.indexOf('"absoluteMaximumRatings"')).toBeLessThan(json.indexOf('"charts"'));
    expect(JSON.parse(json).header.partNumber).toBe("OCX-2D40");
  });

  it("refuses an unknown device class and a non-ISO date", () => {
    expect(() => buildSheetModel({ ...input, device: { ...input.device, deviceClass: "tripler-x" } })).toThrow(/No sheet template/);
    expect(() => buildSheetModel({ ...input, revision: { ...input.revision, date: "3 Feb 2026" } })).toThrow(/ISO date/);
  });
});
