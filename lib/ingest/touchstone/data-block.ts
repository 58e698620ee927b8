/**
 * The network data of a Touchstone file: numbers read in place (readBlankDelimitedNumber) into one growing
 * Float64Array, each line checked against the record layout of its version, then converted to
 * real/imaginary in the entry-major layout of TouchstoneData.
 */
import type { IngestErrorCode } from "../errors";
import { shortenFound } from "../errors";
import { looksNonFinite, readBlankDelimitedNumber } from "../number";
import type { TouchstoneData } from "../types";
import { formatQuantity } from "../../format";
import { PLAUSIBILITY_PREFIX, printed, S_REFUSED_ABOVE_DB, S_WARN_ABOVE_DB, writtenDecimals } from "../plausibility";
import { RANGES } from "../units";
import { entryName, fail, partName, type Pair, type State } from "./state";

const DEG = Math.PI / 180;

// Read once into a local: through tsx (the CLI, the benchmark) an imported function is a getter on
// its module, and this one is called for every number of the network data.
const readNumber = readBlankDelimitedNumber;

/**
 * Order of the (i, j) pairs within one frequency's record.
 * v1.1: two-port data is N11 N21 N12 N22; other sizes are row by row.
 * v2.0: [Two-Port Data Order] picks 12_21 or 21_12; [Matrix Format]
 * Lower/Upper lists only one triangle (row by row), the other is symmetric.
 */
export function pairOrder(n: number, twoPortOrder: "12_21" | "21_12", matrix: "full" | "lower" | "upper"): Pair[] {
  if (n === 2 && matrix === "full" && twoPortOrder === "21_12") {
    return [
      { i: 0, j: 0 },
      { i: 1, j: 0 },
      { i: 0, j: 1 },
      { i: 1, j: 1 },
    ];
  }
  const pairs: Pair[] = [];
  for (let i = 0; i < n; i++) {
    const from = matrix === "upper" ? i : 0;
    const to = matrix === "lower" ? i : n - 1;
    for (let j = from; j <= to; j++) pairs.push({ i, j });
  }
  return pairs;
}

/** Tokens per line for one v1.1 record: frequency plus at most 4 pairs per line, each matrix row on new lines. */
function v1LinePattern(n: number): number[] {
  if (n <= 2) return [1 + 2 * n * n];
  const pattern: number[] = [];
  for (let row = 0; row < n; row++) {
    for (let done = 0; done < n; done += 4) {
      const pairs = Math.min(4, n - done);
      pattern.push(2 * pairs + (pattern.length === 0 ? 1 : 0));
    }
  }
  return pattern;
}

/** True when nothing but blanks and comments follows `from`. */
function restIsBlank(text: string, from: number): boolean {
  let i = from;
  while (i < text.length) {
    const nl = text.indexOf("\n", i);
    const end = nl === -1 ? text.length : nl;
    const bang = text.indexOf("!", i);
    const stop = bang !== -1 && bang < end ? bang : end;
    if (text.slice(i, stop).trim() !== "") return false;
    i = end + 1;
  }
  return true;
}

const isBlank = (c: number) => c === 32 || c === 9 || c === 12 || c === 13;

/** One file's network data, read a line at a time. */
export class DataBlock {
  private raw: Float64Array;
  private count = 0;
  private recordLength = 0;
  private pattern: number[] = [];
  private patternIndex = 0;
  private pairs: Pair[] = [];
  private recordPos = 0;
  private records = 0;
  private previousFrequency = -Infinity;
  private previousFrequencyLine = 0;
  private lastDataLine = 0;
  /** Per data line: its number and the index of its first value in raw, for naming a value's line and column. */
  private lineNumbers = new Int32Array(256);
  private lineFirstValue = new Int32Array(256);
  private lineStart = new Int32Array(256);
  private text = "";
  private dataLines = 0;
  /** Numbers on the first data line, and whether every data line held as many (a port-count mismatch shows as such). */
  private firstLineCount = 0;
  private uniformLines = true;

  constructor(
    private readonly s: State,
    private readonly extensionPorts: number | undefined,
    textLength: number,
  ) {
    this.raw = new Float64Array(Math.max(1024, textLength >> 3));
  }

