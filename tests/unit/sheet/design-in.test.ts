import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import reference from "./reference/design-in-numpy.json";
import { buildChartSpec } from "@/lib/sheet/charts";
import { computeDesignIn, readDesignInCurves, readDesignInQuery, type DesignInAnswer, type DesignInQuery } from "@/lib/sheet/design-in";
import { buildDesignInCharts } from "@/lib/sheet/design-in-charts";
import type { SheetModel } from "@/lib/sheet/types";

function demoModel(part: string): SheetModel {
  return JSON.parse(readFileSync(`tests/unit/sheet/__snapshots__/demo-${part}.json`, "utf8")) as SheetModel;
}

function answered(model: SheetModel, query: DesignInQuery): DesignInAnswer {
  const answer = computeDesignIn(model, query);
  if (!answer.ok) throw new Error(`refused: ${answer.message}`);
  return answer;
}

// Reference figures from NumPy 2.4 (Debian python3-numpy): numpy.interp on each unit's curve and on the
// typical curve (numpy.median of the units at each measured x), numpy.mean, numpy.std(ddof=1), min, max,
// read from the same demo snapshots' chart data. Regenerate with `/usr/bin/python3 scripts/reference/design-in-numpy.py`.
describe("design-in readings against NumPy", () => {
  const models = { "KDX-2G4": demoModel("KDX-2G4"), "KM-7H": demoModel("KM-7H") } as Record<string, SheetModel>;
  const fixed: Record<string, (x: number) => DesignInQuery> = {
    "KDX-2G4": (x) => ({ driveDbm: x, frequencyHz: 1e9 }),
    "KM-7H": (x) => ({ driveDbm: 7, frequencyHz: x }),
  };

  it("the reference file is NumPy's and covers both classes", () => {
    expect(reference.numpyVersion).toMatch(/^\d+\.\d+/);
    expect(new Set(reference.cases.map((c) => c.part))).toEqual(new Set(["KDX-2G4", "KM-7H"]));
  });

  it.each(reference.cases.filter((c) => c.basis === "draft"))("$part $series at $x", (expected) => {
    const answer = answered(models[expected.part], fixed[expected.part](expected.x));
    const reading = answer.readings.find((r) => r.chartId === expected.chartId && r.series === expected.series);
    expect(reading).toBeDefined();
    expect(reading!.typical).toBeCloseTo(expected.typical, 8);
    expect(reading!.spread.n).toBe(expected.n);
    expect(reading!.spread.mean).toBeCloseTo(expected.mean, 8);
    expect(reading!.spread.standardDeviation!).toBeCloseTo(expected.standardDeviation, 8);
    expect(reading!.spread.min).toBeCloseTo(expected.min, 8);
    expect(reading!.spread.max).toBeCloseTo(expected.max, 8);
  });
});

/**
 * A hand-worked doubler: two units at 2 GHz in, 25 °C, conversion loss 10 → 8 dB (unit A) and
 * 12 → 9 dB (unit B) from 0 to +10 dBm per port. The typical curve is the median of the two at each
 * drive: 11 dB at 0 dBm, 8.5 dB at +10 dBm, so at +4 dBm it reads 11 + (8.5 − 11) · 4/10 = 10.0 dB.
 * The units read 9.2 and 10.8 dB there: mean 10.0, s = |10.8 − 9.2| / √2 = 1.131371 dB.
 */
function handModel(): SheetModel {
  const curve = (cl0: number, cl10: number) => ({
    id: "conversion-loss-vs-drive",
    title: "Conversion loss vs drive",
    x: { label: "Per-port drive", unit: "dBm", scale: "linear" as const },
    y: { label: "Conversion loss", unit: "dB" },
    series: [{ name: "order 2", points: [[0, cl0], [10, cl10]] as [number, number][] }],
  });
  const chart = buildChartSpec(
    { id: "conversion-loss-vs-drive", title: "Conversion loss vs per-port drive", caption: "Each line one unit." },
    [
      { serial: "A", curve: curve(10, 8) },
      { serial: "B", curve: curve(12, 9) },
    ],
    { conditionsLabel: "2 GHz in, 25\u00a0°C" },
  )!;
  const base = demoModel("KDX-2G4");
  return {
    ...base,
    header: { ...base.header, partNumber: "HAND-1" },
    charts: [chart],
    specifications: { ...base.specifications, rows: [] },
    statistics: { ...base.statistics, groups: [{ ...base.statistics.groups[0], conditionsKey: "drive=10;inputFrequencyHz=2000000000;temperatureC=25" }] },
  };
}

