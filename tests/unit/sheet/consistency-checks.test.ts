import { describe, expect, it } from "vitest";
import * as checks from "@/lib/sheet/consistency-checks";
import { buildSheetModel, type ApprovedSetInput, type StatisticsGroup } from "@/lib/sheet";
import { differenceUnit } from "@/lib/format";
import { combGeneratorTemplate, doubleBalancedMixerTemplate, frequencyMultiplierTemplate, quadratureHybridTemplate } from "@/templates";
import { annexUnitText } from "@/lib/sheet/format";
import { describeDecisionRule } from "@/lib/stats";
import { loadDoublerInput } from "./fixture";

const { readTemperatureRange, reviewCheckStatements } = checks;

/** The messages with plain spaces for the no-break space the formatter puts between a number and its unit. */
const plain =
  <A,>(check: (options: A) => { code: string; message: string }[]) =>
  (options: A) =>
    check(options).map((issue) => ({ ...issue, message: issue.message.replace(/\u00a0/g, " ") }));
const checkStatedBands = plain(checks.checkStatedBands);
const checkStatedUncertainty = plain(checks.checkStatedUncertainty);
const checkLimitSpread = plain(checks.checkLimitSpread);
const checkLimitUnitCount = plain(checks.checkLimitUnitCount);

const GHz = 1e9;
const MHz = 1e6;
const figure = (value: number | null) => ({ value, text: value === null ? "" : String(value) });

type Group = Pick<StatisticsGroup, "rowId" | "label" | "conditionsKey" | "conditionsText" | "n" | "limits" | "units">;

/** A statistics group as the spec table makes it, with only what the checks read. */
function group(options: {
  rowId?: string;
  label?: string;
  conditionsKey: string;
  lots?: (string | null)[];
  limit?: { min?: number; max?: number; typ?: number; basis: "test" | "characterization" | "design" };
}): Group {
  const lots = options.lots ?? [];
  return {
    rowId: options.rowId ?? "row",
    label: options.label ?? "Conversion loss",
    conditionsKey: options.conditionsKey,
    conditionsText: "",
    n: lots.length,
    limits: options.limit
      ? { min: figure(options.limit.min ?? null), typ: figure(options.limit.typ ?? null), max: figure(options.limit.max ?? null), basis: options.limit.basis }
      : null,
    units: lots.map((lot, i) => ({ serial: `U${i}`, lot, setId: String(i), value: figure(1), decision: null, conditional: false })),
  };
}

