import { describe, expect, it } from "vitest";
import { IngestError, parseMeasurementFile } from "@/lib/ingest";
import { parseMappedFile } from "@/lib/ingest/column-mapping";
import { isPlausibilityWarning } from "@/lib/ingest/plausibility";
import { combGeneratorTemplate, findSheetTemplate, ingestOptionsFor, type SheetTemplate } from "@/templates";

// A constructed active class on the comb generator's pattern: a ×2 multiplier with gain (an
// amplifier after the doubler). Its switch is the only thing that differs from a passive class.
const activeDoubler: SheetTemplate = { ...combGeneratorTemplate, passive: false };

// The wanted order comes out 8.00 dB above the 10.00 dBm going in: gain no passive part has.
const gainSweep = [
  "# kind: drive-sweep",
  "# serial: BFD-0700",
  "# input_frequency: 1 GHz",
  "# wanted_order: 2",
  "input_power [dBm],p2_out [dBm]",
  "0.00,6.00",
  "10.00,18.00",
].join("\n");

function refusal(f: () => unknown): IngestError {
  try {
    f();
  } catch (e) {
    if (e instanceof IngestError) return e;
    throw e;
  }
  throw new Error("expected an IngestError");
}

describe("a device class's passive switch decides the plausibility check", () => {
  it("every shipped class states it, and is passive", () => {
    for (const deviceClass of ["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"]) {
      expect(findSheetTemplate(deviceClass)?.passive).toBe(true);
    }
  });

  it("a passive class refuses output above the input at the line, column and field", () => {
    const e = refusal(() => parseMeasurementFile({ fileName: "gain.csv", text: gainSweep, ...ingestOptionsFor(combGeneratorTemplate) }));
    expect(e.code).toBe("implausible-value");
    expect([e.line, e.column, e.field]).toEqual([6, 2, "p2_out [dBm]"]);
    expect(e.message).toContain("6.00 dBm out is 6.00 dB above the 0.00 dBm");
  });

  it("an active class reads the same file with its gain and no plausibility warning", () => {
    const r = parseMeasurementFile({ fileName: "gain.csv", text: gainSweep, ...ingestOptionsFor(activeDoubler) });
    if (r.kind !== "drive-sweep") throw new Error(r.kind);
    expect(r.data.harmonics.find((h) => h.order === 2)?.outputPowerDbm).toEqual([6, 18]);
    expect(r.warnings.filter(isPlausibilityWarning)).toEqual([]);
  });

  it("an active class's Touchstone file may show |S21| above 0 dB; a passive class's may not", () => {
    const amplifier = "# GHz S DB R 50\n1 -15 0 12 40 -30 0 -12 0\n";
    expect(parseMeasurementFile({ fileName: "amp.s2p", text: amplifier, ...ingestOptionsFor(activeDoubler) }).kind).toBe("touchstone");
    expect(refusal(() => parseMeasurementFile({ fileName: "amp.s2p", text: amplifier, ...ingestOptionsFor(combGeneratorTemplate) })).code).toBe("implausible-value");
  });

  it("a foreign file read through a column mapping follows the class's switch too", () => {
    const foreign = new TextEncoder().encode("Pin (dBm),Pout 2f (dBm)\n0,6\n10,18\n");
    const mapping = [
      { column: "Pin (dBm)", target: "input_power", unit: "dBm" },
      { column: "Pout 2f (dBm)", target: "p2_out", unit: "dBm" },
    ];
    const read = (template: SheetTemplate) =>
      parseMappedFile({ fileName: "vendor.csv", bytes: foreign, kind: "drive-sweep", mapping, metadata: { serial: "BFD-0701", input_frequency: "1 GHz", wanted_order: "2" }, ...ingestOptionsFor(template) });
    expect(read(activeDoubler).kind).toBe("drive-sweep");
    expect(refusal(() => read(combGeneratorTemplate)).code).toBe("implausible-value");
  });

  it("a file read without a class is checked as a passive part's", () => {
    expect(ingestOptionsFor(undefined)).toEqual({ passive: true });
  });
});
