/**
 * Touchstone reader after the IBIS Open Forum "Touchstone File Format
 * Specification", Version 1.1 (2002) and Version 2.0 (2009). Only S-parameters
 * are read; noise parameters are skipped with a warning.
 *
 * One pass over the text, line by line, with numbers read in place
 * (parseNumberAt) into one growing Float64Array; a second pass converts to
 * real/imaginary in the entry-major layout of TouchstoneData.
 */
import type { FileContent, ParseOptions } from "./csv-common";
import { IngestError, shortenFound, type IngestErrorCode } from "./errors";
import { looksNonFinite, parseNumberAt } from "./number";
import { readParserInput } from "./text-guards";
import type { ParseResult, TouchstoneData } from "./types";
import { RANGES } from "./units";

type Format = "RI" | "MA" | "DB";

const FREQUENCY_UNITS: Record<string, number> = { hz: 1, khz: 1e3, mhz: 1e6, ghz: 1e9 };
const PARAMETERS = new Set(["s", "y", "z", "h", "g"]);
const FORMATS: Record<string, Format> = { ri: "RI", ma: "MA", db: "DB" };
const MAX_PORTS = 64;
const DEG = Math.PI / 180;

/** Port count from a version 1 extension: ".s2p" → 2. */
export function portsFromExtension(fileName: string): number | undefined {
  const dot = fileName.lastIndexOf(".");
  if (dot === -1) return undefined;
  const ext = fileName.slice(dot + 1).toLowerCase();
  if (ext.length < 3 || ext[0] !== "s" || ext[ext.length - 1] !== "p") return undefined;
  const digits = ext.slice(1, -1);
  if (!/^[0-9]{1,3}$/.test(digits)) return undefined;
  const n = Number(digits);
  return n >= 1 ? n : undefined;
}

interface Pair {
  i: number;
  j: number;
}

/**
 * Order of the (i, j) pairs within one frequency's record.
 * v1.1: two-port data is N11 N21 N12 N22; other sizes are row by row.
 * v2.0: [Two-Port Data Order] picks 12_21 or 21_12; [Matrix Format]
 * Lower/Upper lists only one triangle (row by row), the other is symmetric.
 */