describe("the device's stated band against the bands the sheet specifies", () => {
  const multiplier = frequencyMultiplierTemplate;
  const mixer = doubleBalancedMixerTemplate;
  const hybrid = quadratureHybridTemplate;
  const spot = (hz: number, rowId = "conversion-loss-at-drive") => group({ rowId, conditionsKey: `drive=10;inputFrequencyHz=${hz};temperatureC=25`, lots: ["A"] });
  const band = (startHz: number, stopHz: number, rowId = "insertion-loss-through") =>
    group({ rowId, conditionsKey: `path=S21;startHz=${startHz};statistic=worst;stopHz=${stopHz};temperatureC=25`, lots: ["A"] });

  it("fires when a stated band's edges are specified by no row (one spot frequency in the middle)", () => {
    const issues = checkStatedBands({ template: multiplier, keyConditions: { inputFrequencyHz: { min: 0.5 * GHz, max: 1.5 * GHz } }, groups: [spot(1 * GHz)] });
    expect(issues).toEqual([
      {
        code: "stated-band-not-specified",
        message:
          "The device's stated input band 0.5–1.5 GHz is specified only at 1 GHz: no row states its lower edge 500 MHz or its upper edge 1.5 GHz, " +
          "where a designer using the whole band needs a figure.",
      },
    ]);
  });

  it("stays quiet when rows stand at both edges of the band, the middle left to the curves", () => {
    const groups = [spot(0.5 * GHz), spot(1 * GHz), spot(1.5 * GHz)];
    expect(checkStatedBands({ template: multiplier, keyConditions: { inputFrequencyHz: { min: 0.5 * GHz, max: 1.5 * GHz } }, groups })).toEqual([]);
  });

  it("fires when a row's band reaches outside the stated band, even though it covers it", () => {
    const issues = checkStatedBands({ template: hybrid, keyConditions: { inputFrequencyHz: { min: 1.7 * GHz, max: 2.3 * GHz } }, groups: [band(1.5 * GHz, 2.5 * GHz)] });
    expect(issues.map((i) => i.code)).toEqual(["specified-outside-stated-band"]);
    expect(issues[0].message).toContain("at 1.5–2.5 GHz (Conversion loss), outside the device's stated band 1.7–2.3 GHz");
  });

  it("fires both ways when the rows start above the band and end beyond it", () => {
    const groups = [band(0.5 * GHz, 3 * GHz, "conversion-loss-worst")];
    const issues = checkStatedBands({ template: mixer, keyConditions: { inputFrequencyHz: { min: 5 * MHz, max: 2.5 * GHz } }, groups });
    expect(issues.map((i) => i.code)).toEqual(["specified-outside-stated-band", "stated-band-not-specified"]);
    expect(issues[1].message).toContain("stated RF band 5–2500 MHz is specified only over 0.5–3 GHz: no row states its lower edge 5 MHz,");
  });

  it("stays quiet when a band row matches the stated band exactly", () => {
    expect(checkStatedBands({ template: hybrid, keyConditions: { inputFrequencyHz: { min: 1.5 * GHz, max: 2.5 * GHz } }, groups: [band(1.5 * GHz, 2.5 * GHz)] })).toEqual([]);
  });

  it("compares a mixer's RF band only with the rows over the RF band, not a port's VSWR band", () => {
    const groups = [band(1 * GHz, 2 * GHz, "conversion-loss-worst"), group({ rowId: "vswr", conditionsKey: `port=2;startHz=${3 * GHz};statistic=worst;stopHz=${5 * GHz}`, lots: ["A"] })];
    expect(checkStatedBands({ template: mixer, keyConditions: { inputFrequencyHz: { min: 1 * GHz, max: 2 * GHz } }, groups })).toEqual([]);
  });

  it("stays quiet without a stated band, for a class that names no band, and for rows with neither data nor limit", () => {
    expect(checkStatedBands({ template: multiplier, keyConditions: {}, groups: [spot(1 * GHz)] })).toEqual([]);
    expect(checkStatedBands({ template: combGeneratorTemplate, keyConditions: { inputFrequencyHz: { min: 1, max: 2 * GHz } }, groups: [spot(1 * GHz)] })).toEqual([]);
    const empty = { ...spot(3 * GHz), n: 0, units: [] };
    expect(checkStatedBands({ template: multiplier, keyConditions: { inputFrequencyHz: { min: 1 * GHz, max: 1 * GHz } }, groups: [spot(1 * GHz), empty] })).toEqual([]);
  });
});

