import { describe, expect, it } from "vitest";
import {
  buildSheetModel,
  diffIsEmpty,
  diffRowAnchorId,
  diffSheetModels,
  summaryLines,
  type LimitFieldChange,
  type SheetInput,
  type SheetModel,
  type SpecLimitInput,
  type SpecRowChange,
} from "@/lib/sheet";
import { readChart, typicalCurve } from "@/lib/sheet/diff-charts";
import { frequencyMultiplierTemplate } from "@/templates";
import type { SheetTemplate } from "@/templates/types";
import { loadDoublerInput, shuffled } from "./fixture";

const NBSP = "\u00a0";
const CL_2GHZ = "drive=10;inputFrequencyHz=2000000000;temperatureC=25";
const CL_3GHZ = "drive=10;inputFrequencyHz=3000000000;temperatureC=25";
/** No unit was measured at 5 or 6 GHz: a limit there makes a row of its own. */
const CL_5GHZ = "drive=10;inputFrequencyHz=5000000000;temperatureC=25";
const CL_6GHZ = "drive=10;inputFrequencyHz=6000000000;temperatureC=25";
const HS1_2GHZ = "drive=10;inputFrequencyHz=2000000000;order=1;temperatureC=25";
const CL_ROW = "conversion-loss-at-drive";
const CL_2GHZ_NAME = `Conversion loss (Frequency 2${NBSP}GHz in, Drive +10${NBSP}dBm per port, T_A 25${NBSP}°C)`;

const base = loadDoublerInput();
/** The released revision A: the fixture as it stands. */
const revA: SheetModel = buildSheetModel({ ...base, revision: { ...base.revision, label: "A", state: "released" } });

/** The fixture with its limits changed by `edit`: (parameter, conditionsKey) → the limit, or null to drop it. */
function withLimits(edit: (limit: SpecLimitInput) => SpecLimitInput | null, extra: SpecLimitInput[] = []): SheetInput {
  const input = structuredClone(base);
  input.limits = [...input.limits.map(edit).filter((l): l is SpecLimitInput => l !== null), ...extra];
  return input;
}

const isLimit = (parameter: string, key: string) => (limit: SpecLimitInput) => limit.parameter === parameter && limit.conditionsKey === key;

function editLimit(parameter: string, key: string, change: Partial<SpecLimitInput> | null): SheetInput {
  const match = isLimit(parameter, key);
  return withLimits((limit) => (match(limit) ? (change === null ? null : { ...limit, ...change }) : limit));
}

function candidate(input: SheetInput, template?: SheetTemplate): SheetModel {
  return buildSheetModel(input, template ? { template } : {});
}

function rowChange(diff: ReturnType<typeof diffSheetModels>, groupId: string): SpecRowChange {
  const found = diff.rows.find((r) => r.groupId === groupId);
  if (!found) throw new Error(`no change for ${groupId}: ${diff.rows.map((r) => r.groupId).join(", ")}`);
  return found;
}

function limitField(change: SpecRowChange, field: "min" | "typ" | "max"): LimitFieldChange {
  const found = change.fields.find((f) => f.field === field);
  if (!found || !("effect" in found)) throw new Error(`no ${field} change`);
  return found;
}

/** The row changes that are not just a measured mean moving with the data. */
const decidedChanges = (rows: SpecRowChange[]) => rows.filter((r) => !(r.kind === "changed" && r.fields.every((f) => f.field === "typ" && f.measuredMean)));

describe("diffSheetModels: nothing to compare", () => {
  it("finds nothing between a model and itself", () => {
    const diff = diffSheetModels(revA, buildSheetModel({ ...base, revision: { ...base.revision, label: "A", state: "released" } }));
    expect(diffIsEmpty(diff)).toBe(true);
    expect(summaryLines(diff)).toEqual([]);
    expect(diff.rows).toEqual([]);
    expect(diff.charts.length).toBe(revA.charts.length);
    expect(diff.charts.every((c) => c.presence === "both" && c.panels.every((p) => !p.changed))).toBe(true);
  });

  it("says a first release compares against nothing", () => {
    const diff = diffSheetModels(null, revA);
    expect(diff.firstRelease).toBe(true);
    expect(diff.previousLabel).toBeNull();
    expect(diffIsEmpty(diff)).toBe(false);
    expect(summaryLines(diff)).toEqual(["First release."]);
  });

  it("names the sides after the previous revision's letter and the candidate", () => {
    const diff = diffSheetModels(revA, candidate(base));
    expect(diff.previousLabel).toBe("Rev. A");
    expect(diff.nextLabel).toBe("Candidate");
    expect(diffSheetModels(revA, revA, { previousLabel: "Submitted", nextLabel: "Now" })).toMatchObject({ previousLabel: "Submitted", nextLabel: "Now" });
  });
});

