import { flatDriveCurves } from "./fixture";
import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { buildSheetModel, type ApprovedSetInput, type SheetInput } from "@/lib/sheet";
import { formatTemperatureRange } from "@/lib/sheet/format";
import { optimumDriveShiftDb } from "@/models/seeders/demo-catalog-curves";

/**
 * Rows over temperature and charts against temperature, on a constructed doubler: unit A at −40, +25
 * and +85 °C, unit B at +25 and +85 °C (lot L2), unit C at +25 °C only. Conversion loss at the stated drive (+10 dBm per port)
 * (dB): A 9.1 / 9.5 / 10.2, B 9.8 / 10.6, C 9.4.
 */
const readings: [serial: string, lot: string, temperatureC: number, lossDb: number][] = [
  ["A", "L1", -40, 9.1],
  ["A", "L1", 25, 9.5],
  ["A", "L1", 85, 10.2],
  ["B", "L2", 25, 9.8],
  ["B", "L2", 85, 10.6],
  ["C", "L1", 25, 9.4],
];

function set(id: number, [serial, lot, temperatureC, lossDb]: (typeof readings)[number]): ApprovedSetInput {
  return {
    id,
    kind: "drive-sweep",
    serial,
    lot,
    temperatureC,
    measuredOn: "2026-10-01",
    parameters: [{ name: "conversion-loss", value: lossDb, unit: "dB", conditions: { drive: "optimum", inputFrequencyHz: 1e9 } }],
    curves: flatDriveCurves({ conversionLossDb: lossDb }),
    instruments: [],
  };
}

const overRange = "drive=10;inputFrequencyHz=1000000000;temperatureMaxC=85;temperatureMinC=-40";

function input(sets: ApprovedSetInput[], limits: SheetInput["limits"] = []): SheetInput {
  return {
    device: { partNumber: "TMP-1", deviceClass: "frequency-multiplier", title: "t", description: "", keyConditions: {}, organizationName: "Test" },
    revision: { label: null, state: "draft", date: "2026-12-01", history: [] },
    approvedSets: sets,
    limits,
    prose: {},
    absoluteMaximumRatings: [],
    settings: { cpkThreshold: 1.33, toleranceCoverage: 0.99, toleranceConfidence: 0.95 },
  };
}

/**
 * Python's own max() of each unit's readings, over the units measured at both the lowest and the highest
 * temperature, and min()/max() over all readings: the reference outside the project.
 */
function pythonReference(): { worst: Record<string, number>; lowest: number; highest: number } {
  const script =
    "import json,sys\nrows=json.load(sys.stdin)\nlo=min(r[2] for r in rows)\nhi=max(r[2] for r in rows)\n" +
    "temps={}\nfor s,l,t,v in rows: temps.setdefault(s,set()).add(t)\n" +
    "worst={}\nfor s,l,t,v in rows:\n  if lo in temps[s] and hi in temps[s]: worst[s]=max(worst.get(s,v),v)\n" +
    "print(json.dumps({'worst':worst,'lowest':min(r[3] for r in rows),'highest':max(r[3] for r in rows)}))";
  return JSON.parse(execFileSync("/usr/bin/python3", ["-c", script], { input: JSON.stringify(readings), encoding: "utf8" }));
}