describe("a stated uncertainty against the instruments that produced the data (JCGM 100:2008 §5.1.2)", () => {
  const rows = [
    { parameter: "conversion-loss" as const, unit: "dB" },
    { parameter: "harmonic-suppression" as const, unit: "dBc" },
  ];
  const instrument = (serial: string, uncertainty: { quantity: string; value: number; unit: string; coverageFactor: number }[]) => ({
    kind: "instrument",
    model: "M",
    serial,
    calibratedOn: "2026-01-01",
    calibrationDueOn: "2027-01-01",
    uncertainty,
  });
  const source = instrument("SRC-1", [{ quantity: "output level", value: 0.6, unit: "dB", coverageFactor: 2 }]);
  const analyzer = instrument("SA-1", [
    { quantity: "absolute level", value: 0.4, unit: "dB", coverageFactor: 2 },
    { quantity: "relative level", value: 0.2, unit: "dB", coverageFactor: 2 },
    { quantity: "frequency", value: 1, unit: "Hz", coverageFactor: 2 },
  ]);
  const set = (instruments: ApprovedSetInput["instruments"], names = ["conversion-loss", "harmonic-suppression"]) => ({
    id: 7,
    serial: "U1",
    instruments,
    parameters: names.map((name) => ({ name, value: 1, unit: "dB", conditions: {} })),
  });

  it("fires when U (k = 2) is below 2·√Σ(U_i/k_i)² of the set's instruments, each at its smallest entry in dB", () => {
    const issues = checkStatedUncertainty({ rows, sets: [set([source, analyzer])], measurementUncertainty: { "conversion-loss": 0.5 } });
    // numpy 2.4.6: 2*np.sqrt(np.sum((np.array([0.6, 0.2])/2)**2)) = 0.6324555320336759
    expect(issues).toHaveLength(1);
    expect(issues[0].code).toBe("uncertainty-below-instruments");
    expect(issues[0].message).toContain("U = 0.5 dB (k = 2), is smaller than 0.632 dB (k = 2), the root-sum-square");
    expect(issues[0].message).toContain("measurement set 7 (SA-1 relative level 0.2 dB, k = 2; SRC-1 output level 0.6 dB, k = 2;");
  });

  it("stays quiet when U covers the instruments' combination", () => {
    expect(checkStatedUncertainty({ rows, sets: [set([source, analyzer])], measurementUncertainty: { "conversion-loss": 0.64 } })).toEqual([]);
  });

  it("takes each entry's own coverage factor: standard uncertainty U_i / k_i", () => {
    const analyzerK1 = instrument("SA-2", [{ quantity: "absolute level", value: 0.4, unit: "dB", coverageFactor: 1 }]);
    // numpy 2.4.6: 2*np.sqrt(np.sum((np.array([0.6, 0.4])/np.array([2, 1]))**2)) = 1.0
    const sets = [set([source, analyzerK1])];
    expect(checkStatedUncertainty({ rows, sets, measurementUncertainty: { "conversion-loss": 0.99 } })).toHaveLength(1);
    expect(checkStatedUncertainty({ rows, sets, measurementUncertainty: { "conversion-loss": 1.0 } })).toEqual([]);
  });

  it("compares a dBc figure, a ratio read by one receiver, with the smallest instrument alone, and says its uncertainty in dB", () => {
    const sets = [set([source, analyzer])];
    expect(checkStatedUncertainty({ rows, sets, measurementUncertainty: { "harmonic-suppression": 0.3 } })).toEqual([]);
    const issues = checkStatedUncertainty({ rows, sets, measurementUncertainty: { "harmonic-suppression": 0.15 } });
    expect(issues).toHaveLength(1);
    expect(issues[0].message).toContain("U = 0.15 dB (k = 2), is smaller than 0.2 dB (k = 2), the smallest stated uncertainty");
    expect(issues[0].message).not.toContain("dBc");
  });

  it("stays quiet without a stated U, for sets that do not carry the figure, and for instruments stating other units", () => {
    expect(checkStatedUncertainty({ rows, sets: [set([source, analyzer])], measurementUncertainty: undefined })).toEqual([]);
    expect(checkStatedUncertainty({ rows, sets: [set([source, analyzer], ["harmonic-suppression"])], measurementUncertainty: { "conversion-loss": 0.1 } })).toEqual([]);
    const phaseOnly = instrument("VNA-1", [{ quantity: "transmission phase", value: 1, unit: "°", coverageFactor: 2 }]);
    expect(checkStatedUncertainty({ rows, sets: [set([phaseOnly])], measurementUncertainty: { "conversion-loss": 0.1 } })).toEqual([]);
  });

  it("names the set with the largest combination", () => {
    const quiet = { ...set([analyzer]), id: 3 };
    const loud = { ...set([source, analyzer]), id: 9 };
    const issues = checkStatedUncertainty({ rows, sets: [quiet, loud], measurementUncertainty: { "conversion-loss": 0.3 } });
    expect(issues[0].message).toContain("measurement set 9");
  });
});

describe("the difference unit of a level", () => {
  it.each([
    ["dBm", "dB"],
    ["dBc", "dB"],
    ["dBc/Hz", "dB"],
    ["dB", "dB"],
    ["°", "°"],
    [":1", ":1"],
    ["fs", "fs"],
  ])("%s → %s", (unit, expected) => expect(differenceUnit(unit)).toBe(expected));
});

