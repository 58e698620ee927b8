import { describe, expect, it } from "vitest";
import { formatConditions, formatParameterTable } from "@/lib/analysis";

// The CLI prints for a terminal through the same formatter as the pages (lib/format), in its
// plain style: hyphen-minus and plain spaces; the digits are those the CLI always printed.
describe("the CLI's parameter table", () => {
  it("names conditions with units and prefixes, in plain ASCII", () => {
    expect(formatConditions({ toneSpacingHz: 1e6, loPowerDbm: 7, maxInputPowerDbm: -4, ktDbmHz: -173.975, method: "slope-fit" })).toBe(
      "toneSpacingHz=1 MHz, loPowerDbm=7 dBm, maxInputPowerDbm=-4 dBm, ktDbmHz=-173.975 dBm/Hz, method=slope-fit",
    );
    expect(formatConditions({ offsetHz: 12.5, carrierFrequencyHz: 2.4e9 })).toBe("offsetHz=12.5 Hz, carrierFrequencyHz=2.4 GHz");
  });

  it("prints three decimals, one from 1000 up, scientific outside 1e-3 … 1e7, and — for no value", () => {
    const table = formatParameterTable([
      { name: "a", value: -4.5, unit: "dBm", conditions: {} },
      { name: "b", value: 2500.25, unit: "dB", conditions: {} },
      { name: "c", value: 0.0000123, unit: "rad", conditions: {} },
      { name: "d", value: null, unit: "dBm", conditions: {} },
    ]);
    const values = table.split("\n").slice(2).map((line) => line.split(/\s+/).slice(1).join(" "));
    expect(values).toEqual(["-4.500 dBm", "2500.3 dB", "1.230e-5 rad", "— dBm"]);
  });
});
