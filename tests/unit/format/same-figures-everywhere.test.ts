import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { DeviceKeyConditions } from "@/components/devices/device-key-conditions";
import { buildSheetModel } from "@/lib/sheet";
import { loadDoublerInput } from "../sheet/fixture";

// The sheet and the device page used to print a 200 MHz–2 GHz range as "0.2–2 GHz" and
// "200–2000 MHz"; both now go through lib/format's rangeParts.
describe("a range reads the same on the sheet and on the device page", () => {
  const input = loadDoublerInput();
  const keyConditions = { inputFrequencyHz: { min: 200e6, max: 2e9 }, outputFrequencyHz: { min: 10e6, max: 3e9 }, driveLevelDbm: -3 };

  it("sheet key facts", () => {
    const model = buildSheetModel({ ...input, device: { ...input.device, keyConditions } });
    const fact = (label: string) => model.keyFacts.find((f) => f.label === label);
    expect(fact("Input frequency")).toMatchObject({ value: "0.2\u20132", unit: "GHz" });
    expect(fact("Output frequency")).toMatchObject({ value: "10\u20133000", unit: "MHz" });
    expect(fact("Drive level, per port")).toMatchObject({ value: "\u22123", unit: "dBm" });
  });

  it("device page", () => {
    const device = { id: 1, partNumber: "X-1", deviceClass: "frequency-multiplier" as const, title: "", description: "", keyConditions, updatedAt: "2026-01-01T00:00:00.000Z" };
    const text = renderToStaticMarkup(createElement(DeviceKeyConditions, { device })).replace(/<[^>]+>/g, "");
    expect(text).toContain("0.2\u20132\u00a0GHz");
    expect(text).toContain("10\u20133000\u00a0MHz");
    expect(text).toContain("\u22123\u00a0dBm");
  });
});
