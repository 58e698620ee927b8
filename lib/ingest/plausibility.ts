/**
 * Values no passive part or bench can produce. Every class Benchfold makes sheets for is passive
 * (diode mixers, diode multipliers, hybrids and splitters: lib/domain/device-classes.ts), so a
 * file is checked as a passive part's unless the caller says otherwise (ParseOptions.passive).
 *
 * Two levels: beyond the stated uncertainty the value is refused (IngestError "implausible-value"
 * with file, line and column); inside it but still past the physical bound, the file is kept and
 * a warning starting with PLAUSIBILITY_PREFIX travels with the set to the review screen and to
 * the sheet's open issues. Numbers in messages are printed by lib/format at the precision the
 * file gives them.
 */
import { formatQuantity } from "../format";
import { cellText, type ColumnRequest, type CsvDocument } from "./csv-table";
import { IngestError } from "./errors";

import { PLAUSIBILITY_PREFIX } from "./plausibility-warning";

export { isPlausibilityWarning, PLAUSIBILITY_PREFIX } from "./plausibility-warning";

/**
 * Uncertainty of one absolute power reading (power meter or spectrum analyser), ±0.5 dB: common
 * practice for a bench's level accuracy after calibration (a figure from memory, stated here so
 * the message can quote it). A passive part's output minus its input combines two readings, so
 * it may read up to 1.0 dB above the input before it is refused.
 */
export const POWER_READING_UNCERTAINTY_DB = 0.5;
export const PASSIVE_GAIN_REFUSED_ABOVE_DB = 2 * POWER_READING_UNCERTAINTY_DB;
const SLACK_DB = 1e-9;

/**
 * A passive network's scattering matrix satisfies I − SᴴS ⪰ 0 (lossless when equal), so every
 * |Sij| ≤ 1 and, for each driven port j, Σi |Sij|² ≤ 1 (D. M. Pozar, Microwave Engineering,
 * 4th ed., §4.3, from memory). A vector network analyser's magnitude uncertainty after a full
 * two-port calibration is a few hundredths to about 0.1 dB near 0 dB (common practice): above
 * +0.1 dB a magnitude is suspicious (warning), above +1.0 dB no calibration explains it (refused).
 */
export const S_WARN_ABOVE_DB = 0.1;
export const S_REFUSED_ABOVE_DB = 1.0;

/** Decimals of the shortest text that reads back as x, when the written text is not at hand (at most 4). */
export function decimalsOf(x: number): number {
  return writtenDecimals(String(Math.abs(x)));
}

/** Decimals as written: "15.00" → 2, "-7,5" → 1, "1e-3" → 3; at most 4. */
export function writtenDecimals(text: string): number {
  const t = text.trim();
  if (/e/i.test(t)) return 3;
  const sep = Math.max(t.indexOf("."), t.indexOf(","));
  return sep === -1 ? 0 : Math.min(4, t.length - sep - 1);
}

/** Decimals of a CSV value as the file wrote it, when the column is in the unit printed (dBm, dB); else 2. */
function csvDecimals(doc: CsvDocument, request: ColumnRequest, line: number, value: number): number {
  const unit = request.conversion.unit.toLowerCase();
  if (unit !== "dbm" && unit !== "db") return 2;
  const text = cellText(doc, line, request.cell.index);
  return text === undefined ? decimalsOf(value) : writtenDecimals(text);
}

/** A value printed by the one formatter, at a given number of decimals, as plain text (messages go to the CLI too). */
export function printed(x: number, unit: string, decimals: number, signed = false): string {
  return formatQuantity(x, unit, { digits: { decimals }, plain: true, prefix: false, signed });
}

export interface PassiveColumns {
  /** The power going in (input_power), when the file has it. */
  input?: { request: ColumnRequest; values: number[] };
  /** Powers coming out (pN_out, output_power, fund_out): none may exceed the input on the same row. */
  outputs: { request: ColumnRequest; values: number[] }[];
  /** A loss column (conversion_loss): a passive part's loss is not negative. */
  losses: { request: ColumnRequest; values: number[] }[];
  /** File line of each row. */
  lines: number[];
}

