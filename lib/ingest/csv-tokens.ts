/**
 * RFC 4180 quoting, tokenized by csv-parse (its sync API: pure, no streams, no I/O). A quoted
 * cell may hold the delimiter ("Output, dBm"), a doubled quote ("12 ""N"" type") and line breaks;
 * leading and trailing spaces around a cell are ignored, as in our unquoted cells.
 *
 * Our conventions stay on top: "#" lines are comments, blank lines are skipped, and every record
 * keeps the physical line it starts on, so messages name the line an editor shows even after a
 * cell that spans lines. csv-parse is only asked to split; the numbers are read by our own strict
 * reader (number.ts), and a quoting mistake is located by our own scan, so its message names the
 * line and column of the quote itself rather than the place where csv-parse noticed the problem.
 *
 * A file without a single quote character is split by the fast scanner in csv-table.ts instead:
 * without quotes, RFC 4180 cells are exactly the text between delimiters. In a file with quotes,
 * a record whose cells are plain or quoted on one line with no quote inside is cut here, and only
 * the other records go to csv-parse (splitRecordByRecord); whenever that reading meets anything it
 * does not expect, the whole text goes through csv-parse as before, so cells, lines and messages
 * are csv-parse's in every case.
 */
import { parse } from "csv-parse/sync";
import { IngestError, shortenFound } from "./errors";

export type Delimiter = "," | ";" | "\t";

export interface CsvRecords {
  /** One array of cell values per record (comments and blank lines left out). */
  cells: string[][];
  /** The physical (1-based) line each record starts on. */
  lines: number[];
}

const QUOTE = 34;

/** The line with its quoted parts removed, for finding the delimiter of a header such as `"Output, dBm";x`. */
export function outsideQuotes(line: string): string {
  if (!line.includes('"')) return line;
  let out = "";
  let inside = false;
  for (let i = 0; i < line.length; i++) {
    const c = line.charCodeAt(i);
    if (c === QUOTE) inside = !inside;
    else if (!inside) out += line[i];
  }
  return out;
}

function countNewlines(cell: string): number {
  let n = 0;
  for (let at = cell.indexOf("\n"); at !== -1; at = cell.indexOf("\n", at + 1)) n++;
  return n;
}

/** The physical line of cell `index` of a record that starts on `recordLine` (earlier cells may span lines). */
export function cellLine(record: string[], recordLine: number, index: number): number {
  let line = recordLine;
  for (let k = 0; k < index && k < record.length; k++) if (record[k].includes("\n")) line += countNewlines(record[k]);
  return line;
}

/**
 * Splits text[from…] into records. `firstLine` is the physical line number of text[from]. Throws
 * IngestError "bad-quoting" at the line and column (cell number) of a quoting mistake.
 */
export function tokenizeCsv(opts: { fileName: string; text: string; from: number; firstLine: number; delimiter: Delimiter }): CsvRecords {
  const spans = tokenizeCsvSpans(opts);
  const cells: string[][] = new Array(spans.lines.length);
  for (let r = 0; r < cells.length; r++) cells[r] = recordCells(spans, r);
  return { cells, lines: spans.lines };
}

/**
 * Records as spans of the (LF-only) text instead of strings: a 100,000-row file read into arrays of
 * cell strings kept half a million small objects alive until its numbers were read, and the garbage
 * collector's copying of them was a third of the time. Record r's cells are body[bounds[2c],
 * bounds[2c + 1]) for c from firstCell[r] to firstCell[r + 1], or, for a record csv-parse read
 * (a doubled quote, a quoted line break…), the strings in `parsed`.
 */
export interface CsvSpans {
  body: string;
  /** The physical (1-based) line each record starts on. */
  lines: number[];
  firstCell: Int32Array;
  bounds: Int32Array;
  parsed: Map<number, string[]>;
}