describe("design-in, a hand-worked example", () => {
  it("reads the typical curve and the spread at +4 dBm", () => {
    const answer = answered(handModel(), { driveDbm: 4, frequencyHz: 2e9 });
    expect(answer.fixed.value).toBe(2e9);
    expect(answer.range).toEqual({ min: 0, max: 10 });
    const [reading] = answer.readings;
    expect(reading.typical).toBeCloseTo(10.0, 12);
    expect(reading.between).toEqual({ x0: 0, y0: 11, x1: 10, y1: 8.5 });
    expect(reading.spread).toEqual({ n: 2, mean: 10, standardDeviation: expect.closeTo(1.131371, 6), min: 9.2, max: 10.8 });
    expect(answer.method).toMatch(/linear in dB against per-port drive in dBm/);
  });

  it("refuses a drive beyond the sweep and names the range", () => {
    const refusal = computeDesignIn(handModel(), { driveDbm: 10.5, frequencyHz: 2e9 });
    expect(refusal).toMatchObject({ ok: false, code: "outside-range", field: "drive", range: { min: 0, max: 10, unit: "dBm" } });
    expect(!refusal.ok && refusal.message).toBe("Per-port drive +10.5\u00a0dBm is outside the measured range of HAND-1, 0\u00a0dBm to +10\u00a0dBm; the calculator does not extrapolate.");
  });

  it("refuses a frequency other than the one the curves were measured at", () => {
    const refusal = computeDesignIn(handModel(), { driveDbm: 4, frequencyHz: 2.1e9 });
    expect(refusal).toMatchObject({ ok: false, code: "outside-range", field: "frequency" });
    expect(!refusal.ok && refusal.message).toMatch(/measured at input frequency 2\u00a0GHz only; 2\.1\u00a0GHz is outside the measured range/);
  });
});

describe("design-in on the demo sheets", () => {
  it("KDX-2G4: the curves run over per-port drive at 1 GHz in, 25 °C", () => {
    const read = readDesignInCurves(demoModel("KDX-2G4"));
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect(read.curves.swept).toMatchObject({ field: "drive", label: "Per-port drive", unit: "dBm" });
    expect(read.curves.fixed).toMatchObject({ field: "frequency", value: 1e9 });
    expect(read.curves.temperatureC).toBe(25);
    expect(read.curves.curves.map((c) => c.label)).toEqual(["Conversion loss", "Fundamental suppression", "3rd harmonic suppression", "4th harmonic suppression"]);
  });

  it("KDX-2G4: the guaranteed limits beside the reading, stated at +10 dBm per port and marked at another drive", () => {
    const answer = answered(demoModel("KDX-2G4"), { driveDbm: 10, frequencyHz: 1e9 });
    const loss = answer.readings.find((r) => r.id === "conversion-loss")!;
    // The 25 °C production limit and the maximum characterized over −40 to +85 °C, a span that holds 25 °C.
    expect(loss.limits).toHaveLength(2);
    expect(loss.limits[0]).toMatchObject({ rowId: "conversion-loss-at-drive", maxText: "11", basis: "test", driveDiffers: false });
    expect(loss.limits[0].conditionsText.replace(/\u00a0/g, " ")).toContain("Drive +10 dBm per port");
    expect(loss.limits[1]).toMatchObject({ rowId: "conversion-loss-over-temperature", maxText: "11.5", basis: "characterization", driveDiffers: false });
    // At +12 dBm the same rows apply, marked as stated at their own drive.
    const at12 = answered(demoModel("KDX-2G4"), { driveDbm: 12, frequencyHz: 1e9 }).readings.find((r) => r.id === "conversion-loss")!;
    expect(at12.limits.map((l) => [l.rowId, l.driveDiffers])).toEqual([
      ["conversion-loss-at-drive", true],
      ["conversion-loss-over-temperature", true],
    ]);
    const fundamental = answer.readings.find((r) => r.label === "Fundamental suppression")!;
    expect(fundamental.limits[0]).toMatchObject({ rowId: "fundamental-suppression", minText: "22" });
  });

  it("KM-7H: the curves run over RF frequency at LO +7 dBm; the band's limits apply inside it", () => {
    const answer = answered(demoModel("KM-7H"), { driveDbm: 7, frequencyHz: 1.55e9 });
    expect(answer.swept).toMatchObject({ field: "frequency", label: "RF frequency", value: 1.55e9 });
    expect(answer.fixed).toMatchObject({ field: "drive", label: "LO drive", value: 7 });
    const loss = answer.readings.find((r) => r.id === "conversion-loss")!;
    expect(loss.limits.map((l) => [l.rowId, l.maxText])).toEqual([
      ["conversion-loss-worst", "8.5"],
      ["conversion-loss-typical", ""],
      ["conversion-loss-worst-over-temperature", "9"],
    ]);
    expect(answer.readings.find((r) => r.id === "isolation:LO-RF")!.limits[0]).toMatchObject({ minText: "22" });
  });

  it("KM-7H: another LO drive is refused, naming the one measured", () => {
    const refusal = computeDesignIn(demoModel("KM-7H"), { driveDbm: 10, frequencyHz: 1e9 });
    expect(refusal).toMatchObject({ ok: false, code: "outside-range", field: "drive", range: { text: "+7\u00a0dBm" } });
    expect(!refusal.ok && refusal.message).toMatch(/measured at LO drive \+7\u00a0dBm only; \+10\u00a0dBm is outside/);
  });

  it("a hybrid sheet is refused with the reason", () => {
    const refusal = computeDesignIn(demoModel("KQH-2G"), { driveDbm: 0, frequencyHz: 2e9 });
    expect(refusal).toMatchObject({ ok: false, code: "device-class", field: "sheet" });
    expect(!refusal.ok && refusal.message).toMatch(/reads frequency multiplier and mixer sheets; KQH-2G is a quadrature hybrid/);
  });

  it("a multiplier without drive curves is refused", () => {
    const base = demoModel("KDX-2G4");
    const model = { ...base, charts: base.charts.filter((c) => !c.id.endsWith("-vs-drive")) };
    const refusal = computeDesignIn(model, { driveDbm: 10, frequencyHz: 1e9 });
    expect(refusal).toMatchObject({ ok: false, code: "no-curves", field: "sheet" });
    expect(!refusal.ok && refusal.message).toMatch(/^KDX-2G4 .* has no released curves to read a design from\.$/);
  });

  it("a mixer whose curves mix LO drives is refused rather than guessed", () => {
    const base = demoModel("KM-7H");
    const group = base.statistics.groups.find((g) => g.parameter === "conversion-loss" && g.conditionsKey.includes("temperatureC=25"))!;
    const model = { ...base, statistics: { ...base.statistics, groups: [...base.statistics.groups, { ...group, conditionsKey: group.conditionsKey.replace("loPowerDbm=7", "loPowerDbm=10") }] } };
    expect(computeDesignIn(model, { driveDbm: 7, frequencyHz: 1e9 })).toMatchObject({ ok: false, code: "conditions-unknown", field: "drive" });
  });

  it("draws the design as a marker on the typical curve, through lib/charts", () => {
    const model = demoModel("KDX-2G4");
    const answer = answered(model, { driveDbm: 10, frequencyHz: 1e9 });
    const charts = buildDesignInCharts(model, answer);
    expect(charts.map((c) => c.id)).toEqual(["conversion-loss-vs-drive", "harmonic-suppression-vs-drive"]);
    const layers = charts[0].vegaLite.layer as { data?: { values: { x: number; y: number; label?: string }[] }; mark: { type: string } }[];
    const marker = layers.find((l) => l.mark.type === "point" && l.data)!;
    expect(marker.data!.values).toEqual([expect.objectContaining({ x: 10, y: Number(answer.readings[0].typical.toPrecision(6)), label: "your design" })]);
    // 9.61: NumPy reads the typical curve at 9.6103 dB there (reference/design-in-numpy.json, draft).
    expect(charts[0].description).toMatch(/Conversion loss 9\.61\u00a0dB at \+10\u00a0dBm, marked by an open circle/);
  });
});