describe("what stands behind a guaranteed limit", () => {
  const rated = { min: -40, max: 85 };
  const at = (temperatureC: number, lots: (string | null)[], limit?: Parameters<typeof group>[0]["limit"], rowId = "cl") =>
    group({ rowId, conditionsKey: `inputFrequencyHz=1000000000;temperatureC=${temperatureC}`, lots, limit });

  it("reads a rated temperature range as the ratings write it", () => {
    expect(readTemperatureRange("−40 to +85")).toEqual({ min: -40, max: 85 });
    expect(readTemperatureRange("-55…+125")).toEqual({ min: -55, max: 125 });
    expect(readTemperatureRange("+25")).toBeNull();
    expect(readTemperatureRange("see note")).toBeNull();
  });

  it("fires on a characterization limit whose units come from one lot, or state none", () => {
    const issues = checkLimitSpread({ groups: [at(25, ["L1", "L1", "L1"], { max: 10, basis: "characterization" })], operatingTemperatureC: null });
    expect(issues).toEqual([
      {
        code: "limit-from-one-lot",
        message:
          "1 limit guaranteed by characterization rests on units of one lot, L1: Conversion loss. The data hold no lot-to-lot spread, so the next lot may not meet it.",
      },
    ]);
    const unstated = checkLimitSpread({ groups: [at(25, [null, null], { min: 1, basis: "characterization" })], operatingTemperatureC: null });
    expect(unstated[0].message).toContain("rests on units that state no lot");
  });

  it("stays quiet on two lots, on a limit guaranteed by test or design, and on a typical value alone", () => {
    expect(checkLimitSpread({ groups: [at(25, ["L1", "L2"], { max: 10, basis: "characterization" })], operatingTemperatureC: null })).toEqual([]);
    expect(checkLimitSpread({ groups: [at(25, ["L1", "L1"], { max: 10, basis: "test" })], operatingTemperatureC: null })).toEqual([]);
    expect(checkLimitSpread({ groups: [at(25, ["L1", "L1"], { max: 10, basis: "design" })], operatingTemperatureC: null })).toEqual([]);
    expect(checkLimitSpread({ groups: [at(25, ["L1", "L1"], { typ: 9, basis: "characterization" })], operatingTemperatureC: null })).toEqual([]);
  });

  it("fires when a guaranteed row has data at one temperature while the ratings span a range", () => {
    const issues = checkLimitSpread({ groups: [at(25, ["L1", "L2"], { max: 10, basis: "test" })], operatingTemperatureC: rated });
    expect(issues).toEqual([
      {
        code: "limit-at-one-temperature",
        message:
          "1 guaranteed limit rests on data at 25 °C only, while the operating temperature is rated −40 to +85 °C: Conversion loss. The behaviour over the rated range is not in the data.",
      },
    ]);
  });

  it("stays quiet when the row has data at other temperatures, when no range is rated, and for a design limit", () => {
    const overTemperature = [at(25, ["L1", "L2"], { max: 10, basis: "test" }), at(-40, ["L1", "L2"]), at(85, ["L1", "L2"])];
    expect(checkLimitSpread({ groups: overTemperature, operatingTemperatureC: rated })).toEqual([]);
    expect(checkLimitSpread({ groups: [at(25, ["L1", "L2"], { max: 10, basis: "test" })], operatingTemperatureC: null })).toEqual([]);
    expect(checkLimitSpread({ groups: [at(25, ["L1", "L2"], { max: 10, basis: "test" })], operatingTemperatureC: { min: 25, max: 25 } })).toEqual([]);
    expect(checkLimitSpread({ groups: [at(25, ["L1", "L2"], { max: 10, basis: "design" })], operatingTemperatureC: rated })).toEqual([]);
  });

  it("reads a row over temperature as the span it states, not as one unstated temperature", () => {
    const span = (min: number, max: number) =>
      group({ rowId: "cl-over-t", conditionsKey: `inputFrequencyHz=1000000000;temperatureMaxC=${max};temperatureMinC=${min}`, lots: ["L1", "L2"], limit: { max: 11.5, basis: "characterization" } });
    expect(checkLimitSpread({ groups: [span(-40, 85)], operatingTemperatureC: rated })).toEqual([]);
    // Without a span (a key that states neither) the row still counts as one temperature.
    const unstated = group({ rowId: "cl-over-t", conditionsKey: "inputFrequencyHz=1000000000", lots: ["L1", "L2"], limit: { max: 11.5, basis: "characterization" } });
    expect(checkLimitSpread({ groups: [unstated], operatingTemperatureC: rated }).map((i) => i.code)).toEqual(["limit-at-one-temperature"]);
  });

  it("fires when a characterization limit rests on fewer units than the organization's minimum", () => {
    const issues = checkLimitUnitCount({ groups: [at(25, ["L1", "L2", "L2"], { max: 10, basis: "characterization" })], minUnits: 5 });
    expect(issues).toEqual([
      { code: "limit-from-few-units", message: "1 limit guaranteed by characterization rests on fewer units than the organization's minimum of 5: Conversion loss, 3 units." },
    ]);
  });

  it("stays quiet at the minimum, for a limit guaranteed by test, and for a limit without data (flagged elsewhere)", () => {
    expect(checkLimitUnitCount({ groups: [at(25, ["a", "b", "c", "d", "e"], { max: 10, basis: "characterization" })], minUnits: 5 })).toEqual([]);
    expect(checkLimitUnitCount({ groups: [at(25, ["a"], { max: 10, basis: "test" })], minUnits: 5 })).toEqual([]);
    expect(checkLimitUnitCount({ groups: [at(25, [], { max: 10, basis: "characterization" })], minUnits: 5 })).toEqual([]);
  });
});