/** tokenizeCsv's records as spans (see CsvSpans), with the same cells, lines and errors. */
export function tokenizeCsvSpans(opts: { fileName: string; text: string; from: number; firstLine: number; delimiter: Delimiter }): CsvSpans {
  const { fileName, delimiter, firstLine } = opts;
  // csv-parse counts a CRLF inside a quoted cell as two lines; with LF only its count is exact.
  const slice = opts.text.slice(opts.from);
  const body = slice.includes("\r\n") ? slice.replace(/\r\n/g, "\n") : slice;
  const spans = splitRecordByRecord(body, delimiter, firstLine);
  if (spans) return spans;
  const whole = tokenizeWhole(fileName, body, delimiter, firstLine);
  return { body, lines: whole.lines, firstCell: new Int32Array(whole.lines.length + 1), bounds: new Int32Array(0), parsed: new Map(whole.cells.map((c, r) => [r, c])) };
}

/** The cells of record r as strings. */
export function recordCells(spans: CsvSpans, r: number): string[] {
  const parsed = spans.parsed.get(r);
  if (parsed) return parsed;
  const out: string[] = [];
  for (let c = spans.firstCell[r]; c < spans.firstCell[r + 1]; c++) out.push(spans.body.slice(spans.bounds[2 * c], spans.bounds[2 * c + 1]));
  return out;
}

/** The records from record `from` on (the data rows after a header). */
export function spansFrom(spans: CsvSpans, from: number): CsvSpans {
  const parsed = new Map<number, string[]>();
  for (const [r, cells] of spans.parsed) if (r >= from) parsed.set(r - from, cells);
  return { body: spans.body, lines: spans.lines.slice(from), firstCell: spans.firstCell.subarray(from), bounds: spans.bounds, parsed };
}

/**
 * tokenizeCsv with the whole text through csv-parse at once: the reading every quoting error's
 * message comes from, and the reference tokenizeCsv's record-by-record reading is tested against.
 */
export function tokenizeCsvWhole(opts: { fileName: string; text: string; from: number; firstLine: number; delimiter: Delimiter }): CsvRecords {
  const slice = opts.text.slice(opts.from);
  const body = slice.includes("\r\n") ? slice.replace(/\r\n/g, "\n") : slice;
  return tokenizeWhole(opts.fileName, body, opts.delimiter, opts.firstLine);
}

function tokenizeWhole(fileName: string, body: string, delimiter: Delimiter, firstLine: number): CsvRecords {
  let cells: string[][];
  try {
    cells = parse(body, { ...CSV_PARSE_OPTIONS, delimiter });
  } catch (error) {
    const code = (error as { code?: string }).code ?? "";
    const found = locateQuoteProblem(body, delimiter);
    if (found) {
      throw new IngestError({
        fileName,
        code: "bad-quoting",
        line: firstLine + found.line - 1,
        column: found.column,
        detail: found.detail,
        expected: 'a cell that is quoted whole, "like this", with a quote inside written twice ("")',
        found: found.found,
      });
    }
    const csvLine = (error as { lines?: number }).lines;
    throw new IngestError({
      fileName,
      code: "bad-quoting",
      line: csvLine === undefined ? undefined : firstLine + csvLine - 1,
      detail: `the rows cannot be split into cells (${code || "unreadable quoting"})`,
    });
  }
  return { cells, lines: recordLines(body, cells, firstLine) };
}

// Plain array output: an on_record callback makes csv-parse build two info objects per record,
// which cost a third of the time in a profile; the lines are counted by recordLines instead.
const CSV_PARSE_OPTIONS = {
  record_delimiter: "\n",
  quote: '"',
  escape: '"',
  trim: true,
  comment: "#",
  comment_no_infix: true,
  skip_empty_lines: true,
  relax_column_count: true,
} as const;