  /** True once a data number was read; comments after that are not kept. */
  get started(): boolean {
    return this.count > 0;
  }

  private begin(lineNo: number): void {
    const s = this.s;
    if (s.version === 1) {
      if (s.optionLine === 0) {
        fail(s, "missing-option-line", 'the option line ("# <unit> S <format> R <ohms>", e.g. "# GHz S MA R 50") must come before the data', {
          line: lineNo,
          field: "option line",
          expected: "# GHz S MA R 50",
        });
      }
      s.ports = this.extensionPorts!;
      this.pattern = v1LinePattern(s.ports);
      this.pairs = pairOrder(s.ports, "21_12", "full");
    } else {
      this.pairs = pairOrder(s.ports, s.twoPortOrder ?? "12_21", s.matrix);
    }
    this.recordLength = 1 + 2 * this.pairs.length;
  }

  /** Reads the data line text[start, end) (trimmed, comment cut); `next` is where the following line starts. */
  readLine(text: string, start: number, end: number, lineNo: number, next: number): void {
    if (this.recordLength === 0) this.begin(lineNo);
    const lineFirst = this.count;
    const n = this.readNumbers(text, start, end, lineNo);
    if (this.s.version === 1) {
      if (this.isV1NoiseStart(n, lineFirst, lineNo)) return;
      this.checkV1Line(n, text, next, lineNo);
    } else if (n > 0) {
      this.checkV2Line(n, lineNo);
    }
    if (this.recordPos === 0) this.checkFrequency(this.raw[lineFirst] * this.s.frequencyScale, text.slice(start, end), lineNo);
    this.noteLine(lineNo, lineFirst, n, start);
    this.text = text;
    this.count += n;
    this.recordPos += n;
    if (this.recordPos === this.recordLength) {
      this.recordPos = 0;
      this.records++;
    }
    this.lastDataLine = lineNo;
  }

  private noteLine(lineNo: number, first: number, n: number, start: number): void {
    if (this.dataLines === this.lineNumbers.length) {
      const grow = (a: Int32Array) => {
        const b = new Int32Array(a.length * 2);
        b.set(a);
        return b;
      };
      this.lineNumbers = grow(this.lineNumbers);
      this.lineFirstValue = grow(this.lineFirstValue);
      this.lineStart = grow(this.lineStart);
    }
    this.lineStart[this.dataLines] = start;
    if (this.dataLines === 0) this.firstLineCount = n;
    else if (n !== this.firstLineCount) this.uniformLines = false;
    this.lineNumbers[this.dataLines] = lineNo;
    this.lineFirstValue[this.dataLines] = first;
    this.dataLines++;
  }

  /** Decimals of raw[index] as the file wrote it. */
  private decimalsAt(index: number): number {
    const { column, at } = this.locate(index);
    const text = this.text;
    let i = this.lineStart[at];
    for (let c = 1; ; c++) {
      while (i < text.length && isBlank(text.charCodeAt(i))) i++;
      let e = i;
      while (e < text.length && !isBlank(text.charCodeAt(e)) && text.charCodeAt(e) !== 10) e++;
      if (c === column || e === i) return writtenDecimals(text.slice(i, e));
      i = e;
    }
  }

