import { describe, expect, it } from "vitest";
import { detectKind, IngestError, parseDriveSweep, parseFrequencySweep, parseMeasurementFile, parsePhaseNoise } from "@/lib/ingest";
import { parseNumberAt } from "@/lib/ingest/number";
import { fixtureText } from "./fixture-files";

function num(text: string, decimalComma = false) {
  return parseNumberAt(text, 0, text.length, decimalComma);
}

function codeOf(f: () => unknown): string | undefined {
  try {
    f();
  } catch (e) {
    if (e instanceof IngestError) return e.code;
    throw e;
  }
  return undefined;
}

describe("strict numbers", () => {
  it.each([
    ["1", 1],
    ["-1.5", -1.5],
    ["+2", 2],
    [".5", 0.5],
    ["5.", 5],
    ["1e3", 1000],
    ["1E-3", 0.001],
    ["-0.000001", -0.000001],
    ["123456789012345678901", 123456789012345678901],
    ["1e-400", 0],
  ])("accepts %s", (text, value) => expect(num(text)).toBe(value));

  it.each(["", "-", ".", "1e", "1e+", "0x10", "Infinity", "NaN", "1,5", "12abc", "1 2", "--1", "1.2.3", "e5", "١"])("rejects %j", (text) =>
    expect(num(text)).toBeNaN(),
  );

  it("accepts a decimal comma only when asked, and only one separator", () => {
    expect(num("-12,5", true)).toBe(-12.5);
    expect(num("12.5", true)).toBe(12.5);
    expect(num("1,5,0", true)).toBeNaN();
    expect(num("1.000,5", true)).toBeNaN();
  });

  it("rounds exactly like Number() on random decimal strings", () => {
    let seed = 7;
    const rand = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
    for (let i = 0; i < 5_000; i++) {
      const digits = 1 + Math.floor(rand() * 17);
      let t = (rand() < 0.5 ? "-" : "") + String(Math.floor(rand() * 10 ** Math.min(digits, 15)));
      if (rand() < 0.7) t += "." + String(Math.floor(rand() * 1e9)).padStart(9, "0").slice(0, 1 + Math.floor(rand() * 9));
      if (rand() < 0.3) t += "e" + String(Math.floor(rand() * 40) - 20);
      expect(num(t)).toBe(Number(t));
    }
  });
});

describe("CSV conventions", () => {
  const drive = fixtureText("examples", "drive-sweep-doubler.csv");

  it("accepts a UTF-8 BOM, CRLF line ends and trailing blank lines, as text or bytes", () => {
    const variant = "\uFEFF" + drive.replace(/\n/g, "\r\n") + "\r\n\r\n  \r\n";
    const fromText = parseDriveSweep("bom.csv", variant).data;
    const fromBytes = parseDriveSweep("bom.csv", new TextEncoder().encode(variant)).data;
    const plain = parseDriveSweep("plain.csv", drive).data;
    expect(fromText).toEqual(plain);
    expect(fromBytes).toEqual(plain);
  });

  it("converts units to Hz, dBm and °C", () => {
    const text = [
      "# serial: BFD-0009",
      "# temperature: 298.15 K",
      "# lo_power: 0.005 W",
      "frequency [kHz],output_power [mW],conversion_loss [dB]",
      "1500,1,6",
      "2500,0.5,6.5",
    ].join("\n");
    const { data } = parseFrequencySweep("units.csv", text);
    expect(data.frequencyHz).toEqual([1.5e6, 2.5e6]);
    expect(data.outputPowerDbm![0]).toBe(0);
    expect(data.outputPowerDbm![1]).toBeCloseTo(-3.0103, 4);
    expect(data.temperatureC).toBeCloseTo(25, 12);
    expect(data.loPowerDbm).toBeCloseTo(6.9897, 4);
  });

  it("warns about defaulted corrections, ignored columns and unknown metadata", () => {
    const text = [
      "# serial: BFD-0001",
      "# input_frequency: 1 GHz",
      "# wanted_order: 2",
      "# operator_note: x",
      "input_power [dBm],p2_out [dBm],dc_current [mA]",
      "10,-3,12",
    ].join("\n");
    const { data, warnings } = parseDriveSweep("w.csv", text);
    expect(data.splitterExcessLossDb).toBe(0);
    expect(data.cableLossDb).toBe(0);
    expect(warnings).toEqual([
      'no "# temperature:" metadata; the measurement temperature is unknown',
      'no "# splitter_excess_loss:" metadata; taken as 0 dB',
      'no "# cable_loss:" metadata; taken as 0 dB',
      'column "dc_current [mA]" is not used by this kind and was ignored',
      'metadata "operator_note" is not used by this kind',
    ]);
  });

  it("skips # comment lines between data rows", () => {
    const text = "# serial: BFD-1\n# carrier_frequency: 1 GHz\noffset [Hz],L [dBc/Hz]\n10,-100\n# marker moved\n100,-110\n";
    expect(parsePhaseNoise("c.csv", text).data.offsetHz).toEqual([10, 100]);
  });

  it("refuses a file read as another kind than it declares", () => {
    expect(codeOf(() => parseMeasurementFile({ fileName: "d.csv", text: drive, kind: "two-tone" }))).toBe("bad-metadata");
  });
});

describe("kind detection", () => {
  it.each([
    ["drive-sweep-doubler.csv", "drive-sweep"],
    ["frequency-sweep-mixer.csv", "frequency-sweep"],
    ["two-tone-mixer.tsv", "two-tone"],
    ["phase-noise-doubler.csv", "phase-noise"],
    ["hybrid-4port-v2.s4p", "touchstone"],
  ] as const)("%s is %s", (name, kind) => {
    expect(detectKind(name, fixtureText("examples", name))).toBe(kind);
  });

  it("takes a .ts name (the Touchstone 2.0 extension) as Touchstone", () => {
    expect(detectKind("network.ts", fixtureText("examples", "hybrid-4port-v2.s4p"))).toBe("touchstone");
  });

  it("reads the kind from the header columns without a # kind line", () => {
    expect(detectKind("x.csv", "offset [Hz],L [dBc/Hz]\n1,-100\n")).toBe("phase-noise");
    expect(detectKind("x.csv", "input_power [dBm];fund_out [dBm];im3_out [dBm]\n")).toBe("two-tone");
    expect(detectKind("x.csv", "input_power [dBm],p2_out [dBm]\n")).toBe("drive-sweep");
    expect(detectKind("x.csv", "frequency [GHz],isolation_lo_if [dB]\n")).toBe("frequency-sweep");
  });

  it("recognises Touchstone by extension, option line or [Version]", () => {
    expect(detectKind("a.S2P", "")).toBe("touchstone");
    expect(detectKind("a.txt", "! comment\n# GHz S RI R 50\n1 0 0\n")).toBe("touchstone");
    expect(detectKind("a.txt", "[Version] 2.0\n")).toBe("touchstone");
  });
});