/**
 * The records of LF-only text one at a time, with csv-parse's result: a record whose cells are each
 * unquoted or quoted on one line without a quote inside (nearly every record of a spreadsheet
 * export) is cut at its delimiters here; any other record (a doubled quote, a line break inside
 * quotes, a "#", unusual spaces at a cell's edge) goes to csv-parse alone. csv-parse's per-byte
 * loop over the whole file cost twice the plain reading of it, most of a quoted file's time.
 * Returns undefined, so that tokenizeWhole reads the text and words any error exactly as before,
 * whenever a record does not come out as one clean record of csv-parse's (a quoting mistake, a
 * blank-looking line of tabs in a tab file, text that is not well-formed UTF-16).
 */
function splitRecordByRecord(body: string, delimiter: Delimiter, firstLine: number): CsvSpans | undefined {
  if (!(body as string & { isWellFormed(): boolean }).isWellFormed()) return undefined;
  const d = delimiter.charCodeAt(0);
  const n = body.length;
  const lines: number[] = [];
  const parsedRecords = new Map<number, string[]>();
  const out: SpanBuffer = { bounds: new Int32Array(1024), count: 0 };
  let firstCell = new Int32Array(256);
  const cursor: ScanCursor = { nextDelimiter: -1, nextQuote: -1, nextHash: -1 };
  let pos = 0;
  let line = firstLine;
  while (pos < n) {
    // Blank and "#" lines are skipped by recordLines' rule; a tab in front of them in a tab file is a
    // delimiter to csv-parse (a record of empty cells), so such a file is read whole.
    let j = pos;
    while (j < n && isSpace(body.charCodeAt(j))) j++;
    const first = j < n ? body.charCodeAt(j) : 10;
    if (first === 10 || first === 35) {
      if (d === 9 && body.lastIndexOf("\t", j) >= pos) return undefined;
      const nl = body.indexOf("\n", j);
      pos = nl === -1 ? n : nl + 1;
      line++;
      continue;
    }
    const r = lines.length;
    if (r + 2 > firstCell.length) {
      const grown = new Int32Array(firstCell.length * 2);
      grown.set(firstCell);
      firstCell = grown;
    }
    firstCell[r] = out.count;
    const lineEnd = body.indexOf("\n", pos);
    const end = lineEnd === -1 ? n : lineEnd;
    if (splitPlainRecord(body, pos, end, d, delimiter, cursor, out)) {
      lines.push(line);
      pos = end + 1;
      line++;
      continue;
    }
    out.count = firstCell[r];
    const next = recordEnd(body, pos);
    let parsed: string[][];
    try {
      parsed = parse(body.slice(pos, next), { ...CSV_PARSE_OPTIONS, delimiter });
    } catch {
      return undefined;
    }
    if (parsed.length !== 1) return undefined;
    let spanned = 1;
    for (const cell of parsed[0]) if (cell.includes("\n")) spanned += countNewlines(cell);
    if (spanned !== countNewlines(body.slice(pos, next)) + (next === n && body.charCodeAt(n - 1) !== 10 ? 1 : 0)) return undefined;
    parsedRecords.set(r, parsed[0]);
    lines.push(line);
    line += spanned;
    pos = next;
  }
  firstCell[lines.length] = out.count;
  return { body, lines, firstCell: firstCell.subarray(0, lines.length + 1), bounds: out.bounds, parsed: parsedRecords };
}

/** Cell bounds (start, end pairs) written so far, in a buffer grown by doubling. */
interface SpanBuffer {
  bounds: Int32Array;
  /** Cells written. */
  count: number;
}

function pushSpan(out: SpanBuffer, start: number, end: number): void {
  if (2 * out.count + 2 > out.bounds.length) {
    const grown = new Int32Array(out.bounds.length * 2);
    grown.set(out.bounds);
    out.bounds = grown;
  }
  out.bounds[2 * out.count] = start;
  out.bounds[2 * out.count + 1] = end;
  out.count++;
}

/** Where the next delimiter, quote and "#" are at or after the scan position (cached: -1 until looked up, the length when none). */
interface ScanCursor {
  nextDelimiter: number;
  nextQuote: number;
  nextHash: number;
}

