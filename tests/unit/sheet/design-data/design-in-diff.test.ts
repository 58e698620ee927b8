import { describe, expect, it } from "vitest";
import { buildSheetModel, diffIsEmpty, diffSheetModels, summaryLines, type DesignDataInput, type SheetInput, type SheetModel } from "@/lib/sheet";
import { loadDoublerInput } from "../fixture";

const NBSP = "\u00a0";
const base = loadDoublerInput();

/** A PNG's bytes do not matter to the diff (it compares the digest), only that each drawing has its own SHA-256. */
const outline = (sha: string, caption: string): DesignDataInput["packageOutline"] => ({ caption, sha256: sha.repeat(64).slice(0, 64), widthPx: 4, heightPx: 3, pngBase64: "AAAA" });

const designData: DesignDataInput = {
  pinFunctions: [
    { pin: "1", name: "IN A", function: "Input" },
    { pin: "2", name: "GND", function: "Ground" },
    { pin: "3", name: "OUT", function: "Output" },
  ],
  ordering: [
    { partNumber: "KX-1-TR", options: "Matte tin", packing: "Reel, 1000" },
    { partNumber: "KX-1-CT", options: "Matte tin", packing: "Cut tape, 25" },
  ],
  recommendedOperatingConditions: [
    { parameter: "Input drive", min: "9", typ: "10.8", max: "13", unit: "dBm" },
    { parameter: "Ambient temperature", min: "-40", typ: "", max: "85", unit: "°C" },
  ],
  packageOutline: outline("a", "KL6, 3.00 × 3.00 mm"),
};

function model(edit: (d: DesignDataInput) => void = () => {}, label?: string): SheetModel {
  const input: SheetInput = structuredClone(base);
  const data = structuredClone(designData);
  edit(data);
  input.designData = data;
  if (label) input.revision = { ...input.revision, label, state: "released" };
  return buildSheetModel(input);
}

const revA = model(() => {}, "A");

describe("diffSheetModels: design-in sections", () => {
  it("finds nothing when the sections are the same (and an unchanged candidate stays an empty diff)", () => {
    const diff = diffSheetModels(revA, model());
    expect(diff.designIn).toEqual([]);
    expect(diffIsEmpty(diff)).toBe(true);
  });

  it("compares pins by pin number: a changed function, an added and a removed pin", () => {
    const diff = diffSheetModels(
      revA,
      model((d) => {
        d.pinFunctions[0].function = "Input (fundamental), 50 Ω";
        d.pinFunctions.splice(2, 1);
        d.pinFunctions.push({ pin: "4", name: "NC", function: "Not connected" });
      }),
    );
    expect(diff.designIn).toEqual([
      { section: "pins", kind: "changed", key: "Pin 1", previous: "IN A · Input", next: "IN A · Input (fundamental), 50 Ω", fields: ["function"] },
      { section: "pins", kind: "added", key: "Pin 4", previous: null, next: "NC · Not connected", fields: [] },
      { section: "pins", kind: "removed", key: "Pin 3", previous: "OUT · Output", next: null, fields: [] },
    ]);
    expect(diffIsEmpty(diff)).toBe(false);
  });

  it("compares ordering by part number and operating conditions row by row, figures as printed", () => {
    const diff = diffSheetModels(
      revA,
      model((d) => {
        d.ordering[1].packing = "Cut tape, 50";
        d.ordering.push({ partNumber: "KX-1-EB", options: "Evaluation board", packing: "" });
        d.recommendedOperatingConditions[0].max = "12.5";
      }),
    );
    expect(diff.designIn).toEqual([
      {
        section: "conditions",
        kind: "changed",
        key: "Input drive",
        previous: `min 9, typ 10.8, max 13${NBSP}dBm`,
        next: `min 9, typ 10.8, max 12.5${NBSP}dBm`,
        fields: ["max"],
      },
      { section: "ordering", kind: "changed", key: "KX-1-CT", previous: "Matte tin · Cut tape, 25", next: "Matte tin · Cut tape, 50", fields: ["packing"] },
      { section: "ordering", kind: "added", key: "KX-1-EB", previous: null, next: "Evaluation board", fields: [] },
    ]);
    expect(summaryLines(diff)).toEqual([
      `Recommended operating conditions, Input drive: min 9, typ 10.8, max 13${NBSP}dBm → min 9, typ 10.8, max 12.5${NBSP}dBm`,
      "Ordering information, KX-1-CT: Matte tin · Cut tape, 25 → Matte tin · Cut tape, 50",
      "Added: Ordering information, KX-1-EB: Evaluation board",
    ]);
  });

  it("compares the outline's drawing by its SHA-256 and its caption by text", () => {
    const redrawn = diffSheetModels(revA, model((d) => (d.packageOutline = outline("b", d.packageOutline!.caption))));
    expect(redrawn.designIn).toEqual([{ section: "outline", kind: "changed", key: "Drawing and caption", previous: "KL6, 3.00 × 3.00 mm", next: "KL6, 3.00 × 3.00 mm", fields: ["drawing"] }]);
    expect(summaryLines(redrawn)).toEqual(["Package outline: drawing changed"]);

    const recaptioned = diffSheetModels(revA, model((d) => (d.packageOutline!.caption = "KL6, 3.00 × 3.00 mm, 1.10 mm high")));
    expect(recaptioned.designIn.map((c) => c.fields)).toEqual([["caption"]]);
    expect(summaryLines(recaptioned)).toEqual(["Package outline: caption “KL6, 3.00 × 3.00 mm” → “KL6, 3.00 × 3.00 mm, 1.10 mm high”"]);

    const removed = diffSheetModels(revA, model((d) => (d.packageOutline = null)));
    expect(summaryLines(removed)).toEqual(["Removed: Package outline"]);
  });

  it("reads a revision frozen before the sections existed (no designData) as empty: everything is added", () => {
    const old = structuredClone(revA);
    delete old.designData;
    const diff = diffSheetModels(old, model());
    expect(diff.designIn.map((c) => `${c.kind} ${c.section} ${c.key}`)).toEqual([
      "added conditions Input drive",
      "added conditions Ambient temperature",
      "added outline Drawing and caption",
      "added pins Pin 1",
      "added pins Pin 2",
      "added pins Pin 3",
      "added ordering KX-1-TR",
      "added ordering KX-1-CT",
    ]);
    expect(diff.designIn[1].next).toBe(`min −40, max 85${NBSP}°C`);
  });

  it("tells apart two rows with the same key by their order (two unnumbered GND pins)", () => {
    const twoGrounds = (d: DesignDataInput) => {
      d.pinFunctions = [
        { pin: "", name: "GND", function: "Ground" },
        { pin: "", name: "GND", function: "Ground" },
      ];
    };
    const before = model(twoGrounds, "A");
    const after = model((d) => {
      twoGrounds(d);
      d.pinFunctions[1].function = "Ground paddle";
    });
    expect(diffSheetModels(before, after).designIn).toEqual([
      { section: "pins", kind: "changed", key: "GND (2)", previous: "GND · Ground", next: "GND · Ground paddle", fields: ["function"] },
    ]);
  });

  it("a first release lists no design-in changes", () => {
    expect(diffSheetModels(null, model()).designIn).toEqual([]);
  });
});
