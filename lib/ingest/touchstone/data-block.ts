/**
 * The network data of a Touchstone file: numbers read in place (parseNumberAt) into one growing
 * Float64Array, each line checked against the record layout of its version, then converted to
 * real/imaginary in the entry-major layout of TouchstoneData.
 */
import type { IngestErrorCode } from "../errors";
import { shortenFound } from "../errors";
import { looksNonFinite, parseNumberAt } from "../number";
import type { TouchstoneData } from "../types";
import { RANGES } from "../units";
import { entryName, fail, partName, type Pair, type State } from "./state";

const DEG = Math.PI / 180;

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
    this.count += n;
    this.recordPos += n;
    if (this.recordPos === this.recordLength) {
      this.recordPos = 0;
      this.records++;
    }
    this.lastDataLine = lineNo;
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
      let e = i + 1;
      while (e < end && !isBlank(text.charCodeAt(e))) e++;
      const x = parseNumberAt(text, i, e);
      if (!Number.isFinite(x)) this.failNumber(text.slice(i, e), x, n, lineNo);
      if (lineFirst + n >= this.raw.length) {
        const grown = new Float64Array(this.raw.length * 2);
        grown.set(this.raw);
        this.raw = grown;
      }
      this.raw[lineFirst + n] = x;
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
      else if (n < expected && restIsBlank(text, next)) code = "truncated";
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