const nextAt = (body: string, cached: number, what: string, from: number): number => {
  if (cached >= from) return cached;
  const at = body.indexOf(what, from);
  return at === -1 ? body.length : at;
};

/** A space or tab that is not the delimiter: what csv-parse trims around a cell, short of its rarer spaces. */
const isCellSpace = (c: number, d: number) => (c === 32 || c === 9) && c !== d;

/**
 * Spaces csv-parse also trims (String.prototype.trim's set, csv-parse 7) that this scanner leaves
 * to csv-parse: CR, FF, VT and any character above ASCII (the no-break and Unicode spaces among them).
 */
const isUnusualEdge = (c: number) => c === 13 || c === 12 || c === 11 || c >= 0x80;

/**
 * Writes the cells of body[start, end) (one physical line) to `out` when each is unquoted without
 * a quote, or quoted whole with no quote inside; spaces and tabs around a cell are dropped as
 * csv-parse's trim does. False for any other line, and for a line with a "#" (csv-parse's comment
 * rules); the caller then drops what was written.
 */
function splitPlainRecord(body: string, start: number, end: number, d: number, delimiter: string, cursor: ScanCursor, out: SpanBuffer): boolean {
  cursor.nextHash = nextAt(body, cursor.nextHash, "#", start);
  if (cursor.nextHash < end) return false;
  let p = start;
  for (;;) {
    while (p < end && isCellSpace(body.charCodeAt(p), d)) p++;
    let stop: number;
    if (p < end && body.charCodeAt(p) === QUOTE) {
      const close = body.indexOf('"', p + 1);
      if (close === -1 || close >= end) return false;
      pushSpan(out, p + 1, close);
      stop = close + 1;
      while (stop < end && isCellSpace(body.charCodeAt(stop), d)) stop++;
      if (stop < end && body.charCodeAt(stop) !== d) return false;
    } else {
      cursor.nextDelimiter = nextAt(body, cursor.nextDelimiter, delimiter, p);
      stop = cursor.nextDelimiter < end ? cursor.nextDelimiter : end;
      cursor.nextQuote = nextAt(body, cursor.nextQuote, '"', p);
      if (cursor.nextQuote < stop) return false;
      let e = stop;
      while (e > p && isCellSpace(body.charCodeAt(e - 1), d)) e--;
      if (e > p && (isUnusualEdge(body.charCodeAt(p)) || isUnusualEdge(body.charCodeAt(e - 1)))) return false;
      pushSpan(out, p, e);
    }
    if (stop >= end) return true;
    p = stop + 1;
  }
}

/** The end of the record starting at `start` (after its line break): the first LF outside quotes. */
function recordEnd(body: string, start: number): number {
  let quoted = false;
  for (let i = start; i < body.length; i++) {
    const c = body.charCodeAt(i);
    if (c === QUOTE) quoted = !quoted;
    else if (c === 10 && !quoted) return i + 1;
  }
  return body.length;
}

/**
 * The physical line each record starts on, walking the LF-only text beside csv-parse's records:
 * lines csv-parse skips (blank or whitespace only, or "#" after optional spaces) are stepped over
 * with the same rule, and a record covers one line plus the line breaks inside its cells.
 */
function recordLines(body: string, cells: string[][], firstLine: number): number[] {
  const lines = new Array<number>(cells.length);
  let pos = 0;
  let line = firstLine;
  for (let r = 0; r < cells.length; r++) {
    for (;;) {
      let j = pos;
      while (j < body.length && isSpace(body.charCodeAt(j))) j++;
      const c = body.charCodeAt(j);
      if (c !== 10 && c !== 35) break;
      const nl = body.indexOf("\n", j);
      pos = nl === -1 ? body.length : nl + 1;
      line++;
    }
    lines[r] = line;
    const record = cells[r];
    let spanned = 1;
    for (let k = 0; k < record.length; k++) if (record[k].includes("\n")) spanned += countNewlines(record[k]);
    for (let h = 0; h < spanned; h++) {
      const nl = body.indexOf("\n", pos);
      pos = nl === -1 ? body.length : nl + 1;
      line++;
    }
  }
  return lines;
}