describe("diffSheetModels: spec-table limits", () => {
  it("a lower max tightens", () => {
    const diff = diffSheetModels(revA, candidate(editLimit("conversion-loss", CL_2GHZ, { max: 11.5 })));
    const change = rowChange(diff, `${CL_ROW}:${CL_2GHZ}`);
    expect(change.kind).toBe("tightened");
    expect(limitField(change, "max")).toMatchObject({ direction: "down", effect: "tightened", previousText: `12${NBSP}dB`, nextText: `11.5${NBSP}dB` });
    expect(decidedChanges(diff.rows)).toHaveLength(1);
    expect(summaryLines(diff)).toEqual([`${CL_2GHZ_NAME}: max 12${NBSP}dB → 11.5${NBSP}dB (tightened)`]);
    expect(diffIsEmpty(diff)).toBe(false);
  });

  it("a higher max loosens", () => {
    const diff = diffSheetModels(revA, candidate(editLimit("conversion-loss", CL_2GHZ, { max: 12.5 })));
    const change = rowChange(diff, `${CL_ROW}:${CL_2GHZ}`);
    expect(change.kind).toBe("loosened");
    expect(limitField(change, "max")).toMatchObject({ direction: "up", effect: "loosened" });
    expect(summaryLines(diff)).toEqual([`${CL_2GHZ_NAME}: max 12${NBSP}dB → 12.5${NBSP}dB (loosened)`]);
  });

  it("a higher min tightens and a lower min loosens", () => {
    const up = rowChange(diffSheetModels(revA, candidate(editLimit("harmonic-suppression", HS1_2GHZ, { min: 28 }))), `fundamental-suppression:${HS1_2GHZ}`);
    expect(up.kind).toBe("tightened");
    expect(limitField(up, "min")).toMatchObject({ direction: "up", effect: "tightened", previousText: `27${NBSP}dBc`, nextText: `28${NBSP}dBc` });
    const down = rowChange(diffSheetModels(revA, candidate(editLimit("harmonic-suppression", HS1_2GHZ, { min: 25.5 }))), `fundamental-suppression:${HS1_2GHZ}`);
    expect(down.kind).toBe("loosened");
    expect(limitField(down, "min")).toMatchObject({ direction: "down", effect: "loosened" });
  });

  it("a limit stated where there was none tightens; one withdrawn loosens", () => {
    const added = rowChange(diffSheetModels(revA, candidate(editLimit("conversion-loss", CL_2GHZ, { min: 8 }))), `${CL_ROW}:${CL_2GHZ}`);
    expect(added.kind).toBe("tightened");
    expect(limitField(added, "min")).toMatchObject({ direction: null, effect: "tightened", previousText: "", nextText: `8${NBSP}dB` });
    const withdrawn = diffSheetModels(revA, candidate(editLimit("conversion-loss", CL_2GHZ, { max: undefined })));
    const change = rowChange(withdrawn, `${CL_ROW}:${CL_2GHZ}`);
    expect(change.kind).toBe("loosened");
    expect(limitField(change, "max")).toMatchObject({ direction: null, effect: "loosened", nextText: "" });
    expect(summaryLines(withdrawn)).toEqual([`${CL_2GHZ_NAME}: max 12${NBSP}dB → none (loosened)`]);
  });

  it("a changed typ is neutral: it is not a guarantee", () => {
    const diff = diffSheetModels(revA, candidate(editLimit("conversion-loss", CL_2GHZ, { typ: 10.4 })));
    const change = rowChange(diff, `${CL_ROW}:${CL_2GHZ}`);
    expect(change.kind).toBe("changed");
    expect(change.fields).toHaveLength(1);
    expect(limitField(change, "typ")).toMatchObject({ direction: "down", effect: "neutral", measuredMean: false });
    expect(summaryLines(diff)).toEqual([`${CL_2GHZ_NAME}: typ 10.6${NBSP}dB → 10.4${NBSP}dB`]);
  });

  it("lists a row with one limit tightened and another loosened among the tightened, each field with its own effect", () => {
    const diff = diffSheetModels(revA, candidate(editLimit("conversion-loss", CL_2GHZ, { min: 9, max: 12.5 })));
    const change = rowChange(diff, `${CL_ROW}:${CL_2GHZ}`);
    expect(change.kind).toBe("tightened");
    expect(limitField(change, "min").effect).toBe("tightened");
    expect(limitField(change, "max").effect).toBe("loosened");
  });

  it("reports a row added and a row removed, and orders tightened, loosened, added, removed, other", () => {
    const limit5: SpecLimitInput = { parameter: "conversion-loss", conditionsKey: CL_5GHZ, max: 13, unit: "dB", basis: "characterization" };
    const withRow = buildSheetModel({ ...structuredClone(base), limits: [...base.limits, limit5] });
    expect(withRow.specifications.rows.some((r) => r.conditionsKey === CL_5GHZ)).toBe(true);

    const added = diffSheetModels(revA, withRow);
    expect(rowChange(added, `${CL_ROW}:${CL_5GHZ}`)).toMatchObject({ kind: "added", previous: null, fields: [] });
    expect(summaryLines(added)).toEqual([`Added: Conversion loss (Frequency 5${NBSP}GHz in, Drive +10${NBSP}dBm per port, T_A 25${NBSP}°C): max 13${NBSP}dB`]);

    const removed = diffSheetModels(withRow, revA);
    expect(rowChange(removed, `${CL_ROW}:${CL_5GHZ}`)).toMatchObject({ kind: "removed", next: null });
    expect(summaryLines(removed)).toEqual([`Removed: Conversion loss (Frequency 5${NBSP}GHz in, Drive +10${NBSP}dBm per port, T_A 25${NBSP}°C)`]);

    // All five kinds at once: 3 GHz max loosened, 2 GHz max tightened, 5 GHz added, 6 GHz removed, HS1 typ changed.
    const all = withLimits(
      (limit) =>
        isLimit("conversion-loss", CL_2GHZ)(limit)
          ? { ...limit, max: 11 }
          : isLimit("conversion-loss", CL_3GHZ)(limit)
            ? { ...limit, max: 12 }
            : isLimit("harmonic-suppression", HS1_2GHZ)(limit)
              ? { ...limit, typ: 32 }
              : limit,
      [limit5],
    );
    const previous = buildSheetModel({ ...structuredClone(base), limits: [...base.limits, { ...limit5, conditionsKey: CL_6GHZ }] });
    const mixed = diffSheetModels(previous, candidate(all));
    expect(decidedChanges(mixed.rows).map((r) => [r.kind, r.groupId])).toEqual([
      ["tightened", `${CL_ROW}:${CL_2GHZ}`],
      ["loosened", `${CL_ROW}:${CL_3GHZ}`],
      ["added", `${CL_ROW}:${CL_5GHZ}`],
      ["removed", `${CL_ROW}:${CL_6GHZ}`],
      ["changed", `fundamental-suppression:${HS1_2GHZ}`],
    ]);
  });

  it("lists a basis change apart from the limit changes", () => {
    const diff = diffSheetModels(revA, candidate(editLimit("conversion-loss", CL_2GHZ, { basis: "characterization" })));
    expect(diff.rows).toEqual([]);
    expect(diff.basisChanges).toHaveLength(1);
    expect(diff.basisChanges[0]).toMatchObject({ groupId: `${CL_ROW}:${CL_2GHZ}`, previous: "test", next: "characterization" });
    expect(summaryLines(diff)).toEqual([`${CL_2GHZ_NAME}: basis test → characterization`]);
  });

  it("gives every row change its own anchor id, safe in a URL fragment", () => {
    const a = diffRowAnchorId(`${CL_ROW}:${CL_2GHZ}`);
    const b = diffRowAnchorId(`${CL_ROW}:${CL_3GHZ}`);
    expect(a).not.toBe(b);
    expect(a).toMatch(/^diff-row-[A-Za-z0-9_-]+$/);
    // "_" itself is escaped, so "a_3d_b" and "a=b" cannot meet.
    expect(diffRowAnchorId("a=b")).not.toBe(diffRowAnchorId("a_3d_b"));
    const diff = diffSheetModels(revA, candidate(editLimit("conversion-loss", CL_2GHZ, { max: 11.5 })));
    expect(rowChange(diff, `${CL_ROW}:${CL_2GHZ}`).anchorId).toBe(a);
  });

  it("does not report a measured mean that moved below the printed digits", () => {
    // Dropping one unit moves every measured mean a little; rows whose printed typ is the same are not changed.
    const input = structuredClone(base);
    input.approvedSets = input.approvedSets.filter((s) => s.serial !== "HX-0101");
    const diff = diffSheetModels(revA, candidate(input));
    for (const row of diff.rows.filter((r) => r.kind === "changed")) {
      for (const field of row.fields) if ("effect" in field) expect(field.previousText).not.toBe(field.nextText);
    }
    const dataOnly = diff.rows.filter((r) => r.kind === "changed" && r.fields.every((f) => f.field === "typ" && f.measuredMean));
    expect(dataOnly.length).toBeGreaterThan(0);
    expect(summaryLines(diff)).toContain(`Measured typical values (no typ stated) moved with the data in ${dataOnly.length} rows`);
  });
});

