import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { buildSheetModel, type ApprovedSetInput } from "@/lib/sheet";
import { readAtStatedDrive } from "@/lib/sheet/stated-drive";
import { findSheetTemplate } from "@/templates";
import { MULTIPLIER_DEFAULT_STATED_DRIVE_DBM } from "@/templates/frequency-multiplier";
import { loadDoublerInput } from "./fixture";

const template = findSheetTemplate("frequency-multiplier")!;
const row = (id: string) => template.specifications.rows.find((r) => r.id === id)!;
const plain = (text: string) => text.replace(/\u00a0/g, " ");

/** numpy.interp(x, xp, fp) for each curve (NumPy 1.24, Debian's python3-numpy): piecewise-linear interpolation on increasing xp. */
function numpyInterp(x: number, curves: [number, number][][]): number[] {
  const script = "import json, sys, numpy\nx, curves = json.load(sys.stdin)\nprint(json.dumps([float(numpy.interp(x, [p[0] for p in c], [p[1] for p in c])) for c in curves]))";
  return JSON.parse(execFileSync("/usr/bin/python3", ["-c", script], { input: JSON.stringify([x, curves]), encoding: "utf8" })) as number[];
}

const input = loadDoublerInput();
const sweeps = input.approvedSets.filter((s) => s.kind === "drive-sweep");
const curvePoints = (set: ApprovedSetInput, curveId: string, series?: string) => {
  const curve = set.curves.find((c) => c.id === curveId)!;
  return (series ? curve.series.find((s) => s.name === series)! : curve.series[0]).points;
};