/** Output above input (or a negative loss) for a passive part: refused beyond 1.0 dB, a warning from 0 to 1.0 dB. */
export function checkPassiveCsv(doc: CsvDocument, columns: PassiveColumns, warnings: string[]): void {
  const { input, lines } = columns;
  if (input) {
    for (const out of columns.outputs) {
      let worst = -1;
      let worstExcess = 0;
      let rows = 0;
      for (let r = 0; r < lines.length; r++) {
        const excess = out.values[r] - input.values[r];
        // Differences of decimal readings carry binary tails (11.37 − 10.37 = 1.0000000000000009): compare with a slack.
        if (!(excess > SLACK_DB)) continue;
        rows++;
        if (excess > PASSIVE_GAIN_REFUSED_ABOVE_DB + SLACK_DB) {
          const d = Math.max(csvDecimals(doc, out.request, lines[r], out.values[r]), csvDecimals(doc, input.request, lines[r], input.values[r]));
          refuseGain(doc, out.request, input.request, out.values[r], input.values[r], lines[r], d);
        }
        if (excess > worstExcess) {
          worstExcess = excess;
          worst = r;
        }
      }
      if (worst >= 0) {
        const d = Math.max(csvDecimals(doc, out.request, lines[worst], out.values[worst]), csvDecimals(doc, input.request, lines[worst], input.values[worst]));
        warnings.push(
          `${PLAUSIBILITY_PREFIX}"${out.request.cell.raw}" is above "${input.request.cell.raw}" on ${rows} row${rows === 1 ? "" : "s"}, ` +
            `by up to ${printed(worstExcess, "dB", d)} (line ${lines[worst]}: ${printed(out.values[worst], "dBm", d)} out, ${printed(input.values[worst], "dBm", d)} in); ` +
            `within the ${printed(PASSIVE_GAIN_REFUSED_ABOVE_DB, "dB", 1)} that two readings of ±${printed(POWER_READING_UNCERTAINTY_DB, "dB", 1)} allow, ` +
            "but a passive part has no gain: check the calibration and the offsets",
        );
      }
    }
  }
  for (const loss of columns.losses) {
    let worst = -1;
    let rows = 0;
    for (let r = 0; r < lines.length; r++) {
      const v = loss.values[r];
      if (!(v < -SLACK_DB)) continue;
      rows++;
      if (-v > PASSIVE_GAIN_REFUSED_ABOVE_DB + SLACK_DB) refuseNegativeLoss(doc, loss.request, v, lines[r], csvDecimals(doc, loss.request, lines[r], v));
      if (worst === -1 || v < loss.values[worst]) worst = r;
    }
    if (worst >= 0) {
      const v = loss.values[worst];
      warnings.push(
        `${PLAUSIBILITY_PREFIX}"${loss.request.cell.raw}" is negative (a gain) on ${rows} row${rows === 1 ? "" : "s"}, ` +
          `down to ${printed(v, "dB", csvDecimals(doc, loss.request, lines[worst], v))} on line ${lines[worst]}; within the ${printed(PASSIVE_GAIN_REFUSED_ABOVE_DB, "dB", 1)} ` +
          "that two readings allow, but a passive part has no gain: check the calibration and the offsets",
      );
    }
  }
}

function refuseGain(doc: CsvDocument, out: ColumnRequest, input: ColumnRequest, outDbm: number, inDbm: number, line: number, d: number): never {
  throw new IngestError({
    fileName: doc.fileName,
    code: "implausible-value",
    line,
    column: out.cell.index + 1,
    field: out.cell.raw,
    found: printed(outDbm, "dBm", d),
    expected: `at most ${printed(inDbm + PASSIVE_GAIN_REFUSED_ABOVE_DB, "dBm", d)} (the input plus ${printed(PASSIVE_GAIN_REFUSED_ABOVE_DB, "dB", 1)})`,
    detail:
      `${printed(outDbm, "dBm", d)} out is ${printed(outDbm - inDbm, "dB", d)} above the ${printed(inDbm, "dBm", d)} of "${input.cell.raw}" on the same row; ` +
      `a passive part cannot put out more than it takes in, and two readings of ±${printed(POWER_READING_UNCERTAINTY_DB, "dB", 1)} explain at most ` +
      `${printed(PASSIVE_GAIN_REFUSED_ABOVE_DB, "dB", 1)}: check the column order, the units and the attenuator offsets`,
  });
}

function refuseNegativeLoss(doc: CsvDocument, loss: ColumnRequest, lossDb: number, line: number, d: number): never {
  throw new IngestError({
    fileName: doc.fileName,
    code: "implausible-value",
    line,
    column: loss.cell.index + 1,
    field: loss.cell.raw,
    found: printed(lossDb, "dB", d),
    expected: `at least ${printed(-PASSIVE_GAIN_REFUSED_ABOVE_DB, "dB", 1)}`,
    detail:
      `a loss of ${printed(lossDb, "dB", d)} is a gain of ${printed(-lossDb, "dB", d)}, which a passive part cannot have; two readings of ` +
      `±${printed(POWER_READING_UNCERTAINTY_DB, "dB", 1)} explain at most ${printed(PASSIVE_GAIN_REFUSED_ABOVE_DB, "dB", 1)}: ` +
      "check the sign convention (loss is positive) and the offsets",
  });
}
