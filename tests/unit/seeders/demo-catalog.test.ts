import { describe, expect, it } from "vitest";
import { deriveParameters } from "@/lib/analysis";
import { parseMeasurementFile } from "@/lib/ingest";
import { mergeUploadConditions, uploadMeasuredOn } from "@/lib/ingest/upload-conditions";
import { uploadFieldsSchema } from "@/lib/schemas/measurements";
import { buildSheetModel, type ApprovedSetInput, type SheetInput } from "@/lib/sheet";
import { branchLineHybrid, networkSParameters, wilkinsonSplitter, type Complex } from "@/models/seeders/demo-catalog-curves";
import { demoCatalogInstruments, demoCatalogIssueReasons, demoCatalogParts } from "@/models/seeders/demo-catalog";
import { demoInstruments } from "@/models/seeders/demo-measurements";
import { demoOrganizations } from "@/models/seeders/demo-scenario";
import { fillFeatures, limitsFromStatistics } from "@/scripts/seed-demo-catalog";
import { formatDrive } from "@/lib/sheet/format";

// The demo catalog's generated bench files: the networks against Pozar's ideal matrices, the files
// through the same parser and derivation as an upload, and the limits the loader sets from them.

const exact = { impedanceFraction: 0, lengthFraction: 0 };
const never = () => 0.5; // spread(rand, x) = 0: no tolerance drawn
const near = (a: Complex, b: Complex, tolerance = 1e-9) => Math.hypot(a.re - b.re, a.im - b.im) < tolerance;

describe("the networks", () => {
  it("a lossless branch-line hybrid at its centre frequency is Pozar's quadrature hybrid", () => {
    // Pozar, Microwave Engineering, 4th ed., §7.5, eq. (7.53), from memory: S = −1/√2 [[0, j, 1, 0],
    // [j, 0, 0, 1], [1, 0, 0, j], [0, 1, j, 0]]: port 2 −90°, port 3 −180°, port 4 isolated, all matched.
    const s = networkSParameters(branchLineHybrid(2e9, 0, never, exact), 2e9);
    const h = -Math.SQRT1_2;
    const expected: Complex[][] = [
      [{ re: 0, im: 0 }, { re: 0, im: h }, { re: h, im: 0 }, { re: 0, im: 0 }],
      [{ re: 0, im: h }, { re: 0, im: 0 }, { re: 0, im: 0 }, { re: h, im: 0 }],
      [{ re: h, im: 0 }, { re: 0, im: 0 }, { re: 0, im: 0 }, { re: 0, im: h }],
      [{ re: 0, im: 0 }, { re: h, im: 0 }, { re: 0, im: h }, { re: 0, im: 0 }],
    ];
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) expect(near(s[i][j], expected[i][j]), `S${i + 1}${j + 1}`).toBe(true);
  });

  it("a lossless Wilkinson divider at its centre frequency is Pozar's: −j/√2 to each output, matched, outputs isolated", () => {
    // Pozar §7.3, eq. (7.37), from memory: S = −j/√2 [[0, 1, 1], [1, 0, 0], [1, 0, 0]].
    const network = wilkinsonSplitter(1e9, 0, never, exact);
    const s = networkSParameters(network, 1e9);
    const zero = { re: 0, im: 0 };
    const out = { re: 0, im: -Math.SQRT1_2 };
    expect([s[0][0], s[1][1], s[2][2], s[1][2]].every((v) => near(v, zero))).toBe(true);
    expect([s[1][0], s[2][0], s[0][1], s[0][2]].every((v) => near(v, out))).toBe(true);
  });

  it("off centre, a lossless branch-line conserves power (SᴴS = I) while its isolation and match degrade", () => {
    const s = networkSParameters(branchLineHybrid(2e9, 0, never, exact), 2.3e9);
    for (let j = 0; j < 4; j++) {
      const power = s.reduce((sum, row) => sum + row[j].re ** 2 + row[j].im ** 2, 0);
      expect(power).toBeCloseTo(1, 12);
    }
    const db = (v: Complex) => 20 * Math.log10(Math.hypot(v.re, v.im));
    expect(db(s[3][0])).toBeGreaterThan(-30); // finite isolation 15 % off centre
    expect(db(s[3][0])).toBeLessThan(-10);
  });
});