interface QuoteProblem {
  line: number;
  column: number;
  detail: string;
  found?: string;
}

const isSpace = (c: number) => c === 32 || c === 9;

/**
 * The first quoting mistake in LF-only text, by RFC 4180 §2 rules 5–7 with spaces allowed around
 * a cell: a quote opened and never closed, text after a closing quote, or a quote inside an
 * unquoted cell. Line is 1-based within `text`; column is the 1-based cell number.
 */
export function locateQuoteProblem(text: string, delimiter: Delimiter): QuoteProblem | undefined {
  const d = delimiter.charCodeAt(0);
  let i = 0;
  let line = 1;
  while (i < text.length) {
    // Start of a record: comment and blank lines are skipped as csv-parse does.
    let j = i;
    while (j < text.length && isSpace(text.charCodeAt(j))) j++;
    if (j >= text.length) return undefined;
    if (text.charCodeAt(j) === 10 || text.charCodeAt(j) === 35 /* # */) {
      const nl = text.indexOf("\n", j);
      if (nl === -1) return undefined;
      i = nl + 1;
      line++;
      continue;
    }
    let column = 1;
    let recordDone = false;
    while (!recordDone) {
      while (i < text.length && isSpace(text.charCodeAt(i))) i++;
      if (i < text.length && text.charCodeAt(i) === QUOTE) {
        const openLine = line;
        i++;
        for (;;) {
          if (i >= text.length) {
            return { line: openLine, column, detail: 'this cell opens a quote that is never closed; end the cell with " (a quote inside a cell is written twice: "")' };
          }
          const c = text.charCodeAt(i);
          if (c === QUOTE) {
            if (text.charCodeAt(i + 1) === QUOTE) {
              i += 2;
              continue;
            }
            i++;
            break;
          }
          if (c === 10) line++;
          i++;
        }
        while (i < text.length && isSpace(text.charCodeAt(i))) i++;
        if (i < text.length && text.charCodeAt(i) !== d && text.charCodeAt(i) !== 10) {
          let stop = i;
          while (stop < text.length && text.charCodeAt(stop) !== d && text.charCodeAt(stop) !== 10) stop++;
          const rest = text.slice(i, stop);
          return {
            line,
            column,
            detail: `text after the closing quote of this cell ("${shortenFound(rest)}"); a quoted cell ends at its closing quote, and a quote inside it is written twice ("")`,
            found: shortenFound(rest),
          };
        }
      } else {
        while (i < text.length) {
          const c = text.charCodeAt(i);
          if (c === d || c === 10) break;
          if (c === QUOTE) {
            const nl = text.indexOf("\n", i);
            return {
              line,
              column,
              detail: 'a quote inside an unquoted cell; quote the whole cell and write the inner quote twice ("12 ""N"" type"), or remove it',
              found: shortenFound(text.slice(i, nl === -1 ? text.length : nl)),
            };
          }
          i++;
        }
      }
      if (i >= text.length) return undefined;
      if (text.charCodeAt(i) === d) {
        i++;
        column++;
      } else {
        i++;
        line++;
        recordDone = true;
      }
    }
  }
  return undefined;
}

/** The cells of one line, quotes honoured; a line whose quoting is broken (or left open) is split plainly. */
export function splitCsvLine(line: string, delimiter: Delimiter): string[] {
  if (!line.includes('"')) return line.split(delimiter);
  try {
    const records = parse(line, { delimiter, record_delimiter: "\n", quote: '"', escape: '"', trim: true, relax_column_count: true });
    return records[0] ?? [""];
  } catch {
    return line.split(delimiter);
  }
}