  /** Line and 1-based column (value on its line) of raw[index]. */
  private locate(index: number): { line: number; column: number; at: number } {
    let lo = 0;
    let hi = this.dataLines - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.lineFirstValue[mid] <= index) lo = mid;
      else hi = mid - 1;
    }
    return { line: this.lineNumbers[lo], column: index - this.lineFirstValue[lo] + 1, at: lo };
  }

  /** "2-port data" when n numbers make one record of a k-port file with k ≤ 2 laid out on one line (v1.1 and v2.0 alike). */
  private static looksLike(n: number): string {
    for (let k = 1; k <= 2; k++) if (n === 1 + 2 * k * k) return `; each line holds ${n} numbers, the frequency and ${k * k} complex value${k === 1 ? "" : "s"} of ${k}-port data`;
    return "";
  }

  private portSource(): string {
    const s = this.s;
    return s.version === 1 ? `the ".s${s.ports}p" extension means ${s.ports} port${s.ports === 1 ? "" : "s"}` : `[Number of Ports] says ${s.ports}`;
  }

  /** The data does not fit the declared port count: say so, with what the lines look like. */
  private failPortCount(lineNo: number, detail: string): never {
    return fail(this.s, "port-count", `${this.portSource()}, ${detail}${DataBlock.looksLike(this.firstLineCount)}; ${this.s.version === 1 ? "rename the file to the data's port count" : "correct [Number of Ports]"}`, {
      line: lineNo,
      expected: `${this.recordLength} numbers per frequency (${this.s.ports}-port data)`,
    });
  }

  /** This line's numbers into raw[count…], not yet committed; returns how many. */
  private readNumbers(text: string, start: number, end: number, lineNo: number): number {
    const lineFirst = this.count;
    let n = 0;
    let i = start;
    while (i < end) {
      let c = text.charCodeAt(i);
      while (i < end && isBlank(c)) c = text.charCodeAt(++i);
      if (i >= end) break;
      if (lineFirst + n >= this.raw.length) {
        const grown = new Float64Array(this.raw.length * 2);
        grown.set(this.raw);
        this.raw = grown;
      }
      const e = readNumber(text, i, end, this.raw, lineFirst + n);
      const x = this.raw[lineFirst + n];
      if (!Number.isFinite(x)) this.failNumber(text.slice(i, e), x, n, lineNo);
      n++;
      i = e;
    }
    return n;
  }

  private failNumber(found: string, x: number, n: number, lineNo: number): never {
    const tokenPos = (this.recordPos + n) % this.recordLength;
    const field = tokenPos === 0 ? "frequency" : `${entryName(this.pairs[(tokenPos - 1) >> 1])} ${partName(this.s.format, (tokenPos - 1) & 1)}`;
    return fail(this.s, looksNonFinite(found) || !Number.isNaN(x) ? "non-finite" : "bad-number", `expected a number (${field}), found "${shortenFound(found)}"`, {
      line: lineNo,
      column: n + 1,
      field,
      expected: "a number",
      found: shortenFound(found),
    });
  }

  /** v1.1: noise parameters follow the 2-port S data, starting at a frequency not above the last one. */
  private isV1NoiseStart(n: number, lineFirst: number, lineNo: number): boolean {
    const s = this.s;
    if (s.ports !== 2 || this.patternIndex !== 0 || n !== 5 || this.records === 0) return false;
    if (this.raw[lineFirst] * s.frequencyScale > this.previousFrequency) return false;
    s.warnings.push(`noise parameters from line ${lineNo} on are not read`);
    s.skippingNoise = true;
    return true;
  }

  /** v1.1 fixes how many numbers each line of a record holds. */
  private checkV1Line(n: number, text: string, next: number, lineNo: number): void {
    const s = this.s;
    const expected = this.pattern[this.patternIndex];
    if (n !== expected) {
      const what =
        this.patternIndex === 0
          ? `the frequency and ${(expected - 1) / 2} complex value${expected === 3 ? "" : "s"}`
          : `${expected / 2} complex value${expected === 2 ? "" : "s"} of row ${Math.floor(this.patternIndex / Math.ceil(s.ports / 4)) + 1} of the matrix`;
      let code: IngestErrorCode = "cell-count";
      if (this.records === 0 && this.patternIndex === 0) code = "port-count";
      else if (this.records === 0 && this.uniformLines && n === this.firstLineCount) {
        this.failPortCount(lineNo, `so a frequency's record is ${this.recordLength} numbers over ${this.pattern.length} lines, but this line repeats the first line's ${n}`);
      } else if (n < expected && restIsBlank(text, next)) code = "truncated";
      fail(
        s,
        code,
        code === "port-count"
          ? `the ".s${s.ports}p" extension means ${s.ports} port${s.ports === 1 ? "" : "s"}, so this line should hold ${what}: ${expected} numbers, found ${n}`
          : `expected ${expected} numbers on this line of ${s.ports}-port data (${what}), found ${n}${code === "truncated" ? "; the file is truncated" : ""}`,
        { line: lineNo, expected: `${expected} numbers`, found: String(n) },
      );
    }
    this.patternIndex = this.patternIndex + 1 === this.pattern.length ? 0 : this.patternIndex + 1;
  }

  /** v2.0 lets a record wrap freely, but each frequency starts on a new line. */
  private checkV2Line(n: number, lineNo: number): void {
    const { recordPos, recordLength, pairs } = this;
    if (recordPos === 0 ? n <= recordLength : recordPos + n <= recordLength) return;
    if (this.records === 0 && recordPos !== 0 && n === this.firstLineCount) {
      this.failPortCount(lineNo, `so a frequency's record is ${recordLength} numbers, but the lines of ${n} do not add up to it`);
    }
    fail(
      this.s,
      this.records === 0 ? "port-count" : "cell-count",
      recordPos === 0
        ? `${n} numbers on one line, but a ${this.s.ports}-port record has ${recordLength} (the frequency and ${pairs.length} complex value${pairs.length === 1 ? "" : "s"}); each frequency must start on a new line`
        : `this line completes a frequency's ${recordLength} numbers and continues with more; each frequency must start on a new line`,
      { line: lineNo, expected: `${recordLength} numbers per frequency`, found: String(n) },
    );
  }

  /** A record's frequency is in range and above the previous one. */
  private checkFrequency(f: number, lineText: string, lineNo: number): void {
    if (f < 0 || f > RANGES.frequencyHz.max) {
      fail(this.s, "out-of-range", `frequency ${lineText.split(/[ \t]+/)[0]} is outside 0 to 3 THz`, {
        line: lineNo,
        column: 1,
        field: "frequency",
        expected: "0 to 3 THz",
      });
    }
    if (!(f > this.previousFrequency)) {
      const same = f === this.previousFrequency;
      fail(
        this.s,
        same ? "duplicate-value" : "non-monotonic",
        same
          ? `frequency repeats the one on line ${this.previousFrequencyLine}; frequencies must increase`
          : `frequency is lower than the one on line ${this.previousFrequencyLine}; frequencies must increase`,
        { line: lineNo, column: 1, field: "frequency", expected: "strictly increasing frequencies" },
      );
    }
    this.previousFrequency = f;
    this.previousFrequencyLine = lineNo;
  }

  /** End-of-file checks on the data: complete last record, at least one, the declared count. */
  finish(): void {
    const s = this.s;
    if (this.records === 0 && this.recordPos !== 0 && this.uniformLines) {
      this.failPortCount(this.lastDataLine, `so a frequency's record is ${this.recordLength} numbers, but the file ends after ${this.recordPos}`);
    }
    if (s.version === 2 && this.records !== s.declaredFrequencies && this.uniformLines && DataBlock.looksLike(this.firstLineCount) !== "" && this.firstLineCount !== this.recordLength) {
      this.failPortCount(this.lineNumbers[0], `so a frequency's record is ${this.recordLength} numbers, and [Number of Frequencies] ${s.declaredFrequencies} does not match the ${this.records} record${this.records === 1 ? "" : "s"} read that way`);
    }
    if (this.recordPos !== 0 || (s.version === 1 && this.patternIndex !== 0)) {
      fail(s, "truncated", `the last frequency has only ${this.recordPos} of its ${this.recordLength} numbers; the file is truncated`, {
        line: this.lastDataLine,
      });
    }
    if (this.records === 0) fail(s, "too-few-points", "no network data: the file has no frequency points", { expected: "at least one frequency" });
    if (s.version === 2 && this.records !== s.declaredFrequencies) {
      fail(s, "frequency-count-mismatch", `[Number of Frequencies] says ${s.declaredFrequencies} but the data has ${this.records}`, {
        line: s.declaredFrequenciesLine,
        field: "[Number of Frequencies]",
        expected: String(s.declaredFrequencies),
        found: String(this.records),
      });
    }
  }

  /**
   * A passive network: every |Sij| ≤ 1 and, for each driven port j, Σi |Sij|² ≤ 1 (plausibility.ts
   * gives the source and the tolerances). Beyond +1.0 dB the file is refused at the value's line
   * and column; from +0.1 to +1.0 dB one warning per kind names the worst case.
   */
  checkPassive(network: Pick<TouchstoneData, "sRe" | "sIm">, warnings: string[]): void {
    const { s, pairs, records, recordLength } = this;
    const { sRe, sIm } = network;
    const ports = s.ports;
    // Compared as |S|² on the converted values: no logarithm or power per value, only for what is flagged.
    // A value exactly at a threshold (written "0.10" dB) stays below it despite rounding in 10^(x/20) and its square.
    const slack = 1 + 1e-9;
    const warnPower = 10 ** (S_WARN_ABOVE_DB / 10) * slack;
    const refusePower = 10 ** (S_REFUSED_ABOVE_DB / 10) * slack;
    const pairOf = new Int32Array(ports * ports).fill(-1);
    pairs.forEach((p, k) => {
      pairOf[p.i * ports + p.j] = k;
      if (pairOf[p.j * ports + p.i] === -1) pairOf[p.j * ports + p.i] = k;
    });
    let worstEntry = { k: -1, p: 0, power: 0, count: 0 };
    let worstSum = { k: -1, j: 0, sum: 0, count: 0 };
    // Entry by entry, each a contiguous run across frequency (the entry-major layout), summing into one column buffer.
    const columnSum = new Float64Array(records);
    for (let j = 0; j < ports; j++) {
      columnSum.fill(0);
      for (let i = 0; i < ports; i++) {
        const p = pairOf[i * ports + j];
        const own = pairs[p].i === i;
        const start = (i * ports + j) * records;
        for (let k = 0; k < records; k++) {
          const re = sRe[start + k];
          const im = sIm[start + k];
          const power = re * re + im * im;
          columnSum[k] += power;
          if (power > warnPower && own) {
            if (power > refusePower) this.refuseEntry(k, p, Math.sqrt(power));
            worstEntry.count++;
            if (power > worstEntry.power) worstEntry = { k, p, power, count: worstEntry.count };
          }
        }
      }
      for (let k = 0; k < records; k++) {
        const sum = columnSum[k];
        if (sum <= warnPower) continue;
        if (sum > refusePower) this.refuseColumn(k, j, sum);
        worstSum.count++;
        if (sum > worstSum.sum) worstSum = { k, j, sum, count: worstSum.count };
      }
    }
    if (worstEntry.k >= 0) {
      const { line } = this.locate(worstEntry.k * recordLength + 1 + 2 * worstEntry.p);
      warnings.push(
        `${PLAUSIBILITY_PREFIX}${worstEntry.count} S-parameter value${worstEntry.count === 1 ? " is" : "s are"} above 0 dB by more than ${printed(S_WARN_ABOVE_DB, "dB", 1)}, ` +
          `up to ${this.magnitudeText(worstEntry.k, worstEntry.p, Math.sqrt(worstEntry.power))} (${entryName(pairs[worstEntry.p])} at ${this.frequencyText(worstEntry.k)}, line ${line}); ` +
          `a passive network stays at or below 0 dB, so this is more than a calibrated analyser's uncertainty: check the calibration`,
      );
    }
    if (worstSum.k >= 0) {
      warnings.push(
        `${PLAUSIBILITY_PREFIX}the power leaving all ports exceeds the power sent in by more than ${printed(S_WARN_ABOVE_DB, "dB", 1)} at ${worstSum.count} ` +
          `frequenc${worstSum.count === 1 ? "y" : "ies"}, up to ${printed(10 * Math.log10(worstSum.sum), "dB", 2, true)} (port ${worstSum.j + 1} driven, ` +
          `at ${this.frequencyText(worstSum.k)}, line ${this.locate(worstSum.k * recordLength).line}); a passive network cannot add power: check the calibration`,
      );
    }
  }

  /** |S| as the file wrote it: dB at its own decimals, or a linear magnitude and its dB. */
  private magnitudeText(k: number, p: number, mag: number): string {
    const at = k * this.recordLength + 1 + 2 * p;
    const a = this.raw[at];
    const db = 20 * Math.log10(mag);
    if (this.s.format === "DB") return printed(a, "dB", this.decimalsAt(at), true);
    const d = this.s.format === "MA" ? this.decimalsAt(at) : Math.max(this.decimalsAt(at), this.decimalsAt(at + 1));
    return `|S| ${printed(mag, "", d)} (${printed(db, "dB", 2, true)})`;
  }

  private frequencyText(k: number): string {
    return formatQuantity(this.raw[k * this.recordLength] * this.s.frequencyScale, "Hz", { digits: { maxSignificant: 9 }, plain: true });
  }

  private refuseEntry(k: number, p: number, mag: number): never {
    const at = k * this.recordLength + 1 + 2 * p;
    const { line, column } = this.locate(at);
    const field = `${entryName(this.pairs[p])} ${partName(this.s.format, 0)}`;
    return fail(
      this.s,
      "implausible-value",
      `${entryName(this.pairs[p])} at ${this.frequencyText(k)} is ${this.magnitudeText(k, p, mag)}, above 0 dB by more than the ${printed(S_REFUSED_ABOVE_DB, "dB", 1)} ` +
        "a calibration error could explain; no passive network has gain: check the format (RI, MA or DB) on the option line, the port order and the calibration",
      { line, column, field, expected: `|S| at most ${printed(S_REFUSED_ABOVE_DB, "dB", 1, true)}`, found: this.magnitudeText(k, p, mag) },
    );
  }

  private refuseColumn(k: number, j: number, sum: number): never {
    const { line } = this.locate(k * this.recordLength);
    const terms = Array.from({ length: this.s.ports }, (_, i) => `|S${i + 1}${j + 1}|²`).join(" + ");
    return fail(
      this.s,
      "implausible-value",
      `at ${this.frequencyText(k)}, with port ${j + 1} driven, ${terms} = ${printed(sum, "", 3)} (${printed(10 * Math.log10(sum), "dB", 2, true)}): the ports give out more power ` +
        `than goes in, by more than the ${printed(S_REFUSED_ABOVE_DB, "dB", 1)} a calibration error could explain; a passive network cannot: check the port order and the calibration`,
      { line, column: 1, field: "frequency", expected: `a sum of at most ${printed(10 ** (S_REFUSED_ABOVE_DB / 10), "", 3)}`, found: printed(sum, "", 3) },
    );
  }

  /** Real/imaginary per entry, entry-major; a Lower/Upper matrix is mirrored. */
  toNetwork(): Pick<TouchstoneData, "frequencyHz" | "sRe" | "sIm"> {
    const { s, pairs, records, recordLength, raw } = this;
    const ports = s.ports;
    const entries = ports * ports;
    const frequencyHz = new Float64Array(records);
    const sRe = new Float64Array(entries * records);
    const sIm = new Float64Array(entries * records);
    const scale = s.frequencyScale;
    const entryOf = pairs.map((p) => p.i * ports + p.j);
    const mirrorOf = pairs.map((p) => (s.matrix !== "full" && p.i !== p.j ? p.j * ports + p.i : -1));
    const format = s.format;
    for (let k = 0; k < records; k++) {
      const base = k * recordLength;
      frequencyHz[k] = raw[base] * scale;
      for (let p = 0; p < pairs.length; p++) {
        const a = raw[base + 1 + 2 * p];
        const b = raw[base + 2 + 2 * p];
        let re: number;
        let im: number;
        if (format === "RI") {
          re = a;
          im = b;
        } else {
          // MA: magnitude and angle in degrees; DB: 20·log10 magnitude and angle (Touchstone 1.1, option line).
          const mag = format === "MA" ? a : Math.pow(10, a / 20);
          re = mag * Math.cos(b * DEG);
          im = mag * Math.sin(b * DEG);
        }
        const at = entryOf[p] * records + k;
        sRe[at] = re;
        sIm[at] = im;
        if (mirrorOf[p] !== -1) {
          sRe[mirrorOf[p] * records + k] = re;
          sIm[mirrorOf[p] * records + k] = im;
        }
      }
    }
    return { frequencyHz, sRe, sIm };
  }
}
