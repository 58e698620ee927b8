import { describe, expect, it } from "vitest";
import { buildSheetModel, type SheetInput } from "@/lib/sheet";
import { describeAbsentCpk, formatCpkInterval, formatLimitValue, formatPassCount, typicalDecimals } from "@/lib/sheet/format";
import { computeCpkConfidenceInterval } from "@/lib/stats";
import { computeGroupStatistics, type UnitValue } from "@/lib/sheet/statistics";
import type { SpecLimitInput } from "@/lib/sheet/types";
import { specLimitsBodySchema } from "@/lib/schemas/sheets";
import { checkLimitDrafts, draftOf, type EditorRow } from "@/components/sheets/spec-limits-state";
import { flatDriveCurves, loadDoublerInput } from "./fixture";

const CL_2GHZ = "drive=10;inputFrequencyHz=2000000000;temperatureC=25";

function units(values: number[]): UnitValue[] {
  return values.map((value, i) => ({ serial: `U-${i + 1}`, lot: "L1", setId: String(i + 1), value }));
}

function stats(values: number[], limit: SpecLimitInput | undefined, cpkMinUnits = 10) {
  return computeGroupStatistics({
    label: "Conversion loss",
    unit: "dB",
    decimals: 2,
    values: units(values),
    limit,
    expandedUncertainty: undefined,
    cpkThreshold: 1.33,
    cpkMinUnits,
    coverage: 0.99,
    confidence: 0.95,
  });
}

const maxLimit = (max: number): SpecLimitInput => ({ parameter: "conversion-loss", conditionsKey: CL_2GHZ, max, unit: "dB", basis: "test" });

describe("a limit prints with the digits the engineer typed", () => {
  it("keeps typed decimals whatever the template's: 9.5 stays 9.5, 10.0 stays 10.0", () => {
    expect(formatLimitValue(9.5, 1).text).toBe("9.5");
    expect(formatLimitValue(10, 1).text).toBe("10.0");
    expect(formatLimitValue(-155, 1).text).toBe("\u2212155.0");
    expect(formatLimitValue(9.5, 2).text).toBe("9.50");
  });

  it("without typed digits prints the stored number's shortest exact form, never an invented zero", () => {
    expect(formatLimitValue(9.5, undefined).text).toBe("9.5");
    expect(formatLimitValue(10, undefined).text).toBe("10");
    expect(formatLimitValue(0.1 + 0.2, undefined).text).toBe("0.3");
    expect(formatLimitValue(null, undefined).text).toBe("");
  });

  it("flows through the sheet model (one model for the web sheet and the PDF)", () => {
    const base = loadDoublerInput();
    const withLimit = (limit: SpecLimitInput): SheetInput => ({
      ...base,
      limits: [...base.limits.filter((l) => !(l.parameter === limit.parameter && l.conditionsKey === limit.conditionsKey)), limit],
    });
    const typed = buildSheetModel(withLimit({ ...maxLimit(12), min: 9.5, decimals: { min: 1, max: 1 } }));
    const row = typed.specifications.rows.find((r) => r.rowId === "conversion-loss-at-drive" && r.conditionsKey === CL_2GHZ)!;
    expect([row.min.text, row.max.text]).toEqual(["9.5", "12.0"]);
    const group = typed.statistics.groups.find((g) => g.groupId === row.groupId)!;
    expect([group.limits?.min.text, group.limits?.max.text]).toEqual(["9.5", "12.0"]);
    const untyped = buildSheetModel(withLimit({ ...maxLimit(12), min: 9.5 }));
    const plain = untyped.specifications.rows.find((r) => r.groupId === row.groupId)!;
    expect([plain.min.text, plain.max.text]).toEqual(["9.5", "12"]);
  });

  it("the limits editor sends the typed decimals and shows a saved limit as typed", () => {
    const row = { key: "k", parameter: "conversion-loss", conditionsKey: CL_2GHZ, unit: "dB" } as EditorRow;
    const checked = checkLimitDrafts([row], () => ({ min: "", typ: "9.50", max: "10.0", basis: "test", footnote: "" }));
    expect(checked.limits[0]).toMatchObject({ typ: 9.5, max: 10, decimals: { typ: 2, max: 1 } });
    expect(draftOf(checked.limits[0], "test")).toMatchObject({ typ: "9.50", max: "10.0" });
  });

  it("the API refuses typed decimals that would print another number, naming the figure", () => {
    const body = (decimals: object) => ({ limits: [{ parameter: "conversion-loss", conditionsKey: CL_2GHZ, max: 9.55, unit: "dB", basis: "test", decimals }] });
    const refused = specLimitsBodySchema.safeParse(body({ max: 1 }));
    expect(refused.success).toBe(false);
    expect(refused.error?.issues[0]).toMatchObject({ path: ["limits", 0, "decimals", "max"] });
    expect(specLimitsBodySchema.safeParse(body({ max: 2 })).success).toBe(true);
    expect(specLimitsBodySchema.safeParse(body({ max: 3 })).success).toBe(true);
    expect(specLimitsBodySchema.safeParse(body({ max: 16 })).success).toBe(false);
  });
});