describe("a multiplier's rows at the drive its template states", () => {
  it("states +10 dBm per port (the fixture device's own drive and the class default), inside every fixture unit's sweep", () => {
    expect(MULTIPLIER_DEFAULT_STATED_DRIVE_DBM).toBe(10);
    expect(input.device.keyConditions.driveLevelDbm).toBe(10);
    for (const set of sweeps) {
      const xs = curvePoints(set, "conversion-loss-vs-drive").map(([x]) => x);
      expect(Math.min(...xs)).toBeLessThan(10);
      expect(Math.max(...xs)).toBeGreaterThan(10);
    }
  });

  it("reads each unit's conversion loss off its sweep as numpy.interp does", () => {
    const read = sweeps.map((set) => readAtStatedDrive(row("conversion-loss-at-drive"), set).parameters);
    const expected = numpyInterp(10, sweeps.map((set) => curvePoints(set, "conversion-loss-vs-drive")));
    expect(read.map((p) => p.length)).toEqual(sweeps.map(() => 1));
    read.forEach((p, i) => expect(p[0].value).toBeCloseTo(expected[i], 9));
    // The figure keeps the set's other conditions and states the drive instead of "optimum".
    expect(read[0][0].conditions).toEqual({ inputFrequencyHz: sweeps[0].parameters.find((p) => p.name === "optimum-drive")!.conditions.inputFrequencyHz, drive: 10 });
    // Not the nearest step: the fixture's steps sit at +9.28 and +10.28 dBm per port (source 13 and 14 dBm less 3.72 dB).
    const steps = curvePoints(sweeps[0], "conversion-loss-vs-drive");
    expect(steps.some(([x]) => x === 10)).toBe(false);
  });

  it("reads each order's suppression off its own series as numpy.interp does", () => {
    for (const order of [1, 3, 4]) {
      const id = order === 1 ? "fundamental-suppression" : order === 3 ? "third-harmonic-suppression" : "fourth-harmonic-suppression";
      const read = sweeps.map((set) => readAtStatedDrive(row(id), set).parameters[0].value);
      const expected = numpyInterp(10, sweeps.map((set) => curvePoints(set, "harmonic-suppression-vs-drive", `order ${order}`)));
      read.forEach((v, i) => expect(v).toBeCloseTo(expected[i], 9));
    }
  });

  it("takes a measured step as it is, and the model's rows and conditions carry the stated drive", () => {
    const set = sweeps[0];
    const onStep: ApprovedSetInput = {
      ...set,
      curves: set.curves.map((c) => (c.id === "conversion-loss-vs-drive" ? { ...c, series: [{ name: "order 2", points: [[8, 11], [10, 10.25], [12, 10.75]] }] } : c)),
    };
    expect(readAtStatedDrive(row("conversion-loss-at-drive"), onStep).parameters[0].value).toBe(10.25);
    const model = buildSheetModel(input);
    const cl = model.specifications.rows.find((r) => r.rowId === "conversion-loss-at-drive")!;
    expect(cl.conditionsKey).toMatch(/^drive=10;/);
    expect(plain(cl.conditions[1])).toBe("+10 dBm per port");
    expect(plain(model.statistics.groups.find((g) => g.groupId === cl.groupId)!.conditionsText)).toContain("Drive +10 dBm per port");
  });

  it("extrapolates nothing: a unit whose sweep does not reach the drive is named in an open issue and left out", () => {
    const full = buildSheetModel(input);
    expect(full.issues.map((i) => i.code)).not.toContain("stated-drive-outside-sweep");
    const group = full.statistics.groups.find((g) => g.rowId === "conversion-loss-at-drive")!;
    const used = input.approvedSets.find((s) => String(s.id) === group.units[0].setId)!;
    const short: ApprovedSetInput = {
      ...used,
      curves: used.curves.map((c) => ({ ...c, series: c.series.map((s) => ({ ...s, points: s.points.filter(([x]) => x > 10.5) })) })),
    };
    expect(readAtStatedDrive(row("conversion-loss-at-drive"), short)).toMatchObject({ parameters: [], misses: [{ serial: used.serial, driveDbm: 10 }] });
    const model = buildSheetModel({ ...input, approvedSets: input.approvedSets.map((s) => (s === used ? short : s)) });
    const issues = model.issues.filter((i) => i.code === "stated-drive-outside-sweep");
    expect(issues).toHaveLength(1);
    expect(plain(issues[0].message)).toMatch(
      new RegExp(`^Unit ${used.serial} \\(set ${String(used.id)}\\) was swept from \\+1[01]\\.\\d+ dBm to \\+16\\.3 dBm per port, which does not reach the stated drive of \\+10 dBm per port: it is left out of conversion loss, .*fundamental suppression`),
    );
    const after = model.statistics.groups.find((g) => g.groupId === group.groupId)!;
    expect(after.units.map((u) => u.setId)).not.toContain(String(used.id));
    expect(after.n).toBe(group.n - 1);
  });

  it("holds the rows, trends and their titles at the device's own per-port drive, and the model records it", () => {
    // A device rated at +11.5 dBm per port: every unit's sweep reaches it (the steps sit at +9.28, +10.28, ... dBm).
    const drive = 11.5;
    const own = findSheetTemplate("frequency-multiplier", { driveLevelDbm: drive })!;
    expect(own.statedDriveDbm).toBe(drive);
    expect(findSheetTemplate("frequency-multiplier")!.statedDriveDbm).toBe(MULTIPLIER_DEFAULT_STATED_DRIVE_DBM);
    // The same rows by id; only the held drive differs.
    expect(own.specifications.rows.map((r) => r.id)).toEqual(template.specifications.rows.map((r) => r.id));
    for (const r of own.specifications.rows.filter((r) => r.atStatedDrive)) expect(r.match?.drive).toBe(drive);
    for (const t of own.trends!.filter((t) => t.atStatedDrive)) {
      expect(t.match?.drive).toBe(drive);
      expect(plain(t.title)).toContain("+11.5 dBm per port");
    }
    const atDrive = { ...input, device: { ...input.device, keyConditions: { ...input.device.keyConditions, driveLevelDbm: drive } } };
    const model = buildSheetModel(atDrive);
    expect(model.template.statedDriveDbm).toBe(drive);
    const cl = model.specifications.rows.find((r) => r.rowId === "conversion-loss-at-drive" && r.conditionsKey.includes("temperatureC=25"))!;
    expect(plain(cl.conditions[1])).toBe("+11.5 dBm per port");
    // The row's units read off their sweeps at +11.5 dBm as numpy.interp does (NumPy 1.24, Debian's python3-numpy).
    const group = model.statistics.groups.find((g) => g.groupId === cl.groupId)!;
    const sets = group.units.map((u) => input.approvedSets.find((s) => String(s.id) === u.setId)!);
    const expected = numpyInterp(drive, sets.map((set) => curvePoints(set, "conversion-loss-vs-drive")));
    expect(group.units.length).toBeGreaterThan(1);
    group.units.forEach((u, i) => expect(u.value.value).toBeCloseTo(expected[i], 7)); // the annex keeps 8 decimals
    // The key fact states the same drive the rows are held at.
    expect(model.keyFacts.find((f) => f.label === "Drive level, per port")).toMatchObject({ value: "+11.5" });
    expect(() => findSheetTemplate("frequency-multiplier", { driveLevelDbm: Number.NaN })).not.toThrow();
  });
});
