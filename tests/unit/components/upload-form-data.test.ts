import { describe, expect, it } from "vitest";
import { buildForm, checkConditions, initialConditions } from "@/components/measurements/upload-form-data";
import { uploadConditionFields } from "@/templates/upload-conditions";

// The upload form sends the class's own condition fields (templates/<class>/conditions.ts), frequencies in Hz.
const file = new File(["x"], "a.csv");

describe("the upload form's class conditions", () => {
  it("a mixer's form sends RF, LO, IF in Hz and LO drive in dBm, and nothing of a multiplier's", () => {
    const c = { ...initialConditions(uploadConditionFields("double-balanced-mixer")), serial: "S1" };
    c.values = { rfFrequencyHz: "1", loFrequencyHz: "1.07", ifFrequencyHz: "70", loDriveDbm: "\u22127" };
    c.units = { ifFrequencyHz: "MHz" };
    const form = buildForm(file, c);
    expect(form.get("rfFrequencyHz")).toBe("1000000000");
    expect(form.get("loFrequencyHz")).toBe("1070000000");
    expect(form.get("ifFrequencyHz")).toBe("70000000");
    expect(form.get("loDriveDbm")).toBe("-7");
    expect(form.get("splitterExcessLossDb")).toBeNull();
    expect(checkConditions(c, 1)).toBeNull();
  });
  it("a hybrid's form sends its band and checks it", () => {
    const c = initialConditions(uploadConditionFields("quadrature-hybrid"));
    c.values = { bandStartHz: "1.6", bandStopHz: "2.4" };
    expect(buildForm(file, c).get("bandStopHz")).toBe("2400000000");
    expect(checkConditions(c, 1)).toBeNull();
    expect(checkConditions({ ...c, values: { bandStartHz: "2.4", bandStopHz: "1.6" } }, 1)).toBe("The band stop must lie above the band start.");
    expect(checkConditions({ ...c, values: { bandStartHz: "2.4" } }, 1)).toBe("State both ends: band start and band stop.");
    expect(checkConditions({ ...c, values: { bandStartHz: "abc", bandStopHz: "2" } }, 1)).toBe("Band start must be a decimal number.");
  });
  it("a value the class would refuse is caught before sending", () => {
    const c = initialConditions(uploadConditionFields("double-balanced-mixer"));
    expect(checkConditions({ ...c, values: { loDriveDbm: "70" } }, 1)).toBe("LO drive must lie between \u2212200 and 60 dBm.");
  });
});
