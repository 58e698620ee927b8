import { readdirSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { IngestError, parseMeasurementFile, type IngestErrorCode } from "@/lib/ingest";
import { FIXTURES, fixtureBytes } from "./fixture-files";

interface Case {
  file: string;
  code: IngestErrorCode;
  line?: number;
  column?: number;
  field?: string;
  /** A fragment the message must contain after "<file> line <n>…: ". */
  says: string;
}

// One row per file in fixtures/malformed; the last test checks none is left out.
const CASES: Case[] = [
  { file: "empty.csv", code: "empty-file", says: "the file is empty" },
  { file: "whitespace-only.csv", code: "empty-file", says: "only whitespace" },
  { file: "binary-nul.csv", code: "binary-file", line: 3, says: "binary file (it contains NUL bytes)" },
  { file: "invalid-utf8.csv", code: "invalid-encoding", line: 10, says: "not valid UTF-8" },
  { file: "control-characters.csv", code: "binary-file", line: 11, says: "control character U+0001" },
  { file: "drive-truncated-row.csv", code: "truncated", line: 12, says: "row has 3 cells, expected 4" },
  { file: "drive-mixed-delimiters.csv", code: "mixed-delimiters", line: 11, says: "contains semicolons" },
  { file: "header-mixed-delimiters.csv", code: "mixed-delimiters", line: 8, says: "mixes semicolon and comma" },
  { file: "drive-text-in-number.csv", code: "bad-number", line: 10, column: 3, field: "p2_out [dBm]", says: 'expected a number in dBm, found "n/a"' },
  { file: "drive-trailing-garbage.csv", code: "bad-number", line: 11, column: 1, field: "input_power [dBm]", says: 'found "12abc"' },
  { file: "drive-inf.csv", code: "non-finite", line: 12, column: 4, field: "p3_out [dBm]", says: 'finite number in dBm, found "-Inf"' },
  { file: "drive-empty-cell.csv", code: "empty-cell", line: 9, column: 3, field: "p2_out [dBm]", says: "found an empty cell" },
  { file: "drive-500-dbm.csv", code: "out-of-range", line: 12, column: 3, field: "p2_out [dBm]", says: "500 dBm is outside the plausible range for a power (from -200 to 60 dBm)" },
  { file: "drive-unknown-unit.csv", code: "unknown-unit", line: 8, column: 3, field: "p2_out [dBW]", says: 'unknown unit "dBW" for a power; expected one of dBm, mW, W' },
  { file: "drive-missing-unit.csv", code: "missing-unit", line: 8, column: 1, field: "input_power", says: "has no unit" },
  { file: "drive-missing-input-column.csv", code: "missing-column", line: 8, field: "input_power", says: 'required column "input_power [dBm]" is missing' },
  { file: "drive-missing-wanted-column.csv", code: "missing-column", line: 8, field: "p2_out", says: 'wanted_order is 2 but there is no "p2_out [dBm]" column' },
  { file: "drive-duplicate-column.csv", code: "duplicate-column", line: 8, column: 4, field: "p2_out [dBm]", says: "appears twice (also column 3)" },
  { file: "drive-non-monotonic-power.csv", code: "non-monotonic", line: 11, column: 1, field: "input_power [dBm]", says: "decreases after line 10" },
  { file: "drive-bad-metadata.csv", code: "bad-metadata", line: 3, field: "input_frequency", says: 'expected a frequency with its unit, e.g. "1 GHz", found "fast"' },
  { file: "drive-metadata-unknown-unit.csv", code: "unknown-unit", line: 3, field: "input_frequency", says: 'unknown unit "GHzz"' },
  { file: "drive-metadata-no-unit.csv", code: "bad-metadata", line: 5, field: "splitter_excess_loss", says: '"0.4" has no unit' },
  { file: "drive-date-february-30.csv", code: "bad-metadata", line: 5, field: "date", says: "2026-02-30 is not a date: February 2026 has 28 days" },
  { file: "phase-noise-zero-date.csv", code: "bad-metadata", line: 3, field: "date", says: "0000-00-00 is not a date: the year must be from 1900 to 9999" },
  { file: "drive-bad-wanted-order.csv", code: "bad-metadata", line: 4, field: "wanted_order", says: 'whole number from 1 to 16, found "two"' },
  { file: "drive-missing-serial.csv", code: "missing-metadata", field: "serial", says: '"# serial: BFD-0001"' },
  { file: "drive-missing-input-frequency.csv", code: "missing-metadata", field: "input_frequency", says: 'required metadata "input_frequency" is missing' },
  { file: "duplicate-metadata.csv", code: "duplicate-metadata", line: 8, field: "serial", says: "appears twice (first on line 2)" },
  { file: "temperature-absurd.csv", code: "out-of-range", line: 7, field: "temperature", says: "900 C is outside the plausible range for a temperature" },
  { file: "missing-header.csv", code: "missing-header", line: 8, says: "expected a header row" },
  { file: "only-metadata.csv", code: "missing-header", says: "no header row and no data" },
  { file: "unknown-kind.csv", code: "unknown-kind", line: 2, says: 'cannot tell the measurement kind from the header "voltage [V],current [A]"' },
  { file: "bad-kind.csv", code: "unknown-kind", line: 1, field: "kind", says: 'unknown kind "spectrum"' },
  { file: "phase-noise-nan.csv", code: "non-finite", line: 9, column: 2, field: "L [dBc/Hz]", says: 'found "NaN"' },
  { file: "phase-noise-non-monotonic.csv", code: "non-monotonic", line: 9, column: 1, field: "offset [Hz]", says: "strictly increasing" },
  { file: "phase-noise-zero-offset.csv", code: "out-of-range", line: 7, column: 1, field: "offset [Hz]", says: "0 Hz is outside the plausible range for a frequency (greater than 0 Hz and at most 3 THz)" },
  { file: "phase-noise-positive-l.csv", code: "out-of-range", line: 8, column: 2, field: "L [dBc/Hz]", says: "5.0 dBc/Hz is outside the plausible range for a phase-noise density (from -250 to 0 dBc/Hz)" },
  { file: "phase-noise-one-point.csv", code: "too-few-points", line: 6, says: "found 1 data row after the header, expected at least 2" },
  { file: "phase-noise-missing-carrier.csv", code: "missing-metadata", field: "carrier_frequency", says: '"# carrier_frequency: 2 GHz"' },
  { file: "phase-noise-two-bandwidths.csv", code: "bad-metadata", line: 5, field: "noise_bandwidth", says: "states both a noise bandwidth and a resolution bandwidth" },
  { file: "phase-noise-bad-bandwidth.csv", code: "bad-metadata", line: 4, field: "resolution_bandwidth", says: 'expected a frequency with its unit, e.g. "1 kHz", found "wide"' },
  { file: "phase-noise-bandwidth-text.csv", code: "bad-number", line: 6, column: 3, field: "resolution_bandwidth [Hz]", says: 'expected a number in Hz, found "auto"' },
  { file: "phase-noise-bandwidth-line-and-column.csv", code: "bad-metadata", line: 5, column: 3, field: "noise_bandwidth [Hz]", says: 'states its bandwidth twice: a "# resolution_bandwidth:" line and this column' },
  { file: "phase-noise-input-without-factor.csv", code: "missing-metadata", line: 4, column: 3, field: "L_input [dBc/Hz]", says: 'add a line "# multiplication_factor: 2"' },
  { file: "freq-duplicate.csv", code: "duplicate-value", line: 8, column: 1, field: "frequency [MHz]", says: "repeats the value of line 7" },
  { file: "freq-negative.csv", code: "out-of-range", line: 6, column: 1, field: "frequency [MHz]", says: "-500 MHz is outside the plausible range" },
  { file: "freq-unknown-unit.csv", code: "unknown-unit", line: 5, column: 1, field: "frequency [THz]", says: "expected one of Hz, kHz, MHz, GHz" },
  { file: "freq-no-measured-column.csv", code: "missing-column", line: 5, says: "needs at least one of" },
  { file: "utf16-le-bom.csv", code: "invalid-encoding", says: "this file is UTF-16 text (little-endian, byte-order mark FF FE); save it as UTF-8" },
  { file: "utf16-be-no-bom.csv", code: "invalid-encoding", says: "this file is UTF-16 text (big-endian, no byte-order mark: a NUL before every character); save it as UTF-8" },
  { file: "two-port-data-in-s4p.s4p", code: "port-count", line: 4, says: 'the ".s4p" extension means 4 ports, so a frequency\'s record is 33 numbers over 4 lines, but this line repeats the first line\'s 9; each line holds 9 numbers, the frequency and 4 complex values of 2-port data; rename the file to the data\'s port count' },
  { file: "one-frequency-2port-in-s4p.s4p", code: "port-count", line: 2, says: "the file ends after 9; each line holds 9 numbers, the frequency and 4 complex values of 2-port data" },
  { file: "v2-one-port-data-declared-two.s2p", code: "port-count", line: 7, says: "[Number of Ports] says 2, so a frequency's record is 9 numbers, and [Number of Frequencies] 3 does not match the 1 record read that way; each line holds 3 numbers, the frequency and 1 complex value of 1-port data; correct [Number of Ports]" },
  { file: "quoted-unclosed.csv", code: "bad-quoting", line: 8, column: 2, says: "this cell opens a quote that is never closed" },
  { file: "quoted-text-after-quote.csv", code: "bad-quoting", line: 8, column: 2, says: 'text after the closing quote of this cell ("dB")' },
  { file: "quoted-stray-quote.csv", code: "bad-quoting", line: 8, column: 3, says: "a quote inside an unquoted cell" },
  // Line 7 holds a quoted line break, so the row with "6,01" is physical line 9 (the 8th record line).
  { file: "quoted-bad-number-after-line-break.csv", code: "bad-number", line: 9, column: 2, field: "conversion_loss [dB]", says: 'found "6,01"; a decimal comma is read only in semicolon-delimited files: write 6.01 or use semicolons' },
  { file: "quoted-short-row.csv", code: "truncated", line: 8, says: "row has 3 cells, expected 4" },
  { file: "freq-too-many-cells.csv", code: "cell-count", line: 7, says: "row has 4 cells, expected 3" },
  { file: "two-tone-negative-milliwatts.csv", code: "out-of-range", line: 6, column: 1, field: "input_power [mW]", says: "must be greater than 0, found -1 mW" },
  { file: "two-tone-missing-im3.csv", code: "missing-column", line: 4, field: "im3_out", says: 'required column "im3_out [dBm]"' },
  { file: "wrong-ports-for-extension.s2p", code: "port-count", line: 3, says: 'the ".s2p" extension means 2 ports' },
  { file: "four-port-data.s3p", code: "port-count", line: 2, says: "7 numbers, found 9" },
  { file: "bad-option-token.s2p", code: "bad-option-line", line: 1, column: 4, field: "option line", says: 'unrecognised option "Q"' },
  { file: "unknown-format.s1p", code: "bad-option-line", line: 1, column: 3, field: "option line", says: 'unrecognised option "XY"' },
  { file: "y-parameters.s2p", code: "unsupported-parameter", line: 1, column: 2, field: "option line", says: "Y-parameters are not supported" },
  { file: "bad-reference.s1p", code: "bad-option-line", line: 1, column: 5, field: "option line", says: 'positive reference resistance in ohms, found "-5"' },
  { file: "missing-option-line.s1p", code: "missing-option-line", line: 2, field: "option line", says: "must come before the data" },
  { file: "touchstone-non-monotonic.s1p", code: "non-monotonic", line: 4, column: 1, field: "frequency", says: "lower than the one on line 3" },
  { file: "touchstone-duplicate-frequency.s2p", code: "duplicate-value", line: 3, column: 1, field: "frequency", says: "repeats the one on line 2" },
  { file: "touchstone-negative-frequency.s1p", code: "out-of-range", line: 2, column: 1, field: "frequency", says: "outside 0 to 3 THz" },
  { file: "touchstone-text-in-data.s2p", code: "bad-number", line: 3, column: 5, field: "S21 angle", says: 'found "n/a"' },
  { file: "touchstone-nan.s1p", code: "non-finite", line: 2, column: 3, field: "S11 imaginary part", says: 'found "NaN"' },
  { file: "touchstone-truncated.s4p", code: "truncated", line: 7, says: "only 17 of its 33 numbers" },
  { file: "touchstone-row-wrap.s3p", code: "cell-count", line: 3, says: "expected 6 numbers on this line of 3-port data" },
  { file: "v1-no-extension.txt", code: "missing-port-count", line: 2, says: '".sNp" extension' },
  { file: "v1-with-v2-keyword.s2p", code: "bad-keyword", line: 2, field: "[Number of Ports]", says: "is a Touchstone 2.0 keyword" },
  { file: "v2-missing-two-port-order.s2p", code: "missing-keyword", line: 5, field: "[Two-Port Data Order]", says: "required for 2-port data" },
  { file: "v2-bad-two-port-order.s2p", code: "bad-keyword", line: 4, field: "[Two-Port Data Order]", says: 'must be 12_21 or 21_12, found "21-12"' },
  { file: "v2-frequency-count-mismatch.s2p", code: "frequency-count-mismatch", line: 4, field: "[Number of Frequencies]", says: "says 3 but the data has 2" },
  { file: "v2-missing-network-data.s2p", code: "missing-keyword", line: 5, field: "[Network Data]", says: "data before [Network Data]" },
  { file: "v2-missing-number-of-ports.s2p", code: "missing-keyword", line: 4, field: "[Number of Ports]", says: "required before [Network Data]" },
  { file: "v2-missing-option-line.s2p", code: "missing-option-line", line: 4, field: "option line", says: "needs the option line" },
  { file: "v2-reference-count.s4p", code: "reference-count", line: 5, field: "[Reference]", says: "lists 3 values, expected 4" },
  { file: "v2-mixed-mode.s2p", code: "unsupported-feature", line: 4, field: "[Mixed-Mode Order]", says: "mixed-mode (differential) data is not supported" },
  { file: "v2-two-frequencies-on-one-line.s2p", code: "cell-count", line: 7, says: "each frequency must start on a new line" },
];

function expectedPrefix(c: Case): string {
  let where = c.file;
  if (c.line !== undefined) where += ` line ${c.line}`;
  if (c.column !== undefined) where += `${c.line !== undefined ? "," : ""} column ${c.column}`;
  if (c.field !== undefined) where += ` ("${c.field}")`;
  return `${where}: `;
}

describe("malformed fixtures give their specific error", () => {
  it.each(CASES)("$file → $code", (c) => {
    let caught: unknown;
    try {
      parseMeasurementFile({ fileName: c.file, bytes: fixtureBytes("malformed", c.file) });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(IngestError);
    const err = caught as IngestError;
    expect({ code: err.code, line: err.line, column: err.column, field: err.field }).toEqual({
      code: c.code,
      line: c.line,
      column: c.column,
      field: c.field,
    });
    expect(err.fileName).toBe(c.file);
    expect(err.message.startsWith(expectedPrefix(c))).toBe(true);
    expect(err.message).toContain(c.says);
  });

  it("covers at least 40 files and every file in fixtures/malformed", () => {
    const files = readdirSync(path.join(FIXTURES, "malformed")).sort();
    expect(CASES.map((c) => c.file).sort()).toEqual(files);
    expect(files.length).toBeGreaterThanOrEqual(40);
  });
});