function pairOrder(n: number, twoPortOrder: "12_21" | "21_12", matrix: "full" | "lower" | "upper"): Pair[] {
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

function entryName(p: Pair): string {
  return p.i < 9 && p.j < 9 ? `S${p.i + 1}${p.j + 1}` : `S${p.i + 1},${p.j + 1}`;
}

function partName(format: Format, part: number): string {
  if (format === "RI") return part === 0 ? "real part" : "imaginary part";
  if (format === "MA") return part === 0 ? "magnitude" : "angle";
  return part === 0 ? "magnitude in dB" : "angle";
}

interface State {
  fileName: string;
  version: 1 | 2 | undefined;
  optionLine: number;
  frequencyScale: number;
  format: Format;
  referenceOhm: number;
  ports: number;
  twoPortOrder: "12_21" | "21_12" | undefined;
  matrix: "full" | "lower" | "upper";
  declaredFrequencies: number | undefined;
  declaredFrequenciesLine: number;
  references: number[] | undefined;
  referencesPending: number;
  referenceLine: number;
  inNetworkData: boolean;
  networkDataSeen: boolean;
  inInformation: boolean;
  skippingNoise: boolean;
  ended: boolean;
  comments: string[];
  warnings: string[];
  extraOptionLines: number;
}

function fail(s: State, code: IngestErrorCode, detail: string, extra: Partial<ConstructorParameters<typeof IngestError>[0]> = {}): never {
  throw new IngestError({ fileName: s.fileName, code, detail, ...extra });
}

function parseOptionLine(s: State, body: string, lineNo: number): void {
  const tokens = body.trim().split(/[ \t]+/).filter((t) => t !== "");
  for (let k = 0; k < tokens.length; k++) {
    const raw = tokens[k];
    const t = raw.toLowerCase();
    if (t in FREQUENCY_UNITS) {
      s.frequencyScale = FREQUENCY_UNITS[t];
    } else if (PARAMETERS.has(t)) {
      if (t !== "s") {
        fail(s, "unsupported-parameter", `${raw.toUpperCase()}-parameters are not supported; export the file as S-parameters`, {
          line: lineNo,
          column: k + 1,
          field: "option line",
          expected: "S",
          found: raw,
        });
      }
    } else if (t in FORMATS) {
      s.format = FORMATS[t];
    } else if (t === "r") {
      const value = tokens[k + 1];
      const r = value === undefined ? NaN : parseNumberAt(value, 0, value.length);
      if (!(r > 0) || !Number.isFinite(r)) {
        fail(s, "bad-option-line", `"R" must be followed by a positive reference resistance in ohms, found "${shortenFound(value ?? "")}"`, {
          line: lineNo,
          column: k + 2,
          field: "option line",
          expected: "R <ohms>, e.g. R 50",
          found: value,
        });
      }
      s.referenceOhm = r;
      k++;
    } else {
      fail(
        s,
        "bad-option-line",
        `unrecognised option "${shortenFound(raw)}"; the option line is "# <unit> <parameter> <format> R <ohms>" with unit Hz/kHz/MHz/GHz, parameter S, format RI/MA/DB`,
        { line: lineNo, column: k + 1, field: "option line", expected: "# GHz S MA R 50", found: shortenFound(raw) },
      );
    }
  }
}

function readInteger(s: State, arg: string, keyword: string, lineNo: number, min: number, max: number): number {
  const t = arg.trim();
  const n = /^[0-9]{1,9}$/.test(t) ? Number(t) : NaN;
  if (!(n >= min && n <= max)) {
    fail(s, "bad-keyword", `${keyword} needs a whole number from ${min} to ${max}, found "${shortenFound(t)}"`, {
      line: lineNo,
      field: keyword,
      expected: `a whole number from ${min} to ${max}`,
      found: shortenFound(t),
    });
  }
  return n;
}

function readReferences(s: State, text: string, start: number, end: number, lineNo: number): void {
  let i = start;
  while (i < end && s.referencesPending > 0) {
    while (i < end && (text.charCodeAt(i) === 32 || text.charCodeAt(i) === 9)) i++;
    if (i >= end) break;
    let e = i;
    while (e < end && text.charCodeAt(e) !== 32 && text.charCodeAt(e) !== 9) e++;
    const r = parseNumberAt(text, i, e);
    if (!(r > 0) || !Number.isFinite(r)) {
      fail(s, "bad-keyword", `[Reference] values must be positive resistances in ohms, found "${shortenFound(text.slice(i, e))}"`, {
        line: lineNo,
        field: "[Reference]",
        found: shortenFound(text.slice(i, e)),
      });
    }
    s.references!.push(r);
    s.referencesPending--;
    i = e;
  }
  while (i < end && (text.charCodeAt(i) === 32 || text.charCodeAt(i) === 9)) i++;
  if (i < end) {
    fail(s, "reference-count", `[Reference] lists more than ${s.ports} values (one per port)`, { line: lineNo, field: "[Reference]" });
  }
}

function handleKeyword(s: State, line: string, lineNo: number): void {
  const close = line.indexOf("]");
  if (close === -1) fail(s, "bad-keyword", `keyword "${shortenFound(line)}" has no closing "]"`, { line: lineNo, found: shortenFound(line) });
  const name = line.slice(1, close).trim().toLowerCase().replace(/\s+/g, " ");
  const arg = line.slice(close + 1).trim();
  const display = `[${line.slice(1, close).trim()}]`;
  if (s.version !== 2) {
    fail(s, "bad-keyword", `${display} is a Touchstone 2.0 keyword, but the file does not start with "[Version] 2.0"`, {
      line: lineNo,
      field: display,
    });
  }
  if (s.inInformation) {
    if (name === "end information") s.inInformation = false;
    return;
  }
  if (s.skippingNoise && name !== "end") return;
  const needsOptionLine = () => {
    if (s.optionLine === 0) {
      fail(s, "missing-option-line", `a Touchstone 2.0 file needs the option line ("# GHz S MA R 50") before ${display}`, {
        line: lineNo,
        field: "option line",
      });
    }
  };
  switch (name) {
    case "version":
      fail(s, "bad-keyword", "[Version] may appear only once, as the first keyword", { line: lineNo, field: display });
    case "number of ports":
      s.ports = readInteger(s, arg, display, lineNo, 1, MAX_PORTS);
      return;
    case "two-port data order":
      if (arg === "12_21" || arg === "21_12") s.twoPortOrder = arg;
      else {
        fail(s, "bad-keyword", `[Two-Port Data Order] must be 12_21 or 21_12, found "${shortenFound(arg)}"`, {
          line: lineNo,
          field: display,
          expected: "12_21 or 21_12",
          found: shortenFound(arg),
        });
      }
      return;
    case "number of frequencies":
      s.declaredFrequencies = readInteger(s, arg, display, lineNo, 1, 100_000_000);
      s.declaredFrequenciesLine = lineNo;
      return;
    case "number of noise frequencies":
      readInteger(s, arg, display, lineNo, 1, 100_000_000);
      return;
    case "reference": {
      if (s.ports === 0) fail(s, "missing-keyword", "[Reference] must come after [Number of Ports]", { line: lineNo, field: "[Number of Ports]" });
      s.references = [];
      s.referencesPending = s.ports;
      s.referenceLine = lineNo;
      const offset = line.indexOf("]") + 1;
      readReferences(s, line, offset, line.length, lineNo);
      return;
    }
    case "matrix format": {
      const m = arg.toLowerCase();
      if (m !== "full" && m !== "lower" && m !== "upper") {
        fail(s, "bad-keyword", `[Matrix Format] must be Full, Lower or Upper, found "${shortenFound(arg)}"`, { line: lineNo, field: display });
      }
      s.matrix = m;
      return;
    }
    case "mixed-mode order":
      fail(s, "unsupported-feature", "mixed-mode (differential) data is not supported; export single-ended S-parameters", {
        line: lineNo,
        field: display,
      });
    case "begin information":
      s.inInformation = true;
      return;
    case "network data":
      needsOptionLine();
      if (s.ports === 0) fail(s, "missing-keyword", "[Number of Ports] is required before [Network Data]", { line: lineNo, field: "[Number of Ports]" });
      if (s.ports === 2 && s.twoPortOrder === undefined) {
        fail(s, "missing-keyword", "[Two-Port Data Order] (12_21 or 21_12) is required for 2-port data", {
          line: lineNo,
          field: "[Two-Port Data Order]",
        });
      }
      if (s.declaredFrequencies === undefined) {
        fail(s, "missing-keyword", "[Number of Frequencies] is required before [Network Data]", { line: lineNo, field: "[Number of Frequencies]" });
      }
      if (s.referencesPending > 0) {
        fail(s, "reference-count", `[Reference] lists ${s.references!.length} values, expected ${s.ports} (one per port)`, {
          line: s.referenceLine,
          field: "[Reference]",
        });
      }
      s.inNetworkData = true;
      s.networkDataSeen = true;
      return;
    case "noise data":
      s.inNetworkData = false;
      s.skippingNoise = true;
      s.warnings.push("noise parameters ([Noise Data]) are not read");
      return;
    case "end":
      s.ended = true;
      return;
    default:
      s.warnings.push(`keyword ${display} on line ${lineNo} is not read`);
  }
}

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

export function parseTouchstone(fileName: string, content: FileContent, options: ParseOptions = {}): ParseResult<TouchstoneData> {
  const text = readParserInput({ fileName, content, maxBytes: options.maxBytes, checked: options.textChecked });
  const s: State = {
    fileName,
    version: undefined,
    optionLine: 0,
    frequencyScale: 1e9,
    format: "MA",
    referenceOhm: 50,
    ports: 0,
    twoPortOrder: undefined,
    matrix: "full",
    declaredFrequencies: undefined,
    declaredFrequenciesLine: 0,
    references: undefined,
    referencesPending: 0,
    referenceLine: 0,
    inNetworkData: false,
    networkDataSeen: false,
    inInformation: false,
    skippingNoise: false,
    ended: false,
    comments: [],
    warnings: [],
    extraOptionLines: 0,
  };

  let raw = new Float64Array(Math.max(1024, text.length >> 3));
  let count = 0;
  let recordLength = 0;
  let pattern: number[] = [];
  let patternIndex = 0;
  let pairs: Pair[] = [];
  let recordPos = 0;
  let records = 0;
  let previousFrequency = -Infinity;
  let previousFrequencyLine = 0;
  let lastDataLine = 0;
  const extPorts = portsFromExtension(fileName);

  const beginData = (lineNo: number) => {
    if (s.version === 1) {
      if (s.optionLine === 0) {
        fail(s, "missing-option-line", 'the option line ("# <unit> S <format> R <ohms>", e.g. "# GHz S MA R 50") must come before the data', {
          line: lineNo,
          field: "option line",
          expected: "# GHz S MA R 50",
        });
      }
      s.ports = extPorts!;
      pattern = v1LinePattern(s.ports);
      pairs = pairOrder(s.ports, "21_12", "full");
    } else {
      pairs = pairOrder(s.ports, s.twoPortOrder ?? "12_21", s.matrix);
    }
    recordLength = 1 + 2 * pairs.length;
  };

  let pos = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let lineNo = 0;
  let nextBang = text.indexOf("!", pos);
  while (pos < text.length && !s.ended) {
    lineNo++;
    const nl = text.indexOf("\n", pos);
    const next = nl === -1 ? text.length : nl + 1;
    let end = nl === -1 ? text.length : nl;
    if (nextBang !== -1 && nextBang < pos) nextBang = text.indexOf("!", pos);
    if (nextBang !== -1 && nextBang < end) {
      if (s.version === undefined || (count === 0 && !s.inNetworkData)) {
        if (s.comments.length < 200) s.comments.push(text.slice(nextBang + 1, nl === -1 ? text.length : nl).trim());
      }
      end = nextBang;
    }
    const lineStart = pos;
    pos = next;
    let start = lineStart;
    while (start < end) {
      const c = text.charCodeAt(start);
      if (c !== 32 && c !== 9 && c !== 13 && c !== 12) break;
      start++;
    }
    while (end > start) {
      const c = text.charCodeAt(end - 1);
      if (c !== 32 && c !== 9 && c !== 13 && c !== 12) break;
      end--;
    }
    if (start === end) continue;
    const first = text.charCodeAt(start);

    if (s.version === undefined) {
      if (first === 91 /* [ */ && text.slice(start, end).toLowerCase().replace(/\s+/g, "").startsWith("[version]")) {
        const arg = text.slice(text.indexOf("]", start) + 1, end).trim();
        if (!/^2\.[0-9]+$/.test(arg)) {
          fail(s, "bad-keyword", `[Version] must be 2.0 (or 2.x), found "${shortenFound(arg)}"`, { line: lineNo, field: "[Version]", found: arg });
        }
        if (arg !== "2.0") s.warnings.push(`[Version] ${arg} is read as 2.0; keywords added later are ignored`);
        s.version = 2;
        continue;
      }
      s.version = 1;
      if (extPorts === undefined) {
        fail(s, "missing-port-count", 'a Touchstone 1.x file must have a ".sNp" extension (e.g. ".s2p") that gives its port count; or add "[Version] 2.0" and "[Number of Ports]"', {
          line: lineNo,
        });
      }
      if (extPorts > MAX_PORTS) fail(s, "port-count", `${extPorts} ports is more than the ${MAX_PORTS} supported`, {});
    }

    if (first === 35 /* # */) {
      if (s.optionLine === 0) {
        if (s.version === 2 && s.inNetworkData) fail(s, "bad-option-line", "the option line must come before [Network Data]", { line: lineNo });
        parseOptionLine(s, text.slice(start + 1, end), lineNo);
        s.optionLine = lineNo;
      } else if (s.extraOptionLines++ === 0) {
        s.warnings.push(`option line on line ${lineNo} ignored: only the first option line counts (line ${s.optionLine})`);
      }
      continue;
    }
    if (s.referencesPending > 0 && first !== 91) {
      readReferences(s, text, start, end, lineNo);
      continue;
    }
    if (first === 91 /* [ */) {
      handleKeyword(s, text.slice(start, end), lineNo);
      continue;
    }
    if (s.inInformation || s.skippingNoise) continue;
    if (s.version === 2 && !s.inNetworkData) {
      fail(s, "missing-keyword", "data before [Network Data]; a Touchstone 2.0 file lists its data after the [Network Data] keyword", {
        line: lineNo,
        field: "[Network Data]",
      });
    }
    if (recordLength === 0) beginData(lineNo);

    // Read this line's numbers into raw[count…] without committing them yet.
    const lineFirst = count;
    let n = 0;
    let i = start;
    while (i < end) {
      let c = text.charCodeAt(i);
      while (i < end && (c === 32 || c === 9 || c === 12 || c === 13)) c = text.charCodeAt(++i);
      if (i >= end) break;
      let e = i + 1;
      while (e < end) {
        const d = text.charCodeAt(e);
        if (d === 32 || d === 9 || d === 12 || d === 13) break;
        e++;
      }
      const x = parseNumberAt(text, i, e);
      if (!Number.isFinite(x)) {
        const tokenPos = (recordPos + n) % recordLength;
        const field = tokenPos === 0 ? "frequency" : `${entryName(pairs[(tokenPos - 1) >> 1])} ${partName(s.format, (tokenPos - 1) & 1)}`;
        const found = text.slice(i, e);
        fail(s, looksNonFinite(found) || !Number.isNaN(x) ? "non-finite" : "bad-number", `expected a number (${field}), found "${shortenFound(found)}"`, {
          line: lineNo,
          column: n + 1,
          field,
          expected: "a number",
          found: shortenFound(found),
        });
      }
      if (lineFirst + n >= raw.length) {
        const grown = new Float64Array(raw.length * 2);
        grown.set(raw);
        raw = grown;
      }
      raw[lineFirst + n] = x;
      n++;
      i = e;
    }

    if (s.version === 1) {
      const expected = pattern[patternIndex];
      if (s.ports === 2 && patternIndex === 0 && n === 5 && records > 0 && raw[lineFirst] * s.frequencyScale <= previousFrequency) {
        // v1.1: noise parameters follow the S data, starting at a frequency not above the last one.
        s.warnings.push(`noise parameters from line ${lineNo} on are not read`);
        s.skippingNoise = true;
        continue;
      }
      if (n !== expected) {
        const portWord = `${s.ports}-port`;
        const what =
          patternIndex === 0
            ? `the frequency and ${(expected - 1) / 2} complex value${expected === 3 ? "" : "s"}`
            : `${expected / 2} complex value${expected === 2 ? "" : "s"} of row ${Math.floor(patternIndex / Math.ceil(s.ports / 4)) + 1} of the matrix`;
        let code: IngestErrorCode = "cell-count";
        if (records === 0 && patternIndex === 0) code = "port-count";
        else if (n < expected && restIsBlank(text, next)) code = "truncated";
        fail(
          s,
          code,
          code === "port-count"
            ? `the ".s${s.ports}p" extension means ${s.ports} port${s.ports === 1 ? "" : "s"}, so this line should hold ${what}: ${expected} numbers, found ${n}`
            : `expected ${expected} numbers on this line of ${portWord} data (${what}), found ${n}${code === "truncated" ? "; the file is truncated" : ""}`,
          { line: lineNo, expected: `${expected} numbers`, found: String(n) },
        );
      }
      patternIndex = patternIndex + 1 === pattern.length ? 0 : patternIndex + 1;
    } else if (n > 0) {
      const after = recordPos + n;
      if (recordPos === 0 ? n > recordLength : after > recordLength) {
        fail(
          s,
          records === 0 ? "port-count" : "cell-count",
          recordPos === 0
            ? `${n} numbers on one line, but a ${s.ports}-port record has ${recordLength} (the frequency and ${pairs.length} complex value${pairs.length === 1 ? "" : "s"}); each frequency must start on a new line`
            : `this line completes a frequency's ${recordLength} numbers and continues with more; each frequency must start on a new line`,
          { line: lineNo, expected: `${recordLength} numbers per frequency`, found: String(n) },
        );
      }
    }

    // Frequency checks at each record start on this line.
    if (recordPos === 0) {
      const f = raw[lineFirst] * s.frequencyScale;
      if (f < 0 || f > RANGES.frequencyHz.max) {
        fail(s, "out-of-range", `frequency ${text.slice(start, end).split(/[ \t]+/)[0]} is outside 0 to 3 THz`, {
          line: lineNo,
          column: 1,
          field: "frequency",
          expected: "0 to 3 THz",
        });
      }
      if (!(f > previousFrequency)) {
        const same = f === previousFrequency;
        fail(
          s,
          same ? "duplicate-value" : "non-monotonic",
          same
            ? `frequency repeats the one on line ${previousFrequencyLine}; frequencies must increase`
            : `frequency is lower than the one on line ${previousFrequencyLine}; frequencies must increase`,
          { line: lineNo, column: 1, field: "frequency", expected: "strictly increasing frequencies" },
        );
      }
      previousFrequency = f;
      previousFrequencyLine = lineNo;
    }
    count += n;
    recordPos += n;
    if (recordPos === recordLength) {
      recordPos = 0;
      records++;
    }
    lastDataLine = lineNo;
  }

  if (s.version === undefined) fail(s, "missing-option-line", "the file has only comments: no option line and no data", {});
  if (s.version === 1 && s.optionLine === 0) {
    fail(s, "missing-option-line", 'no option line ("# <unit> S <format> R <ohms>", e.g. "# GHz S MA R 50") was found', { field: "option line" });
  }
  if (s.version === 2 && !s.networkDataSeen) {
    fail(s, "missing-keyword", "the [Network Data] keyword is missing; a Touchstone 2.0 file lists its data after it", { field: "[Network Data]" });
  }
  if (s.version === 2 && !s.ended) s.warnings.push("the [End] keyword is missing");
  if (recordPos !== 0 || (s.version === 1 && patternIndex !== 0)) {
    fail(s, "truncated", `the last frequency has only ${recordPos} of its ${recordLength} numbers; the file is truncated`, {
      line: lastDataLine,
    });
  }
  if (records === 0) fail(s, "too-few-points", "no network data: the file has no frequency points", { expected: "at least one frequency" });
  if (s.version === 2 && records !== s.declaredFrequencies) {
    fail(s, "frequency-count-mismatch", `[Number of Frequencies] says ${s.declaredFrequencies} but the data has ${records}`, {
      line: s.declaredFrequenciesLine,
      field: "[Number of Frequencies]",
      expected: String(s.declaredFrequencies),
      found: String(records),
    });
  }

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
  const referenceOhm = s.references ?? new Array<number>(ports).fill(s.referenceOhm);
  return {
    data: { version: s.version, portCount: ports, frequencyHz, referenceOhm, sRe, sIm, sourceFormat: format, comments: s.comments },
    warnings: s.warnings,
  };
}

/** S(i, j) across frequency as zero-copy views; ports are 1-based as in "S21". */
export function sParameter(data: TouchstoneData, toPort: number, fromPort: number): { re: Float64Array; im: Float64Array } {
  const n = data.portCount;
  if (toPort < 1 || toPort > n || fromPort < 1 || fromPort > n) {
    throw new RangeError(`S${toPort}${fromPort} does not exist in a ${n}-port network`);
  }
  const f = data.frequencyHz.length;
  const start = ((toPort - 1) * n + (fromPort - 1)) * f;
  return { re: data.sRe.subarray(start, start + f), im: data.sIm.subarray(start, start + f) };
}