describe("diffSheetModels: units", () => {
  /** The multiplier's template with the conversion-loss row in another unit: enough to change a row's unit between revisions. */
  function templateWithUnit(unit: string): SheetTemplate {
    return {
      ...frequencyMultiplierTemplate,
      specifications: {
        ...frequencyMultiplierTemplate.specifications,
        rows: frequencyMultiplierTemplate.specifications.rows.map((row) => (row.id === CL_ROW ? { ...row, unit } : row)),
      },
    };
  }
  const inUnit = (unit: string, max: number) => candidate(editLimit("conversion-loss", CL_2GHZ, { unit, max }), templateWithUnit(unit));

  it("compares limits across an SI prefix: 2400 MHz and 2.40 GHz are the same limit", () => {
    const diff = diffSheetModels(inUnit("MHz", 2400), inUnit("GHz", 2.4));
    const change = rowChange(diff, `${CL_ROW}:${CL_2GHZ}`);
    expect(change.kind).toBe("changed");
    expect(change.fields.filter((f) => f.field !== "typ")).toEqual([{ field: "unit", previous: "MHz", next: "GHz", convertible: true }]);
  });

  it("finds the direction across an SI prefix: 2400 MHz → 2.5 GHz loosens a max", () => {
    const change = rowChange(diffSheetModels(inUnit("MHz", 2400), inUnit("GHz", 2.5)), `${CL_ROW}:${CL_2GHZ}`);
    expect(change.kind).toBe("loosened");
    expect(limitField(change, "max")).toMatchObject({ direction: "up", effect: "loosened", previousText: `2400${NBSP}MHz`, nextText: `2.5${NBSP}GHz` });
  });

  it("never converts dB-type units: dB → dBm is reported, not compared", () => {
    const diff = diffSheetModels(revA, inUnit("dBm", 11));
    const change = rowChange(diff, `${CL_ROW}:${CL_2GHZ}`);
    expect(change.kind).toBe("changed");
    expect(limitField(change, "max")).toMatchObject({ direction: null, effect: "incomparable" });
    expect(change.fields).toContainEqual({ field: "unit", previous: "dB", next: "dBm", convertible: false });
    const line = summaryLines(diff).find((l) => l.startsWith(CL_2GHZ_NAME))!;
    expect(line).toContain(`max 12${NBSP}dB → 11${NBSP}dBm (units differ, not compared)`);
    expect(line).toContain("unit dB → dBm");
  });
});

