import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { checkClassConditions, stampStatedConditions, uploadAnalysisSettings } from "@/lib/ingest/upload-conditions";
import { conditionFieldIds } from "@/lib/domain/measurement-conditions";
import { deviceClassLabels } from "@/lib/domain/device-classes";
import { classConditions, uploadConditionFields } from "@/templates/upload-conditions";
import { findSheetTemplate } from "@/templates";

function refusal(run: () => void): { field?: unknown; message: string } {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(AppError);
    return { field: (error as AppError).details?.field, message: (error as AppError).message };
  }
  throw new Error("not refused");
}

describe("each class's conditions, in one place", () => {
  it("the template carries the same list the form and the upload read", () => {
    for (const deviceClass of Object.keys(classConditions) as (keyof typeof classConditions)[]) {
      const template = findSheetTemplate(deviceClass);
      if (template) expect(template.conditions.uploadFields).toBe(uploadConditionFields(deviceClass));
    }
  });
  it("a mixer states RF, LO and IF frequencies and LO drive; a hybrid its band; neither a splitter's excess loss", () => {
    expect(uploadConditionFields("double-balanced-mixer")).toEqual(["rfFrequencyHz", "loFrequencyHz", "ifFrequencyHz", "loDriveDbm"]);
    expect(uploadConditionFields("quadrature-hybrid")).toEqual(["bandStartHz", "bandStopHz"]);
    expect(uploadConditionFields("frequency-multiplier")).toContain("splitterExcessLossDb");
  });
});

describe("checkClassConditions", () => {
  const hybrid = { classLabel: deviceClassLabels["quadrature-hybrid"], allowed: uploadConditionFields("quadrature-hybrid") };
  it("accepts the class's own conditions, and none", () => {
    expect(() => checkClassConditions({ ...hybrid, fields: { bandStartHz: 1e9, bandStopHz: 2e9 } })).not.toThrow();
    expect(() => checkClassConditions({ ...hybrid, fields: {} })).not.toThrow();
  });
  it("refuses every condition of another class, naming it and what the class states", () => {
    for (const id of conditionFieldIds.filter((f) => !hybrid.allowed.includes(f))) {
      const r = refusal(() => checkClassConditions({ ...hybrid, fields: { [id]: 1 } }));
      expect(r.field).toBe(id);
      expect(r.message).toContain(`(${id}) is not a condition of a quadrature hybrid or power splitter; this class states: band start (bandStartHz), band stop (bandStopHz).`);
    }
  });
  it.each([
    [{ bandStartHz: 1e9 }, "bandStopHz", "State both ends"],
    [{ bandStopHz: 1e9 }, "bandStartHz", "State both ends"],
    [{ bandStartHz: 2e9, bandStopHz: 2e9 }, "bandStopHz", "The band stop must lie above the band start."],
    [{ bandStartHz: 2e9, bandStopHz: 1e9 }, "bandStopHz", "The band stop must lie above the band start."],
  ])("a band %j is refused at %s", (fields, field, words) => {
    const r = refusal(() => checkClassConditions({ ...hybrid, fields }));
    expect(r.field).toBe(field);
    expect(r.message).toContain(words);
  });
});

describe("stampStatedConditions", () => {
  const band = { name: "conversion-loss", value: 6, unit: "dB", conditions: { statistic: "max", startHz: 5e8, stopHz: 3e9, loPowerDbm: 7 } };
  const spot = { name: "iip3", value: 15, unit: "dBm", conditions: { method: "slope-fit" } };
  it("fills what the file left out, never what it stated", () => {
    const [b, s] = stampStatedConditions([band, spot], { serial: "X", loDriveDbm: 10, loFrequencyHz: 1.07e9, ifFrequencyHz: 7e7, rfFrequencyHz: 1e9 });
    expect(b.conditions).toEqual({ statistic: "max", startHz: 5e8, stopHz: 3e9, loPowerDbm: 7, loFrequencyHz: 1.07e9, ifFrequencyHz: 7e7 });
    expect(s.conditions).toEqual({ method: "slope-fit", loPowerDbm: 10, loFrequencyHz: 1.07e9, ifFrequencyHz: 7e7, rfFrequencyHz: 1e9 });
  });
  it("returns the same parameters when nothing is stated", () => {
    const parameters = [band, spot];
    expect(stampStatedConditions(parameters, { serial: "X", temperatureC: 25 })).toBe(parameters);
  });
});

describe("uploadAnalysisSettings: the phase-noise trace's bandwidth", () => {
  it("takes a resolution or a noise bandwidth, and says which", () => {
    expect(uploadAnalysisSettings({ resolutionBandwidthHz: 1000 })).toEqual({ spurBandwidth: { kind: "resolution", hz: 1000 } });
    expect(uploadAnalysisSettings({ noiseBandwidthHz: 0.25 })).toEqual({ spurBandwidth: { kind: "noise", hz: 0.25 } });
    expect(uploadAnalysisSettings({})).toEqual({});
  });

  it("refuses both at once, naming the field", () => {
    let caught: unknown;
    try {
      uploadAnalysisSettings({ resolutionBandwidthHz: 1000, noiseBandwidthHz: 1064 });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(AppError);
    expect(caught).toMatchObject({ code: "invalid", details: { field: "resolutionBandwidthHz" } });
    expect((caught as Error).message).toContain("not both");
  });
});
