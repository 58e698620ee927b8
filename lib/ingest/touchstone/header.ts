/**
 * The header of a Touchstone file: the option line (v1.1 and v2.0) and the v2.0 keywords,
 * after the IBIS Open Forum "Touchstone File Format Specification" 1.1 and 2.0.
 */
import { shortenFound } from "../errors";
import { parseNumberAt } from "../number";
import { MAX_PORTS, fail, type Format, type State } from "./state";

const FREQUENCY_UNITS: Record<string, number> = { hz: 1, khz: 1e3, mhz: 1e6, ghz: 1e9 };
const PARAMETERS = new Set(["s", "y", "z", "h", "g"]);
const FORMATS: Record<string, Format> = { ri: "RI", ma: "MA", db: "DB" };

/** "# <unit> <parameter> <format> R <ohms>", any order, any field left out. */
export function parseOptionLine(s: State, body: string, lineNo: number): void {
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

export function readReferences(s: State, text: string, start: number, end: number, lineNo: number): void {
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

/** A keyword line ("[Name] argument") of a version 2.0 file. */
export function handleKeyword(s: State, line: string, lineNo: number): void {
  const close = line.indexOf("]");
  if (close === -1) fail(s, "bad-keyword", `keyword "${shortenFound(line)}" has no closing "]"`, { line: lineNo, found: shortenFound(line) });
  const name = line.slice(1, close).trim().toLowerCase().replace(/\s+/g, " ");
  const keyword: Keyword = { name, arg: line.slice(close + 1).trim(), display: `[${line.slice(1, close).trim()}]`, line, lineNo };
  if (s.version !== 2) {
    fail(s, "bad-keyword", `${keyword.display} is a Touchstone 2.0 keyword, but the file does not start with "[Version] 2.0"`, {
      line: lineNo,
      field: keyword.display,
    });
  }
  if (s.inInformation) {
    if (name === "end information") s.inInformation = false;
    return;
  }
  if (s.skippingNoise && name !== "end") return;
  if (handleNetworkKeyword(s, keyword)) return;
  if (handleSectionKeyword(s, keyword)) return;
  s.warnings.push(`keyword ${keyword.display} on line ${lineNo} is not read`);
}

interface Keyword {
  name: string;
  arg: string;
  display: string;
  line: string;
  lineNo: number;
}

/** Keywords that describe the network: ports, data order, counts, references, matrix form. */
function handleNetworkKeyword(s: State, { name, arg, display, line, lineNo }: Keyword): boolean {
  switch (name) {
    case "version":
      fail(s, "bad-keyword", "[Version] may appear only once, as the first keyword", { line: lineNo, field: display });
    case "number of ports":
      s.ports = readInteger(s, arg, display, lineNo, 1, MAX_PORTS);
      return true;
    case "two-port data order":
      if (arg !== "12_21" && arg !== "21_12") {
        fail(s, "bad-keyword", `[Two-Port Data Order] must be 12_21 or 21_12, found "${shortenFound(arg)}"`, {
          line: lineNo,
          field: display,
          expected: "12_21 or 21_12",
          found: shortenFound(arg),
        });
      }
      s.twoPortOrder = arg;
      return true;
    case "number of frequencies":
      s.declaredFrequencies = readInteger(s, arg, display, lineNo, 1, 100_000_000);
      s.declaredFrequenciesLine = lineNo;
      return true;
    case "number of noise frequencies":
      readInteger(s, arg, display, lineNo, 1, 100_000_000);
      return true;
    case "reference":
      if (s.ports === 0) fail(s, "missing-keyword", "[Reference] must come after [Number of Ports]", { line: lineNo, field: "[Number of Ports]" });
      s.references = [];
      s.referencesPending = s.ports;
      s.referenceLine = lineNo;
      readReferences(s, line, line.indexOf("]") + 1, line.length, lineNo);
      return true;
    case "matrix format": {
      const m = arg.toLowerCase();
      if (m !== "full" && m !== "lower" && m !== "upper") {
        fail(s, "bad-keyword", `[Matrix Format] must be Full, Lower or Upper, found "${shortenFound(arg)}"`, { line: lineNo, field: display });
      }
      s.matrix = m;
      return true;
    }
    case "mixed-mode order":
      fail(s, "unsupported-feature", "mixed-mode (differential) data is not supported; export single-ended S-parameters", {
        line: lineNo,
        field: display,
      });
    default:
      return false;
  }
}

/** Keywords that open or close a section: information, network data, noise data, end. */
function handleSectionKeyword(s: State, { name, display, lineNo }: Keyword): boolean {
  switch (name) {
    case "begin information":
      s.inInformation = true;
      return true;
    case "network data":
      checkReadyForNetworkData(s, display, lineNo);
      s.inNetworkData = true;
      s.networkDataSeen = true;
      return true;
    case "noise data":
      s.inNetworkData = false;
      s.skippingNoise = true;
      s.warnings.push("noise parameters ([Noise Data]) are not read");
      return true;
    case "end":
      s.ended = true;
      return true;
    default:
      return false;
  }
}

/** Touchstone 2.0 requires these before [Network Data]. */
function checkReadyForNetworkData(s: State, display: string, lineNo: number): void {
  if (s.optionLine === 0) {
    fail(s, "missing-option-line", `a Touchstone 2.0 file needs the option line ("# GHz S MA R 50") before ${display}`, {
      line: lineNo,
      field: "option line",
    });
  }
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
}