describe("diffSheetModels: prose, ratings, cautions, sets", () => {
  it("diffs a prose section by word and leaves unchanged sections out", () => {
    const input = structuredClone(base);
    input.prose.description = base.prose.description!.replace("passive frequency doubler", "rugged passive frequency multiplier");
    const diff = diffSheetModels(revA, candidate(input));
    expect(diff.prose.map((p) => p.sectionId)).toEqual(["description"]);
    const [section] = diff.prose;
    expect(section).toMatchObject({ title: "Description", anchorId: "diff-prose-description", insertedWords: 2, deletedWords: 1 });
    expect(section.parts.filter((p) => p.change === "inserted").map((p) => p.text.trim())).toEqual(["rugged", "multiplier"]);
    expect(section.parts.filter((p) => p.change === "deleted").map((p) => p.text.trim())).toEqual(["doubler"]);
    // The unchanged words, in order, give back the words the two texts share.
    const kept = section.parts.filter((p) => p.change !== "inserted").map((p) => p.text).join("");
    const made = section.parts.filter((p) => p.change !== "deleted").map((p) => p.text).join("");
    expect(kept.replace(/\s+/g, " ")).toContain("passive frequency doubler");
    expect(made.replace(/\s+/g, " ")).toContain("rugged passive frequency multiplier");
    expect(summaryLines(diff)).toEqual(["Prose changed: Description"]);
  });

  it("reports ratings changed, added and removed by label", () => {
    const input = structuredClone(base);
    input.absoluteMaximumRatings = input.absoluteMaximumRatings.map((r) => (r.label === "RF input power, per port" ? { ...r, value: "+23" } : r));
    input.absoluteMaximumRatings.push({ label: "DC current, per diode", value: "20", unit: "mA" });
    const next = candidate(input);
    const diff = diffSheetModels(revA, next);
    expect(diff.ratings).toEqual([
      { label: "RF input power, per port", kind: "changed", previous: { value: "+20", unit: "dBm", missing: false }, next: { value: "+23", unit: "dBm", missing: false } },
      { label: "DC current, per diode", kind: "added", previous: null, next: { value: "20", unit: "mA", missing: false } },
    ]);
    expect(summaryLines(diff)).toEqual([
      `Absolute maximum rating changed: RF input power, per port +20${NBSP}dBm → +23${NBSP}dBm`,
      `Absolute maximum rating added: DC current, per diode 20${NBSP}mA`,
    ]);
    expect(diffSheetModels(next, revA).ratings.map((r) => [r.kind, r.label])).toEqual([
      ["changed", "RF input power, per port"],
      ["removed", "DC current, per diode"],
    ]);
  });

  it("reports cautions added and removed", () => {
    const template: SheetTemplate = { ...frequencyMultiplierTemplate, cautions: [...frequencyMultiplierTemplate.cautions.slice(1), "Keep the lid on during bake-out."] };
    const diff = diffSheetModels(revA, candidate(base, template));
    expect(diff.cautions).toEqual({ added: ["Keep the lid on during bake-out."], removed: [frequencyMultiplierTemplate.cautions[0]] });
    expect(summaryLines(diff)).toContain("Caution added: Keep the lid on during bake-out.");
  });

  it("reports measurement sets added and removed with serial, kind and date", () => {
    const fewer = structuredClone(base);
    fewer.approvedSets = fewer.approvedSets.filter((s) => s.serial !== "HX-0101");
    const dropped = base.approvedSets.filter((s) => s.serial === "HX-0101");
    expect(dropped.length).toBeGreaterThan(0);
    const fewerModel = candidate(fewer);

    const removed = diffSheetModels(revA, fewerModel).measurementSets;
    expect(removed.added).toEqual([]);
    expect(removed.removed.map((s) => s.id).sort()).toEqual(dropped.map((s) => String(s.id)).sort());
    expect(removed.removed[0]).toMatchObject({ serial: "HX-0101", kind: "drive-sweep", measuredOn: "2026-01-05" });

    const addedDiff = diffSheetModels(fewerModel, revA);
    expect(addedDiff.measurementSets.removed).toEqual([]);
    expect(addedDiff.measurementSets.added).toHaveLength(dropped.length);
    // Six sets are named, the rest counted.
    expect(dropped).toHaveLength(8);
    expect(summaryLines(addedDiff)).toContain(
      "Measurement sets added (8): " +
        addedDiff.measurementSets.added
          .slice(0, 6)
          .map((s) => `HX-0101, ${s.kind === "drive-sweep" ? "drive sweep" : "phase noise"}, ${s.measuredOn}`)
          .join("; ") +
        "; and 2 more",
    );
  });

  it("reports header and key-fact changes", () => {
    const input = structuredClone(base);
    input.device.title = `${base.device.title}, rugged`;
    input.device.keyConditions = { ...base.device.keyConditions, driveLevelDbm: 13, multiplicationFactor: undefined };
    const diff = diffSheetModels(revA, candidate(input));
    expect(diff.details).toEqual([
      { label: "Title", previous: base.device.title, next: `${base.device.title}, rugged` },
      { label: "Drive level, per port", previous: `+10${NBSP}dBm`, next: `+13${NBSP}dBm` },
      { label: "Multiplication factor", previous: "×2", next: null },
    ]);
    const lines = summaryLines(diff);
    expect(lines.filter((line) => !/^(Added|Removed): /.test(line))).toEqual([
      `Title: ${base.device.title} → ${base.device.title}, rugged`,
      `Drive level, per port: +10${NBSP}dBm → +13${NBSP}dBm`,
      "Key fact removed: Multiplication factor",
      `Typical curves changed: Conversion loss at +13${NBSP}dBm per port vs input frequency; Fundamental suppression at +13${NBSP}dBm per port vs input frequency`,
    ]);
    // The drive is the one the drive-held rows are stated at: each such row leaves at +10 dBm and comes back at +13 dBm.
    const plain = lines.map((line) => line.replace(/\u00a0/g, " "));
    expect(plain.some((line) => /^Removed: Conversion loss \(.*Drive \+10 dBm per port/.test(line))).toBe(true);
    expect(plain.some((line) => /^Added: Conversion loss \(.*Drive \+13 dBm per port/.test(line))).toBe(true);
    expect(plain.filter((line) => /^(Added|Removed): /.test(line)).every((line) => /Drive \+1[03] dBm per port/.test(line))).toBe(true);
  });

  it("gives the same diff, byte for byte, whatever order the inputs came in", () => {
    const next = editLimit("conversion-loss", CL_2GHZ, { max: 11.5 });
    next.approvedSets = next.approvedSets.filter((s) => s.serial !== "HX-0102");
    const once = JSON.stringify(diffSheetModels(revA, candidate(next)));
    const again = JSON.stringify(
      diffSheetModels(revA, candidate({ ...next, approvedSets: shuffled(next.approvedSets, 7), limits: shuffled(next.limits, 11) })),
    );
    expect(again).toBe(once);
  });
});

describe("diffSheetModels: typical-curve overlays", () => {
  it("reads the typical curve as the median of the units at each x, interpolating a unit measured on another grid", () => {
    // Median: the middle value of the sorted readings, the mean of the two middle ones for an even count
    // (NIST/SEMATECH e-Handbook of Statistical Methods §1.3.5.1). Linear interpolation between the two
    // nearest points: y = y0 + (y1 − y0)(x − x0)/(x1 − x0).
    const a: [number, number][] = [[1, 10], [2, 20], [3, 30]];
    const b: [number, number][] = [[1, 12], [3, 16]]; // at x = 2: 12 + (16 − 12)·(2 − 1)/(3 − 1) = 14
    const c: [number, number][] = [[2, 5], [3, 9]]; // does not reach x = 1
    expect(typicalCurve([a, b, c], false)).toEqual([
      [1, 11], // median of 10 and 12
      [2, 14], // median of 20, 14, 5
      [3, 16], // median of 30, 16, 9
    ]);
    // On a log axis the interpolation runs in log10 x: at x = 100 between 10 and 1000 it is half way.
    expect(typicalCurve([[[10, 0], [1000, 10]], [[100, 4]]], true)).toEqual([
      [10, 0],
      [100, 4.5], // median of 5 (interpolated) and 4
      [1000, 10],
    ]);
  });

  it("reads a chart's curves back out of the model's spec, in the data's own units", () => {
    const phaseNoise = revA.charts.find((c) => c.id === "phase-noise")!;
    const reading = readChart(phaseNoise)!;
    expect(reading.x.scale).toBe("log");
    expect(reading.y.unit).toBe("dBc/Hz");
    const frequency = revA.charts.find((c) => c.id === "conversion-loss-vs-input-frequency");
    if (frequency) {
      const freq = readChart(frequency)!;
      expect(freq.x.unit).toBe("Hz");
      const xs = [...freq.series.values()].flatMap((units) => [...units.values()].flatMap((points) => points.map(([x]) => x)));
      // The fixture measures at 2 and 3 GHz input: read back in hertz, not in the axis' GHz.
      expect(Math.min(...xs)).toBeGreaterThanOrEqual(1e9);
    }
  });

  it("draws both revisions' typical curves on shared axes, told apart by colour, dash and shape", () => {
    const input = structuredClone(base);
    input.approvedSets = input.approvedSets.filter((s) => s.serial !== "HX-0101");
    const diff = diffSheetModels(revA, candidate(input));
    const chart = diff.charts.find((c) => c.chartId === "conversion-loss-vs-drive")!;
    expect(chart.presence).toBe("both");
    expect(chart.panels).toHaveLength(1);
    const [panel] = chart.panels;
    expect(panel.changed).toBe(true);
    expect(panel.previousUnitCount).toBe(revA.charts.find((c) => c.id === "conversion-loss-vs-drive")!.unitCount);
    expect(panel.nextUnitCount).toBe(panel.previousUnitCount - 1);
    const spec = panel.vegaLite as { layer: { mark: { type: string }; encoding: Record<string, { scale?: { domain: string[]; range: unknown[] } }> }[]; data: { values: { series: string }[] } };
    const line = spec.layer.find((l) => l.mark.type === "line")!.encoding;
    const point = spec.layer.find((l) => l.mark.type === "point")!.encoding;
    expect(line.color.scale!.domain).toEqual(["Rev. A", "Candidate"]);
    const [colourA, colourB] = line.color.scale!.range;
    const [dashA, dashB] = line.strokeDash.scale!.range;
    const [shapeA, shapeB] = point.shape.scale!.range;
    expect(colourA).not.toEqual(colourB);
    expect(dashA).not.toEqual(dashB);
    expect(shapeA).not.toEqual(shapeB);
    expect(new Set(spec.data.values.map((v) => v.series))).toEqual(new Set(["Rev. A", "Candidate"]));
  });

  it("splits a chart of several series into one overlay per series", () => {
    const diff = diffSheetModels(revA, candidate(base));
    const spectrum = diff.charts.find((c) => c.chartId === "output-spectrum-vs-drive")!;
    expect(spectrum.panels.map((p) => p.series)).toEqual(["fundamental (×1)", "2nd harmonic (×2)", "3rd harmonic (×3)", "4th harmonic (×4)"]);
    expect(new Set(spectrum.panels.map((p) => p.anchorId)).size).toBe(4);
    for (const panel of spectrum.panels) expect(panel.anchorId).toMatch(/^diff-chart-[A-Za-z0-9_-]+$/);
  });

  it("marks a chart that only one revision has", () => {
    const template: SheetTemplate = { ...frequencyMultiplierTemplate, curves: frequencyMultiplierTemplate.curves.filter((c) => c.id !== "phase-noise") };
    const without = candidate(base, template);
    const removed = diffSheetModels(revA, without);
    expect(removed.charts.find((c) => c.chartId === "phase-noise")).toMatchObject({ presence: "previous-only" });
    expect(summaryLines(removed)).toContain("Chart removed: Phase noise L(f)");
    expect(diffIsEmpty(removed)).toBe(false);
    const added = diffSheetModels(without, revA).charts.find((c) => c.chartId === "phase-noise")!;
    expect(added.presence).toBe("next-only");
    expect(added.panels[0]).toMatchObject({ previousUnitCount: 0, changed: true });
  });
});
