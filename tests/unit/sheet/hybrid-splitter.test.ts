import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { deriveParameters } from "@/lib/analysis";
import { parseMeasurementFile } from "@/lib/ingest";
import { buildSheetModel, type SheetInput } from "@/lib/sheet";

function sheetOf(file: string): ReturnType<typeof buildSheetModel> {
  const parsed = parseMeasurementFile({ fileName: file, bytes: new Uint8Array(readFileSync(path.resolve(__dirname, "../../../fixtures/examples", file))) });
  const derived = deriveParameters(parsed);
  const input: SheetInput = {
    device: { partNumber: "TST-1", deviceClass: "quadrature-hybrid", title: "t", description: "", keyConditions: {}, organizationName: "Test" },
    revision: { label: null, state: "draft", date: "2026-12-01", history: [] },
    approvedSets: [{ id: 1, kind: parsed.kind, serial: "U1", temperatureC: 25, measuredOn: "2026-11-30", parameters: derived.parameters, curves: derived.curves, instruments: [] }],
    limits: [],
    prose: {},
    absoluteMaximumRatings: [],
    settings: { cpkThreshold: 1.33, toleranceCoverage: 0.99, toleranceConfidence: 0.95 },
  };
  return buildSheetModel(input);
}

describe("one template for hybrids and splitters, rows named by port", () => {
  it("a 4-port hybrid shows input-to-isolated (S41) and output-to-output (S32) isolation", () => {
    const labels = sheetOf("hybrid-4port.s4p").specifications.rows.map((r) => r.label);
    expect(labels).toContain("Isolation, port 1 to 4 (S41)");
    expect(labels).toContain("Isolation, port 2 to 3 (S32)");
  });

  it("a 3-port splitter shows isolation between its outputs (S32) at the engine's worst value, and no S41 row", () => {
    const file = "splitter-3port.s3p";
    const model = sheetOf(file);
    const labels = model.specifications.rows.map((r) => r.label);
    expect(labels).toContain("Insertion loss, port 1 to 2 (S21)");
    expect(labels).toContain("Isolation, port 2 to 3 (S32)");
    expect(labels).not.toContain("Isolation, port 1 to 4 (S41)");
    const parsed = parseMeasurementFile({ fileName: file, bytes: new Uint8Array(readFileSync(path.resolve(__dirname, "../../../fixtures/examples", file))) });
    const worst = deriveParameters(parsed).parameters.find((p) => p.name === "isolation" && p.conditions.path === "S32" && p.conditions.statistic === "worst")!;
    const group = model.statistics.groups.find((g) => g.rowId === "isolation-outputs")!;
    expect(group.n).toBe(1);
    expect(group.mean.value).toBeCloseTo(worst.value!, 9);
  });
});