describe("a typical value taken from the units prints with the digits their spread supports", () => {
  // JCGM 100:2008 §7.2.6: an uncertainty is quoted to at most two significant digits and the estimate
  // rounded to match (the §7.2.2 example, from memory: m_S = 100.021 47 g with u_c = 0.35 mg ends at the
  // uncertainty's last digit). Benchfold keeps one significant digit of the spread s of the units.
  it.each([
    { s: 0.31, decimals: 1 },
    { s: 0.35, decimals: 1 },
    { s: 0.04, decimals: 2 },
    { s: 0.096, decimals: 1 }, // s rounds to 0.1 first
    { s: 3.2, decimals: 0 },
    { s: 31, decimals: 0 }, // never fewer than no decimals
    { s: 0.004, decimals: 2 }, // never more than the template's
  ])("s = $s gives $decimals decimals (template 2)", ({ s, decimals }) => {
    expect(typicalDecimals({ standardDeviation: s, n: 10, templateDecimals: 2 })).toBe(decimals);
  });

  it("stays quiet with one unit or no spread: the template's decimals", () => {
    expect(typicalDecimals({ standardDeviation: Number.NaN, n: 1, templateDecimals: 2 })).toBe(2);
    expect(typicalDecimals({ standardDeviation: 0, n: 5, templateDecimals: 2 })).toBe(2);
  });

  it("rounds the measured mean on the sheet; a stated typ keeps its typed digits", () => {
    const base = loadDoublerInput();
    const set = base.approvedSets[0];
    // mean 10.47, s = 0.3028 (numpy: x.mean(), x.std(ddof=1)): one decimal.
    const values = [10.02, 10.12, 10.22, 10.32, 10.42, 10.52, 10.62, 10.72, 10.82, 10.92];
    const sets = values.map((value, i) => ({
      ...set,
      id: 9000 + i,
      serial: `P-${i}`,
      parameters: [{ name: "conversion-loss", value, unit: "dB", conditions: { drive: "optimum", inputFrequencyHz: 2e9 } }],
      curves: flatDriveCurves({ conversionLossDb: value }),
    }));
    const measured = buildSheetModel({ ...base, approvedSets: sets, limits: [] });
    const row = measured.specifications.rows.find((r) => r.conditionsKey === CL_2GHZ)!;
    expect(row.typIsMeasuredMean).toBe(true);
    expect(row.typ.text).toBe("10.5");
    const stated = buildSheetModel({ ...base, approvedSets: sets, limits: [{ ...maxLimit(12), typ: 10.47, decimals: { typ: 2 } }] });
    expect(stated.specifications.rows.find((r) => r.conditionsKey === CL_2GHZ)!.typ.text).toBe("10.47");
    // Its footnote says how it was rounded: to the decade of the units' spread.
    const footnote = (model: typeof measured, r: (typeof measured)["specifications"]["rows"][number]) => model.specifications.footnotes.find((f) => r.footnoteMarks.includes(f.mark))!.text;
    expect(footnote(measured, row)).toMatch(/rounded to the decade of their spread s/);

    // One unit has no spread: the row's usual decimals, and a footnote that says so instead.
    const one = buildSheetModel({ ...base, approvedSets: sets.slice(0, 1), limits: [] });
    const single = one.specifications.rows.find((r) => r.conditionsKey === CL_2GHZ)!;
    expect(single.n).toBe(1);
    expect(single.typ.text).toBe("10.02");
    expect(footnote(one, single)).toMatch(/^No typical value is stated: the figure is the one unit measured/);
    expect(one.specifications.footnotes.some((f) => /decade of their spread/.test(f.text))).toBe(false);
  });
});