/** Each part's files through the parser and the engine, approved in upload order, into a draft sheet. */
function draftOf(part: (typeof demoCatalogParts)[number], limits: SheetInput["limits"] = []) {
  const register = [...(demoCatalogInstruments[part.org] ?? []), ...(demoInstruments[part.org] ?? [])];
  const files = part.files();
  const sets: ApprovedSetInput[] = files.map((file, index) => {
    const fields = uploadFieldsSchema.parse(file.fields);
    const parsed = parseMeasurementFile({ fileName: file.name, bytes: new TextEncoder().encode(file.text) });
    const conditions = mergeUploadConditions(parsed, fields, []);
    const derived = deriveParameters(parsed);
    // A doubler is not warned that its sweep does not compress (it was never meant to); its optimum must lie inside the sweep.
    expect(derived.warnings, file.name).toEqual([]);
    return {
      id: index + 1,
      kind: parsed.kind,
      serial: conditions.serial,
      lot: conditions.lot,
      temperatureC: conditions.temperatureC,
      measuredOn: uploadMeasuredOn(parsed, fields) ?? "2026-12-01",
      parameters: derived.parameters,
      curves: derived.curves,
      instruments: file.instruments.map((key) => register.find((i) => i.key === key)!),
    };
  });
  const org = demoOrganizations.find((o) => o.slug === part.org)!;
  return buildSheetModel({
    device: { partNumber: part.partNumber, deviceClass: part.deviceClass, title: part.title, description: part.description, keyConditions: part.keyConditions, organizationName: org.name },
    revision: { label: null, state: "draft", date: "2026-12-01", history: [] },
    approvedSets: sets,
    limits,
    prose: part.prose,
    absoluteMaximumRatings: part.absoluteMaximumRatings,
    settings: { cpkThreshold: 1.33, toleranceCoverage: 0.99, toleranceConfidence: 0.95, measurementUncertainty: part.measurementUncertainty },
  });
}

