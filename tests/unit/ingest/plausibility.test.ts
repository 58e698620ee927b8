import { readdirSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { IngestError, parseMeasurementFile, parseTouchstone, type ParsedMeasurement } from "@/lib/ingest";
import { isPlausibilityWarning, printed, writtenDecimals } from "@/lib/ingest/plausibility";
import { FIXTURES } from "./fixture-files";
import { readFileSync } from "node:fs";

const FOLDER = path.join(FIXTURES, "implausible");

function parseFixture(file: string): ParsedMeasurement {
  return parseMeasurementFile({ fileName: file, bytes: new Uint8Array(readFileSync(path.join(FOLDER, file))) });
}

interface Refused {
  file: string;
  line: number;
  column: number;
  field: string;
  /** The whole message. */
  message: string;
}

// dB figures in the messages were checked with Python's math module (outside the project):
// 20·log10(1.35) = 2.6067 dB, 20·log10(hypot(0.9, 0.8)) = 1.6137 dB, 10·log10(2.5 mW / 1 mW) = 3.9794 dBm,
// 0.30² + 0.85² + 0.85² + 0.02² = 1.5354 → 10·log10 = 1.8622 dB.
const REFUSED: Refused[] = [
  {
    file: "drive-harmonic-above-input.csv",
    line: 13,
    column: 3,
    field: "p2_out [dBm]",
    message:
      'drive-harmonic-above-input.csv line 13, column 3 ("p2_out [dBm]"): 13.20 dBm out is 3.20 dB above the 10.00 dBm of "input_power [dBm]" on the same row; a passive part cannot put out more than it takes in, and two readings of ±0.5 dB explain at most 1.0 dB: check the column order, the units and the attenuator offsets',
  },
  {
    file: "drive-leak-through-in-milliwatts.csv",
    line: 11,
    column: 2,
    field: "p1_out [mW]",
    message:
      'drive-leak-through-in-milliwatts.csv line 11, column 2 ("p1_out [mW]"): 3.98 dBm out is 3.98 dB above the 0.00 dBm of "input_power [dBm]" on the same row; a passive part cannot put out more than it takes in, and two readings of ±0.5 dB explain at most 1.0 dB: check the column order, the units and the attenuator offsets',
  },
  {
    file: "mixer-conversion-gain.csv",
    line: 9,
    column: 2,
    field: "conversion_loss [dB]",
    message:
      'mixer-conversion-gain.csv line 9, column 2 ("conversion_loss [dB]"): a loss of -3.10 dB is a gain of 3.10 dB, which a passive part cannot have; two readings of ±0.5 dB explain at most 1.0 dB: check the sign convention (loss is positive) and the offsets',
  },
  {
    file: "mixer-negative-isolation.csv",
    line: 8,
    column: 3,
    field: "isolation_lo_rf [dB]",
    message:
      'mixer-negative-isolation.csv line 8, column 3 ("isolation_lo_rf [dB]"): a loss of -12.5 dB is a gain of 12.5 dB, which a passive part cannot have; two readings of ±0.5 dB explain at most 1.0 dB: check the sign convention (loss is positive) and the offsets',
  },
  {
    file: "mixer-output-above-input.csv",
    line: 8,
    column: 3,
    field: "output_power [dBm]",
    message:
      'mixer-output-above-input.csv line 8, column 3 ("output_power [dBm]"): -7.5 dBm out is 2.5 dB above the -10.0 dBm of "input_power [dBm]" on the same row; a passive part cannot put out more than it takes in, and two readings of ±0.5 dB explain at most 1.0 dB: check the column order, the units and the attenuator offsets',
  },
  {
    file: "two-tone-fundamental-gain.tsv",
    line: 9,
    column: 2,
    field: "fund_out [dBm]",
    message:
      'two-tone-fundamental-gain.tsv line 9, column 2 ("fund_out [dBm]"): -8.90 dBm out is 6.10 dB above the -15.00 dBm of "input_power [dBm]" on the same row; a passive part cannot put out more than it takes in, and two readings of ±0.5 dB explain at most 1.0 dB: check the column order, the units and the attenuator offsets',
  },
  {
    file: "attenuator-s21-gain.s2p",
    line: 4,
    column: 4,
    field: "S21 magnitude",
    message:
      'attenuator-s21-gain.s2p line 4, column 4 ("S21 magnitude"): S21 at 110 MHz is |S| 1.3500 (+2.61 dB), above 0 dB by more than the 1.0 dB a calibration error could explain; no passive network has gain: check the format (RI, MA or DB) on the option line, the port order and the calibration',
  },
  {
    file: "return-loss-positive-db.s1p",
    line: 4,
    column: 2,
    field: "S11 magnitude in dB",
    message:
      'return-loss-positive-db.s1p line 4, column 2 ("S11 magnitude in dB"): S11 at 1.5 GHz is +3.50 dB, above 0 dB by more than the 1.0 dB a calibration error could explain; no passive network has gain: check the format (RI, MA or DB) on the option line, the port order and the calibration',
  },
  {
    file: "splitter-ri-above-unity.s2p",
    line: 4,
    column: 4,
    field: "S21 real part",
    message:
      'splitter-ri-above-unity.s2p line 4, column 4 ("S21 real part"): S21 at 2 GHz is |S| 1.20 (+1.61 dB), above 0 dB by more than the 1.0 dB a calibration error could explain; no passive network has gain: check the format (RI, MA or DB) on the option line, the port order and the calibration',
  },
  {
    file: "hybrid-outputs-exceed-input.s4p",
    line: 7,
    column: 1,
    field: "frequency",
    message:
      'hybrid-outputs-exceed-input.s4p line 7, column 1 ("frequency"): at 1.6 GHz, with port 1 driven, |S11|² + |S21|² + |S31|² + |S41|² = 1.536 (+1.86 dB): the ports give out more power than goes in, by more than the 1.0 dB a calibration error could explain; a passive network cannot: check the port order and the calibration',
  },
];

const WARNED: { file: string; warnings: string[] }[] = [
  {
    file: "drive-harmonic-at-input.csv",
    warnings: [
      'Plausibility: "p2_out [dBm]" is above "input_power [dBm]" on 1 row, by up to 0.37 dB (line 14: 15.37 dBm out, 15.00 dBm in); within the 1.0 dB that two readings of ±0.5 dB allow, but a passive part has no gain: check the calibration and the offsets',
    ],
  },
  {
    file: "mixer-conversion-loss-slightly-negative.csv",
    warnings: [
      'Plausibility: "conversion_loss [dB]" is negative (a gain) on 1 row, down to -0.25 dB on line 8; within the 1.0 dB that two readings allow, but a passive part has no gain: check the calibration and the offsets',
    ],
  },
  {
    // 10·log10(|S11|² + |S21|²) with S11 = −33.40 dB and S21 = +0.30 dB is 0.3019 dB (Python's math module).
    file: "thru-line-slightly-above-0db.s2p",
    warnings: [
      "Plausibility: 1 S-parameter value is above 0 dB by more than 0.1 dB, up to +0.30 dB (S21 at 2 GHz, line 4); a passive network stays at or below 0 dB, so this is more than a calibrated analyser's uncertainty: check the calibration",
      "Plausibility: the power leaving all ports exceeds the power sent in by more than 0.1 dB at 1 frequency, up to +0.30 dB (port 1 driven, at 2 GHz, line 4); a passive network cannot add power: check the calibration",
    ],
  },
];

describe("values no passive part can produce are refused with file, line and column", () => {
  it.each(REFUSED)("$file", ({ file, line, column, field, message }) => {
    let error: unknown;
    try {
      parseFixture(file);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(IngestError);
    const e = error as IngestError;
    expect(e.code).toBe("implausible-value");
    expect({ line: e.line, column: e.column, field: e.field }).toEqual({ line, column, field });
    expect(e.message).toBe(message);
  });
});

describe("values past the bound but inside the uncertainty are kept, with a warning", () => {
  it.each(WARNED)("$file", ({ file, warnings }) => {
    const r = parseFixture(file);
    expect(r.warnings.filter(isPlausibilityWarning)).toEqual(warnings);
  });

  it("every file in fixtures/implausible is listed above", () => {
    const listed = new Set([...REFUSED.map((c) => c.file), ...WARNED.map((c) => c.file)]);
    expect(readdirSync(FOLDER).filter((f) => !listed.has(f))).toEqual([]);
    expect(REFUSED.length).toBeGreaterThanOrEqual(10);
  });
});

describe("the thresholds", () => {
  const drive = (out: string) =>
    ["# kind: drive-sweep", "# serial: BFD-0600", "# input_frequency: 1 GHz", "# wanted_order: 2", "input_power [dBm],p2_out [dBm]", "0.00,-20.00", `10.00,${out}`].join("\n");

  it("output 1.00 dB above the input is a warning; 1.01 dB is refused", () => {
    expect(parseMeasurementFile({ fileName: "a.csv", text: drive("11.00") }).warnings.filter(isPlausibilityWarning)).toHaveLength(1);
    expect(() => parseMeasurementFile({ fileName: "b.csv", text: drive("11.01") })).toThrowError(/1\.01 dB above the 10\.00 dBm/);
  });

  it("a difference of exactly 1.00 dB in decimal readings is not refused for its binary tail", () => {
    // 11.37 − 10.37 is 1.0000000000000009 in binary floating point.
    const text = drive("11.37").replace("10.00,", "10.37,");
    expect(parseMeasurementFile({ fileName: "e.csv", text }).warnings.filter(isPlausibilityWarning)).toHaveLength(1);
  });

  it("output equal to the input raises nothing", () => {
    expect(parseMeasurementFile({ fileName: "c.csv", text: drive("10.00") }).warnings.filter(isPlausibilityWarning)).toEqual([]);
  });

  it("an S-parameter at +0.10 dB is quiet, +0.11 dB warns, +1.00 dB warns, +1.01 dB is refused", () => {
    const s1p = (db: string) => `# GHz S DB R 50\n1 -20 0\n2 ${db} 0\n`;
    const plausibility = (db: string) => parseTouchstone("x.s1p", s1p(db)).warnings.filter(isPlausibilityWarning);
    expect(plausibility("0.10")).toEqual([]);
    expect(plausibility("0.11")).toHaveLength(2);
    expect(plausibility("1.00")).toHaveLength(2);
    expect(() => parseTouchstone("x.s1p", s1p("1.01"))).toThrowError(/x\.s1p line 3, column 2 \("S11 magnitude in dB"\): S11 at 2 GHz is \+1\.01 dB/);
  });

  it("an active part's file is read when the caller says it is not passive", () => {
    expect(parseMeasurementFile({ fileName: "d.csv", text: drive("25.00"), passive: false }).kind).toBe("drive-sweep");
    expect(parseTouchstone("amp.s1p", "# GHz S DB R 50\n1 12 0\n", { passive: false }).data.portCount).toBe(1);
  });
});

describe("printing at the value's precision through lib/format", () => {
  it.each([
    ["15.00", 2],
    ["-7,5", 1],
    ["3", 0],
    ["1e-3", 3],
    ["0.123456", 4],
  ])("%s has %i decimals", (text, decimals) => expect(writtenDecimals(text)).toBe(decimals));

  it("differences of two readings print without floating-point tails", () => {
    // 15.37 − 15.00 in binary floating point is 0.3699999999999992.
    expect(15.37 - 15).not.toBe(0.37);
    expect(printed(15.37 - 15, "dB", 2)).toBe("0.37 dB");
    expect(printed(-3.1, "dB", 2)).toBe("-3.10 dB");
    expect(printed(0.3, "dB", 2, true)).toBe("+0.30 dB");
  });
});