describe("Cpk is printed only from enough units", () => {
  // Ten units 10.0 … 10.9 dB against max 11.5 dB: mean 10.45, s 0.302765, Cpk = (11.5 − 10.45)/(3 s) = 1.156012
  // (numpy: (11.5 - x.mean()) / (3 * x.std(ddof=1)); Cpk per NIST/SEMATECH e-Handbook §6.1.6).
  const ten = [10.0, 10.1, 10.2, 10.3, 10.4, 10.5, 10.6, 10.7, 10.8, 10.9];

  it("states Cpk from the organization's minimum of units on", () => {
    const g = stats(ten, maxLimit(11.5));
    expect(g.cpk.text).toBe("1.16");
    expect(g.cpk.value).toBeCloseTo(1.1560119533826791, 9);
    expect(g.cpkAbsentReason).toBeNull();
  });

  it("leaves it blank below, says why, and still judges it against the threshold", () => {
    // Five units 10.0, 10.6, 10.2, 10.9, 10.4: mean 10.42, s 0.349285; Cpk against 11.5 is 1.0307 (numpy), below 1.33.
    const g = stats([10.0, 10.6, 10.2, 10.9, 10.4], maxLimit(11.5));
    expect(g.cpk).toEqual({ value: null, text: "" });
    expect(g.cpkAbsentReason).toContain("5 units were measured, fewer than the 10");
    expect(g.flags.map((f) => f.code)).toEqual(["cpk-below-threshold"]);
    expect(g.flags[0].message).not.toMatch(/1\.03/);
  });

  it("follows the setting: from 5 units when the organization says 5", () => {
    const g = stats([10.0, 10.6, 10.2, 10.9, 10.4], maxLimit(11.5), 5);
    expect(g.cpk.text).toBe("1.03");
    expect(g.cpkAbsentReason).toBeNull();
  });

  it("says nothing of Cpk where there is no limit", () => {
    const g = stats([10.0, 10.6, 10.2], undefined);
    expect(g.cpkAbsentReason).toBeNull();
    expect(g.flags).toEqual([]);
  });

  it("the annex sentence counts the limits whose Cpk is blank, and is absent when none is", () => {
    const text = describeAbsentCpk({ cpkMinUnits: 10, groups: [{ cpkAbsentReason: "x" }, {}, { cpkAbsentReason: "y" }] });
    expect(text).toContain("Cpk is left blank for 2 limits: fewer than the 10 units");
    expect(describeAbsentCpk({ cpkMinUnits: 10, groups: [{}, {}] })).toBeNull();
  });

  it("the doubler's sheet: 3-unit temperature groups with a limit have no Cpk; the 10-unit ones do", () => {
    const model = buildSheetModel(loadDoublerInput());
    expect(model.statistics.cpkMinUnits).toBe(10);
    for (const g of model.statistics.groups) {
      if (g.cpkAbsentReason) {
        expect(g.n).toBeLessThan(10);
        expect(g.cpk.text).toBe("");
      }
      if (g.cpk.text) expect(g.n).toBeGreaterThanOrEqual(10);
    }
  });
});

describe("pass counts only where a limit exists", () => {
  it("a min or max gives k/n", () => {
    const g = stats(ten(), maxLimit(10.55));
    expect(formatPassCount(g)).toBe("6/10");
  });

  it("a typ alone, or no limit, judges nothing: blank", () => {
    const typOnly: SpecLimitInput = { parameter: "conversion-loss", conditionsKey: CL_2GHZ, typ: 10.5, unit: "dB", basis: "characterization" };
    expect(formatPassCount(stats(ten(), typOnly))).toBe("");
    expect(formatPassCount(stats(ten(), undefined))).toBe("");
  });

  function ten() {
    return [10.0, 10.1, 10.2, 10.3, 10.4, 10.5, 10.6, 10.7, 10.8, 10.9];
  }
});


describe("a printed Cpk carries its confidence interval", () => {
  it("at the sheet's stated confidence, by Bissell's approximation, and none where Cpk is left blank", () => {
    const input = loadDoublerInput();
    const model = buildSheetModel({ ...input, settings: { ...input.settings, cpkMinUnits: 2 } });
    const printed = model.statistics.groups.filter((g) => g.cpk.text !== "");
    expect(printed.length).toBeGreaterThan(0);
    for (const g of printed) {
      const interval = computeCpkConfidenceInterval({ cpk: g.cpk.value!, sampleSize: g.n, confidence: input.settings.toleranceConfidence });
      // Two decimals, as the Cpk itself; the interval of the unrounded Cpk within half a last digit of the printed one's.
      expect(Math.abs(g.cpkInterval!.lower.value! - interval.lower)).toBeLessThanOrEqual(0.0051);
      expect(Math.abs(g.cpkInterval!.upper.value! - interval.upper)).toBeLessThanOrEqual(0.0051);
      expect(formatCpkInterval(g)).toBe(`${g.cpkInterval!.lower.text}\u2013${g.cpkInterval!.upper.text}`);
    }
    const blank = buildSheetModel(input).statistics.groups.filter((g) => g.cpk.text === "");
    for (const g of blank) expect(g.cpkInterval).toBeUndefined();
  });
});