describe("the checks in the sheet model", () => {
  it("lists the checks made and what was not checked, and raises the checks' issues among the others", () => {
    const input = loadDoublerInput();
    const model = buildSheetModel({ ...input, settings: { ...input.settings, limitMinUnits: 1000 } });
    expect(model.reviewChecks).toEqual(reviewCheckStatements);
    expect(model.reviewChecks!.join(" ")).toMatch(/Not checked: the prose .* free text/);
    expect(model.issues.some((i) => i.code === "limit-from-few-units" && i.message.includes("minimum of 1000"))).toBe(true);
    expect(buildSheetModel(input).issues.some((i) => i.code === "limit-from-few-units")).toBe(false);
  });
});

describe("the uncertainty and spread of a level are said in dB", () => {
  it("in the statistics annex's unit beside the parameter", () => {
    expect(annexUnitText("dBc")).toBe("(dBc; s, U in dB)");
    expect(annexUnitText("dBc/Hz")).toBe("(dBc/Hz; s, U in dB)");
    expect(annexUnitText("dB")).toBe("(dB)");
    expect(annexUnitText("deg")).toBe("(°)");
  });

  it("in the decision rule", () => {
    const rule = describeDecisionRule("guard-band", 0.3, "dBc").replace(/\u00a0/g, " ");
    expect(rule).toContain("U = 0.3 dB (k = 2)");
    expect(rule).not.toContain("dBc");
  });
});

describe("spurs without the analyzer's bandwidth behind a spur row in dBc", () => {
  const checkSpurBandwidth = plain(checks.checkSpurBandwidth);
  const phaseNoiseSet = (id: number, parameters: ApprovedSetInput["parameters"]): ApprovedSetInput => ({
    id,
    kind: "phase-noise",
    serial: `BFD-09${id}`,
    temperatureC: 25,
    measuredOn: "2026-10-09",
    parameters,
    curves: [],
    instruments: [],
  });
  const asPlotted = (offsetHz: number) => ({ name: "spur", value: -120, unit: "dBc/Hz", conditions: { carrierFrequencyHz: 2 * GHz, offsetHz } });
  const inDbc = { name: "discrete-spur", value: -110, unit: "dBc", conditions: { carrierFrequencyHz: 2 * GHz, offsetHz: 1000, noiseBandwidthHz: 10, bandwidthSource: "file" } };
  const rows = frequencyMultiplierTemplate.specifications.rows;

  it("fires for a set whose spurs are known only as plotted, naming the set, the offsets and the row", () => {
    const issues = checkSpurBandwidth({ rows, sets: [phaseNoiseSet(7, [asPlotted(25000), asPlotted(50)]), phaseNoiseSet(8, [inDbc])] });
    expect(issues).toEqual([
      {
        code: "spur-bandwidth-missing",
        message:
          "Measurement set 7 (phase-noise, BFD-097) states no analyzer bandwidth: its 2 spurs at 50 Hz, 25 kHz are known only as plotted, in dBc/Hz, " +
          "and left out of worst discrete spur; state the resolution or noise bandwidth in the file or the upload (a corrected set) for the spur power in dBc.",
      },
    ]);
  });

  it("stays quiet when every spur is in dBc, when a set found no spur, and for a template without a spur row", () => {
    expect(checkSpurBandwidth({ rows, sets: [phaseNoiseSet(8, [inDbc]), phaseNoiseSet(9, [])] })).toEqual([]);
    expect(checkSpurBandwidth({ rows: doubleBalancedMixerTemplate.specifications.rows, sets: [phaseNoiseSet(7, [asPlotted(50)])] })).toEqual([]);
  });

  it("is among the sheet model's open issues, and the worst spur row is fed by the sets in dBc only", () => {
    const input = loadDoublerInput();
    const worst = { name: "worst-discrete-spur", value: -110, unit: "dBc", conditions: { carrierFrequencyHz: 2 * GHz, startHz: 10, stopHz: 1e6 } };
    const model = buildSheetModel({ ...input, approvedSets: [...input.approvedSets, phaseNoiseSet(901, [asPlotted(50)]), phaseNoiseSet(902, [inDbc, worst])] });
    expect(model.issues.filter((i) => i.code === "spur-bandwidth-missing").map((i) => i.message)).toEqual([expect.stringContaining("Measurement set 901 (phase-noise, BFD-09901)")]);
    const row = model.specifications.rows.find((r) => r.rowId === "worst-discrete-spur")!;
    expect(row).toMatchObject({ unit: "dBc", n: 1, label: "Worst discrete spur" });
    expect(row.typ.value).toBe(-110);
  });
});
