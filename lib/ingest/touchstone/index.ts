/**
 * Touchstone reader after the IBIS Open Forum "Touchstone File Format
 * Specification", Version 1.1 (2002) and Version 2.0 (2009). Only S-parameters
 * are read; noise parameters are skipped with a warning.
 *
 * One pass over the text, line by line: the header (option line, v2.0 keywords,
 * header.ts) and the network data (data-block.ts, numbers read in place into one
 * growing Float64Array); a second pass converts to real/imaginary in the
 * entry-major layout of TouchstoneData.
 */
import type { FileContent, ParseOptions } from "../csv-common";
import { shortenFound } from "../errors";
import { readParserInput } from "../text-guards";
import type { ParseResult, TouchstoneData } from "../types";
import { DataBlock } from "./data-block";
import { handleKeyword, parseOptionLine, readReferences } from "./header";
import { MAX_PORTS, fail, initialState, type State } from "./state";

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

export function parseTouchstone(fileName: string, content: FileContent, options: ParseOptions = {}): ParseResult<TouchstoneData> {
  const text = readParserInput({ fileName, content, maxBytes: options.maxBytes, checked: options.textChecked });
  const s = initialState(fileName);
  const extensionPorts = portsFromExtension(fileName);
  const data = new DataBlock(s, extensionPorts, text.length);

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
      if (s.version === undefined || (!data.started && !s.inNetworkData)) {
        if (s.comments.length < 200) s.comments.push(text.slice(nextBang + 1, nl === -1 ? text.length : nl).trim());
      }
      end = nextBang;
    }
    let start = pos;
    pos = next;
    while (start < end && isBlank(text.charCodeAt(start))) start++;
    while (end > start && isBlank(text.charCodeAt(end - 1))) end--;
    if (start === end) continue;
    if (s.version === undefined && readVersion(s, text.slice(start, end), lineNo, extensionPorts)) continue;
    readLine(s, data, text, { start, end, next, lineNo });
  }
  checkComplete(s);
  data.finish();
  const network = data.toNetwork();
  if (options.passive !== false) data.checkPassive(network, s.warnings);

  const referenceOhm = s.references ?? new Array<number>(s.ports).fill(s.referenceOhm);
  return {
    data: { version: s.version!, portCount: s.ports, ...network, referenceOhm, sourceFormat: s.format, comments: s.comments },
    warnings: s.warnings,
  };
}

const isBlank = (c: number) => c === 32 || c === 9 || c === 13 || c === 12;

/**
 * The first content line decides the version: "[Version] 2.x" (consumed, returns true) or
 * anything else, which makes the file a v1.1 file whose port count the extension gives.
 */
function readVersion(s: State, line: string, lineNo: number, extensionPorts: number | undefined): boolean {
  if (line.startsWith("[") && line.toLowerCase().replace(/\s+/g, "").startsWith("[version]")) {
    const arg = line.slice(line.indexOf("]") + 1).trim();
    if (!/^2\.[0-9]+$/.test(arg)) {
      fail(s, "bad-keyword", `[Version] must be 2.0 (or 2.x), found "${shortenFound(arg)}"`, { line: lineNo, field: "[Version]", found: arg });
    }
    if (arg !== "2.0") s.warnings.push(`[Version] ${arg} is read as 2.0; keywords added later are ignored`);
    s.version = 2;
    return true;
  }
  s.version = 1;
  if (extensionPorts === undefined) {
    fail(s, "missing-port-count", 'a Touchstone 1.x file must have a ".sNp" extension (e.g. ".s2p") that gives its port count; or add "[Version] 2.0" and "[Number of Ports]"', {
      line: lineNo,
    });
  }
  if (extensionPorts > MAX_PORTS) fail(s, "port-count", `${extensionPorts} ports is more than the ${MAX_PORTS} supported`, {});
  return false;
}

/** One trimmed, comment-free line after the version is known: option line, keyword, reference values or data. */
function readLine(s: State, data: DataBlock, text: string, at: { start: number; end: number; next: number; lineNo: number }): void {
  const { start, end, lineNo } = at;
  const first = text.charCodeAt(start);
  if (first === 35 /* # */) {
    if (s.optionLine === 0) {
      if (s.version === 2 && s.inNetworkData) fail(s, "bad-option-line", "the option line must come before [Network Data]", { line: lineNo });
      parseOptionLine(s, text.slice(start + 1, end), lineNo);
      s.optionLine = lineNo;
    } else if (s.extraOptionLines++ === 0) {
      s.warnings.push(`option line on line ${lineNo} ignored: only the first option line counts (line ${s.optionLine})`);
    }
    return;
  }
  if (s.referencesPending > 0 && first !== 91) return readReferences(s, text, start, end, lineNo);
  if (first === 91 /* [ */) return handleKeyword(s, text.slice(start, end), lineNo);
  if (s.inInformation || s.skippingNoise) return;
  if (s.version === 2 && !s.inNetworkData) {
    fail(s, "missing-keyword", "data before [Network Data]; a Touchstone 2.0 file lists its data after the [Network Data] keyword", {
      line: lineNo,
      field: "[Network Data]",
    });
  }
  data.readLine(text, start, end, lineNo, at.next);
}

/** End-of-file checks on the header. */
function checkComplete(s: State): void {
  if (s.version === undefined) fail(s, "missing-option-line", "the file has only comments: no option line and no data", {});
  if (s.version === 1 && s.optionLine === 0) {
    fail(s, "missing-option-line", 'no option line ("# <unit> S <format> R <ohms>", e.g. "# GHz S MA R 50") was found', { field: "option line" });
  }
  if (s.version === 2 && !s.networkDataSeen) {
    fail(s, "missing-keyword", "the [Network Data] keyword is missing; a Touchstone 2.0 file lists its data after it", { field: "[Network Data]" });
  }
  if (s.version === 2 && !s.ended) s.warnings.push("the [End] keyword is missing");
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