describe("reading the query as typed", () => {
  it.each([
    [{ drive: "+10 dBm", frequency: "1 GHz" }, { driveDbm: 10, frequencyHz: 1e9 }],
    [{ drive: "10", frequency: "1000 MHz" }, { driveDbm: 10, frequencyHz: 1e9 }],
    [{ drive: "-3.5dBm", frequency: "2400MHz" }, { driveDbm: -3.5, frequencyHz: 2.4e9 }],
    [{ drive: "\u22123 dBm", frequency: "1.55 GHz" }, { driveDbm: -3, frequencyHz: 1.55e9 }],
  ])("%j", (input, query) => {
    const read = readDesignInQuery(input);
    expect(read.ok).toBe(true);
    if (read.ok === true) {
      expect(read.query.driveDbm).toBeCloseTo(query.driveDbm, 12);
      expect(read.query.frequencyHz).toBeCloseTo(query.frequencyHz, 3);
    }
  });

  it("blank is not asked yet", () => {
    expect(readDesignInQuery({})).toEqual({ ok: "blank" });
    expect(readDesignInQuery({ drive: " ", frequency: "" })).toEqual({ ok: "blank" });
  });

  it.each([
    [{ drive: "ten", frequency: "1 GHz" }, "drive", /not a decimal number/],
    [{ drive: "10 W", frequency: "1 GHz" }, "drive", /unknown unit "W"/],
    [{ drive: "10", frequency: "1" }, "frequency", /needs a unit/],
    [{ drive: "10", frequency: "1 furlong" }, "frequency", /unknown unit/],
    [{ drive: "10", frequency: "0 GHz" }, "frequency", /above zero/],
    [{ drive: "10", frequency: "0x10 GHz" }, "frequency", /not a decimal number/],
    [{ drive: "", frequency: "1 GHz" }, "drive", /enter your design's drive/],
    [{ drive: "10", frequency: "1".repeat(10_000) }, "frequency", /at most 40 characters/],
  ])("%j is refused at %s", (input, field, message) => {
    const read = readDesignInQuery(input);
    expect(read.ok).toBe(false);
    if (read.ok === false) {
      expect(read.issues).toHaveLength(1);
      expect(read.issues[0].field).toBe(field);
      expect(read.issues[0].message).toMatch(message);
    }
  });
});