describe("the demo catalog's parts", () => {
  it("are at least eight, of the three classes, from both vendors and the lab, with part numbers of their own", () => {
    expect(demoCatalogParts.length).toBeGreaterThanOrEqual(8);
    expect(new Set(demoCatalogParts.map((p) => p.deviceClass))).toEqual(new Set(["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"]));
    expect(new Set(demoCatalogParts.map((p) => p.org))).toEqual(new Set(["kestrine", "pellacourt", "wrenfield-lab"]));
    const existing = demoOrganizations.flatMap((o) => o.devices.map((d) => d.partNumber));
    for (const p of demoCatalogParts) expect(existing, p.partNumber).not.toContain(p.partNumber);
  });

  it("are generated the same on every run (fixed seeds)", () => {
    for (const part of demoCatalogParts) expect(part.files().map((f) => f.text)).toEqual(part.files().map((f) => f.text));
  });

  it.each(demoCatalogParts.map((p) => [p.partNumber, p] as const))("%s: files parse and derive; the draft has no issue the loader has no reason for; limits from the data hold every unit", (_, part) => {
    const sheet = draftOf(part);
    expect(sheet.issues.filter((issue) => !demoCatalogIssueReasons[issue.code])).toEqual([]);
    const limits = limitsFromStatistics(sheet, part);
    // Submitted with its limits: every issue then, too, has the loader's reason.
    expect(draftOf(part, limits).issues.filter((issue) => !demoCatalogIssueReasons[issue.code])).toEqual([]);
    expect(new Set(limits.map((l) => sheet.statistics.groups.find((g) => g.parameter === l.parameter && g.conditionsKey === l.conditionsKey)!.rowId))).toEqual(
      new Set(part.limits.map((r) => r.row)),
    );
    for (const limit of limits) {
      const group = sheet.statistics.groups.find((g) => g.parameter === limit.parameter && g.conditionsKey === limit.conditionsKey)!;
      const rule = part.limits.find((r) => r.row === group.rowId)!;
      const u = part.measurementUncertainty[group.parameter] ?? 0;
      const mean = group.mean.value!;
      const s = group.standardDeviation.value!;
      // mean ± (4 s + U), rounded outwards to the rule's step.
      if (limit.max !== undefined) {
        const reach = rule.side === "symmetric" ? Math.max(Math.abs(mean + 4 * s + u), Math.abs(mean - 4 * s - u)) : mean + 4 * s + u;
        expect(limit.max).toBeGreaterThanOrEqual(reach - 1e-9);
        expect(limit.max - reach).toBeLessThan(rule.step + 1e-9);
        expect(Math.abs(limit.max / rule.step - Math.round(limit.max / rule.step))).toBeLessThan(1e-9);
      }
      if (limit.min !== undefined && rule.side === "min") expect(limit.min).toBeLessThanOrEqual(mean - 4 * s - u + 1e-9);
      if (rule.side === "symmetric") expect(limit.min).toBe(-limit.max!);
      for (const unit of group.units) {
        if (limit.max !== undefined) expect(unit.value.value!, `${group.groupId} ${unit.serial}`).toBeLessThan(limit.max - u);
        if (limit.min !== undefined) expect(unit.value.value!, `${group.groupId} ${unit.serial}`).toBeGreaterThan(limit.min + u);
      }
    }
    if (part.prose.features) expect(fillFeatures(part.prose.features, limits, sheet)).not.toMatch(/[{}]/);
    // Every row its class defines that a 25 °C characterization can fill (the rows over temperature need runs at other temperatures).
    if (part.deviceClass === "double-balanced-mixer") {
      const rows = new Set(sheet.specifications.rows.map((r) => r.rowId));
      for (const id of ["conversion-loss-worst", "conversion-loss-typical", "isolation-lo-rf", "isolation-lo-if", "isolation-rf-if", "iip3", "input-p1db", "vswr"]) expect(rows.has(id), `${part.partNumber}: ${id}`).toBe(true);
      // IIP3 ≈ LO + 9 dB and P1dB ≈ LO − 6 dB, as the generator models them: the engine's fit finds them back within 1.5 dB.
      const mean = (rowId: string) => sheet.statistics.groups.find((g) => g.rowId === rowId)!.mean.value!;
      expect(Math.abs(mean("iip3") - (part.keyConditions.driveLevelDbm! + 9))).toBeLessThan(1.5);
      expect(Math.abs(mean("input-p1db") - (part.keyConditions.driveLevelDbm! - 6))).toBeLessThan(1.5);
    }
    // A doubler's rows are held at its own key drive, per port, and its features name that drive.
    const drive = part.keyConditions.driveLevelDbm;
    if (part.deviceClass === "frequency-multiplier") {
      expect(sheet.template.statedDriveDbm).toBe(drive);
      expect(sheet.statistics.groups.filter((g) => g.rowId === "conversion-loss-at-drive").every((g) => g.conditionsKey.startsWith(`drive=${drive};`))).toBe(true);
      expect(part.prose.features!.replace(/\u00a0/g, " ")).toContain(`at ${formatDrive(drive!)} per port`.replace(/\u00a0/g, " "));
    }
  });

  it("doublers: best conversion near the modelled optimum drive, square law (≈ 2 dB per dB) well below it", () => {
    const part = demoCatalogParts.find((p) => p.partNumber === "KDX-4G8")!;
    const sheet = draftOf(part);
    const optimum = sheet.statistics.groups.filter((g) => g.rowId === "optimum-drive");
    expect(optimum.length).toBe(3);
    for (const g of optimum) expect(Math.abs(g.mean.value! - 10)).toBeLessThan(1.2);
    // The first rows of a sweep: total input 12 dB below the optimum's; the wanted output rises about 2 dB per dB.
    const rows = part.files()[0].text.split("\n").filter((line) => /^-?\d/.test(line)).map((line) => line.split(",").map(Number));
    const slope = (rows[3][2] - rows[0][2]) / (rows[3][0] - rows[0][0]);
    expect(slope).toBeGreaterThan(1.7);
    expect(slope).toBeLessThan(2.1);
  });
});