describe("a row over temperature", () => {
  const model = buildSheetModel(input(readings.map((r, i) => set(i + 1, r)), [{ parameter: "conversion-loss", conditionsKey: overRange, max: 11, unit: "dB", basis: "characterization" }]));
  const row = model.specifications.rows.find((r) => r.rowId === "conversion-loss-over-temperature")!;
  const group = model.statistics.groups.find((g) => g.rowId === "conversion-loss-over-temperature")!;

  it("takes each unit's highest value over the span, from the units measured at both ends, as Python's max() does", () => {
    const { worst } = pythonReference();
    expect(group.units.map((u) => [u.serial, u.value.value])).toEqual(Object.entries(worst).sort());
    // A spans −40 to +85 °C; B (+25 and +85 °C) and C (+25 °C) do not, and stay in their own temperatures' rows.
    expect(Object.keys(worst)).toEqual(["A"]);
    expect(group.n).toBe(1);
    expect(group.lots).toBe(1);
  });

  it("states the span of the sets' temperatures in the temperature column and carries the limit stated over it", () => {
    expect(row.conditionsKey).toBe(overRange);
    expect(row.conditions.at(-1)).toBe("−40 to +85\u00a0°C");
    expect(row.max.text).toBe("11");
    expect(row.basis).toBe("characterization");
    expect(model.issues.filter((i) => i.code === "limit-not-shown")).toEqual([]);
  });

  it("keeps the rows at each temperature; without a limit nothing is screened, so none claims basis test", () => {
    const atEach = model.specifications.rows.filter((r) => r.rowId === "conversion-loss-at-drive");
    expect(atEach.map((r) => [r.conditions.at(-1), r.n, r.basis])).toEqual([
      ["−40\u00a0°C", 1, "characterization"],
      ["25\u00a0°C", 3, "characterization"],
      ["85\u00a0°C", 2, "characterization"],
    ]);
    const tested = buildSheetModel(input(readings.map((r, i) => set(i + 1, r)), [{ parameter: "conversion-loss", conditionsKey: "drive=10;inputFrequencyHz=1000000000;temperatureC=25", max: 11, unit: "dB", basis: "test" }]));
    expect(tested.specifications.rows.find((r) => r.rowId === "conversion-loss-at-drive" && r.conditionsKey.endsWith("temperatureC=25"))!.basis).toBe("test");
  });

  it("is left out when no unit was measured at both ends of the span", () => {
    // A at −40 and +25 °C, B at +25 and +85 °C: the span is −40 to +85 °C and neither unit covers it.
    const halves = readings.filter((r) => !(r[0] === "A" && r[2] === 85) && r[0] !== "C");
    const split = buildSheetModel(input(halves.map((r, i) => set(i + 1, r))));
    expect(split.specifications.rows.some((r) => r.rowId === "conversion-loss-over-temperature")).toBe(false);
    expect(split.specifications.rows.filter((r) => r.rowId === "conversion-loss-at-drive").length).toBe(3);
    // Not silently: the open issues say which span no unit covers.
    expect(split.issues.filter((i) => i.code === "temperature-span-not-covered").map((i) => i.message.replace(/\u00a0/g, " "))).toEqual([
      "Conversion loss over temperature: no unit was measured at both ends of −40 to +85 °C, so the row over that span is left out; each unit's figures stay in the rows at the temperatures it was measured at.",
    ]);
    // And quiet where a unit covers the span.
    expect(model.issues.some((i) => i.code === "temperature-span-not-covered")).toBe(false);
  });

  it("is left out when every set is at one temperature", () => {
    const room = buildSheetModel(input(readings.filter((r) => r[2] === 25).map((r, i) => set(i + 1, r))));
    expect(room.specifications.rows.some((r) => r.rowId === "conversion-loss-over-temperature")).toBe(false);
  });

  it("takes the lowest value per unit for a row whose worst is its minimum", async () => {
    const { frequencyMultiplierTemplate } = await import("@/templates/frequency-multiplier");
    const { buildSpecTable } = await import("@/lib/sheet/spec-table");
    const template = { ...frequencyMultiplierTemplate, specifications: { ...frequencyMultiplierTemplate.specifications, rows: [{ ...frequencyMultiplierTemplate.specifications.rows[1], overTemperature: "min" as const }] } };
    const table = buildSpecTable({ template, sets: readings.map((r, i) => set(i + 1, r)), limits: [], settings: input([]).settings, classLabel: "Frequency multiplier" });
    expect(table.groups[0].units.map((u) => [u.serial, u.value.value])).toEqual([["A", 9.1]]);
  });
});

describe("a chart against temperature", () => {
  const model = buildSheetModel(input(readings.map((r, i) => set(i + 1, r))));
  const chart = model.charts.find((c) => c.id === "conversion-loss-vs-temperature")!;

  it("draws one line per unit through its temperatures and states the lowest and highest value drawn", () => {
    const { lowest, highest } = pythonReference();
    expect(chart.unitCount).toBe(3);
    expect(chart.caption).toContain("drawn at frequency 1\u00a0GHz in, drive +10\u00a0dBm per port.");
    expect(chart.caption).toContain(`Over −40 to +85\u00a0°C: lowest ${String(lowest)}\u00a0dB, highest ${String(highest)}\u00a0dB.`);
  });

  it("is not drawn from one temperature", () => {
    const room = buildSheetModel(input(readings.filter((r) => r[2] === 25).map((r, i) => set(i + 1, r))));
    expect(room.charts.some((c) => c.id === "conversion-loss-vs-temperature")).toBe(false);
  });
});

describe("the temperature span as ratings write it", () => {
  it.each([
    [-40, 85, "−40 to +85\u00a0°C"],
    [-55, 125, "−55 to +125\u00a0°C"],
    [25, 85, "25 to 85\u00a0°C"],
    [0, 70, "0 to 70\u00a0°C"],
    [25, 25, "25\u00a0°C"],
  ])("%d to %d °C", (low, high, text) => {
    expect(formatTemperatureRange(low, high)).toBe(text);
  });
});

describe("the demo's shift of a diode ring's optimum drive with temperature", () => {
  // Worked by hand: +10.1 dBm into 50 Ω is 10.23 mW, a peak of √(2·50 Ω·10.23 mW) = 1.0116 V; two
  // Schottky diodes at −1.5 mV/°C move the turn-on by 2·(−1.5 mV)·(85 − 25) = −0.18 V, so the optimum
  // drive moves by 20·log10(1 − 0.18/1.0116) = −1.70 dB; at −40 °C by 20·log10(1 + 0.195/1.0116) = +1.53 dB.
  it.each([
    [85, -1.70],
    [-40, 1.53],
    [25, 0],
  ])("at %d °C: %d dB", (temperatureC, shiftDb) => {
    expect(optimumDriveShiftDb(10.1, temperatureC)).toBeCloseTo(shiftDb, 2);
  });
});
