import { describe, expect, it } from "vitest";
import { buildSheetModel } from "@/lib/sheet";
import { findSheetTemplate } from "@/templates";
import { loadDoublerInput } from "./fixture";

// A note under the specifications table that explains some rows is printed only where one of them is on the sheet.

const input = loadDoublerInput();
// Limits off: a row with a limit and no figure is on the sheet too, and keeps its note.
const notesOf = (sets: typeof input.approvedSets) => buildSheetModel({ ...input, approvedSets: sets, limits: [] }).specifications.notes;
const jitter = /^RMS jitter and phase integrate L\(f\)/;
const drive = /^Per-port drive is the source power/;
const conversion = /^Conversion loss is P_in − P_out/;

describe("notes under the specifications table", () => {
  it("the fixture has phase noise and drive sweeps: the jitter, phase-noise and conversion notes are all printed", () => {
    const rows = new Set(buildSheetModel(input).specifications.rows.map((r) => r.rowId));
    expect(rows.has("rms-jitter")).toBe(true);
    const notes = buildSheetModel(input).specifications.notes;
    for (const note of [jitter, drive, conversion]) expect(notes.some((n) => note.test(n))).toBe(true);
  });

  it("without phase-noise sets no phase-noise, jitter or spur note; the drive and conversion notes stay", () => {
    const notes = notesOf(input.approvedSets.filter((s) => s.kind !== "phase-noise"));
    expect(notes.some((n) => jitter.test(n) || /phase noise|Discrete spurs|Excess over ideal/i.test(n))).toBe(false);
    expect(notes.some((n) => drive.test(n))).toBe(true);
    expect(notes.some((n) => conversion.test(n))).toBe(true);
  });

  it("a row that has a limit and no figure yet keeps its note", () => {
    const limited = buildSheetModel({ ...input, approvedSets: input.approvedSets.filter((s) => s.kind !== "phase-noise") });
    const phaseNoiseRows = limited.specifications.rows.filter((r) => r.rowId === "residual-phase-noise");
    expect(phaseNoiseRows.length).toBeGreaterThan(0);
    expect(limited.specifications.notes.some((n) => /^Phase noise is single-sideband/.test(n))).toBe(true);
  });

  it("with no data only the notes that name no rows: the reference impedance still stands", () => {
    const notes = notesOf([]);
    const general = findSheetTemplate("frequency-multiplier")!.specifications.notes.filter((n) => typeof n === "string");
    expect(notes).toEqual(general);
    expect(notes.some((n) => /50 Ω/.test(n))).toBe(true);
  });

  it("every row a note names is a row of its template", () => {
    for (const deviceClass of ["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"]) {
      const template = findSheetTemplate(deviceClass)!;
      const ids = new Set(template.specifications.rows.map((r) => r.id));
      for (const note of template.specifications.notes) if (typeof note !== "string") for (const id of note.rows) expect(ids.has(id), `${deviceClass}: ${id}`).toBe(true);
    }
  });
});
