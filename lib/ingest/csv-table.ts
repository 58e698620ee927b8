/**
 * Benchfold's CSV conventions (described in fixtures/FORMATS.md):
 *   # key: value          metadata lines at the top (lines starting "#"
 *                          without a colon are comments)
 *   name [unit],...       one header row; units in square brackets
 *   numbers,...           data rows
 * Delimiter: comma, semicolon or tab, taken from the header row. Semicolon
 * files may use a decimal comma ("12,5") or a decimal point. A UTF-8 BOM,
 * CRLF or LF line ends, and blank lines are accepted. Cells may be quoted as
 * RFC 4180 says ("Output, dBm", "12 ""N"" type", a line break inside quotes):
 * a file with a quote from its header on is split by csv-parse (csv-tokens.ts),
 * any other by the single-pass scanner below, which needs no tokenizer since
 * unquoted cells are the text between delimiters.
 */
import { cellLine, outsideQuotes, recordCells, spansFrom, tokenizeCsvSpans, type CsvSpans, type Delimiter } from "./csv-tokens";
import { IngestError, shortenFound } from "./errors";
import { looksNonFinite, parseNumberAt as parseNumberAtImport, readPlainCsvNumber } from "./number";
import {
  acceptedUnits,
  describeQuantity,
  describeRange,
  findConversion,
  inRange as inRangeImport,
  type Quantity,
  type UnitConversion,
  type ValueRange,
} from "./units";

export type { Delimiter };

// Read once into locals: through tsx (the CLI, the benchmark) an imported function is a getter on
// its module, and these two are called for every cell.
const parseNumberAt = parseNumberAtImport;
const inRange = inRangeImport;
const readPlainNumber = readPlainCsvNumber;
/** Where readPlainNumber puts a cell's value. */
const plainValue = new Float64Array(1);

export interface MetadataEntry {
  key: string;
  value: string;
  line: number;
}

export interface HeaderCell {
  /** 0-based position in the row. */
  index: number;
  /** Lower-case name with spaces and hyphens folded to "_", e.g. "input_power". */
  name: string;
  /** The cell as written, for messages. */
  raw: string;
  /** The text inside the brackets, if any. */
  unit?: string;
}

export interface CsvDocument {
  fileName: string;
  text: string;
  delimiter: Delimiter;
  /** Semicolon files accept "12,5" as well as "12.5". */
  decimalComma: boolean;
  metadata: Map<string, MetadataEntry>;
  header: HeaderCell[];
  headerLine: number;
  /** Offset of the first character after the header row. */
  dataOffset: number;
  /** The data rows already split, when the file uses quotes (csv-tokens.ts); else undefined. */
  quotedRows?: CsvSpans;
}

const DELIMITER_NAMES: Record<Delimiter, string> = { ",": "comma", ";": "semicolon", "\t": "tab" };

export function normalizeName(raw: string): string {
  // A name already written in lower case, digits and "_" between spaces (most keys and column
  // names: " kind", "input_power ") is its own normal form once the spaces are cut: lower-casing
  // and the replacement would copy it unchanged.
  let start = 0;
  let end = raw.length;
  while (start < end && raw.charCodeAt(start) === 32) start++;
  while (end > start && raw.charCodeAt(end - 1) === 32) end--;
  let plain = start < end;
  for (let i = start; plain && i < end; i++) {
    const c = raw.charCodeAt(i);
    plain = (c >= 97 && c <= 122) || (c >= 48 && c <= 57) || c === 95;
  }
  if (plain) return start === 0 && end === raw.length ? raw : raw.slice(start, end);
  return raw.trim().toLowerCase().replace(/[\s-]+/g, "_");
}

function lineEnd(text: string, from: number): { end: number; next: number } {
  const nl = text.indexOf("\n", from);
  const next = nl === -1 ? text.length : nl + 1;
  let end = nl === -1 ? text.length : nl;
  if (end > from && text.charCodeAt(end - 1) === 13) end--;
  return { end, next };
}

function isBlankRange(text: string, start: number, end: number): boolean {
  for (let i = start; i < end; i++) {
    const c = text.charCodeAt(i);
    if (c !== 32 && c !== 9 && c !== 12 && c !== 10 && c !== 13) return false;
  }
  return true;
}

function firstNonSpace(text: string, start: number, end: number): number {
  let i = start;
  while (i < end && (text.charCodeAt(i) === 32 || text.charCodeAt(i) === 9)) i++;
  return i;
}

function detectDelimiter(fileName: string, line: string, lineNo: number): Delimiter {
  const found: Delimiter[] = [];
  if (line.includes("\t")) found.push("\t");
  if (line.includes(";")) found.push(";");
  if (line.includes(",")) found.push(",");
  if (found.length > 1) {
    throw new IngestError({
      fileName,
      code: "mixed-delimiters",
      line: lineNo,
      detail: `the header row mixes ${found.map((d) => DELIMITER_NAMES[d]).join(" and ")} delimiters; use one of comma, semicolon or tab`,
      expected: "one delimiter",
    });
  }
  return found[0] ?? ",";
}

function parseHeaderCell(fileName: string, raw: string, index: number, lineNo: number): HeaderCell {
  const open = raw.indexOf("[");
  if (open === -1) {
    const name = normalizeName(raw);
    if (name === "") {
      throw new IngestError({
        fileName,
        code: "missing-header",
        line: lineNo,
        column: index + 1,
        detail: "header cell is empty; every column needs a name",
        expected: "a column name such as \"frequency [MHz]\"",
      });
    }
    return { index, name, raw: raw.trim() };
  }
  const close = raw.indexOf("]", open);
  if (close === -1 || raw.slice(close + 1).trim() !== "") {
    throw new IngestError({
      fileName,
      code: "unknown-unit",
      line: lineNo,
      column: index + 1,
      field: raw.trim(),
      detail: "the unit must be in square brackets at the end of the header cell, e.g. \"frequency [MHz]\"",
      expected: "name [unit]",
      found: shortenFound(raw.trim()),
    });
  }
  return {
    index,
    name: normalizeName(raw.slice(0, open)),
    raw: raw.trim(),
    unit: raw.slice(open + 1, close).trim(),
  };
}

function allNumeric(cells: string[]): boolean {
  return cells.every((c) => {
    const t = c.trim();
    return t !== "" && !Number.isNaN(parseNumberAt(t, 0, t.length, true));
  });
}

/** Reads metadata and the header row; data rows are read on demand by readCsvColumns. */
export function readCsvDocument(fileName: string, text: string): CsvDocument {
  const metadata = new Map<string, MetadataEntry>();
  let pos = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let lineNo = 0;
  while (pos < text.length) {
    lineNo++;
    const { end, next } = lineEnd(text, pos);
    const start = firstNonSpace(text, pos, end);
    if (start === end) {
      pos = next;
      continue;
    }
    if (text.charCodeAt(start) === 35 /* # */) {
      const body = text.slice(start + 1, end);
      const colon = body.indexOf(":");
      if (colon > 0) {
        const key = normalizeName(body.slice(0, colon));
        const value = body.slice(colon + 1).trim();
        if (key !== "") {
          const before = metadata.get(key);
          if (before) {
            throw new IngestError({
              fileName,
              code: "duplicate-metadata",
              line: lineNo,
              field: key,
              detail: `metadata key "${key}" appears twice (first on line ${before.line})`,
            });
          }
          metadata.set(key, { key, value, line: lineNo });
        }
      }
      pos = next;
      continue;
    }
    const line = text.slice(start, end);
    const quoted = text.indexOf('"', start) !== -1;
    const delimiter = detectDelimiter(fileName, quoted ? outsideQuotes(line) : line, lineNo);
    let rawCells: string[];
    let quotedRows: CsvSpans | undefined;
    if (quoted) {
      const records = tokenizeCsvSpans({ fileName, text, from: pos, firstLine: lineNo, delimiter });
      rawCells = recordCells(records, 0);
      quotedRows = spansFrom(records, 1);
    } else {
      rawCells = line.split(delimiter);
    }
    if (allNumeric(rawCells)) {
      throw new IngestError({
        fileName,
        code: "missing-header",
        line: lineNo,
        detail: `expected a header row such as "frequency [MHz],L [dBc/Hz]" before the data, found "${shortenFound(line)}"`,
        expected: "a header row",
        found: shortenFound(line),
      });
    }
    const header = rawCells.map((raw, i) => parseHeaderCell(fileName, raw, i, lineNo));
    const seen = new Map<string, number>();
    for (const cell of header) {
      const first = seen.get(cell.name);
      if (first !== undefined) {
        throw new IngestError({
          fileName,
          code: "duplicate-column",
          line: lineNo,
          column: cell.index + 1,
          field: cell.raw,
          detail: `column "${cell.name}" appears twice (also column ${first + 1})`,
        });
      }
      seen.set(cell.name, cell.index);
    }
    return {
      fileName,
      text,
      delimiter,
      decimalComma: delimiter === ";",
      metadata,
      header,
      headerLine: lineNo,
      dataOffset: quotedRows ? text.length : next,
      quotedRows,
    };
  }
  throw new IngestError({
    fileName,
    code: "missing-header",
    detail: "no header row and no data: the file holds only metadata or comments",
    expected: "a header row and data rows",
  });
}

export interface ColumnRequest {
  cell: HeaderCell;
  conversion: UnitConversion;
  range: ValueRange;
  /** Used in messages: "expected a number in dBm". */
  quantity: Quantity;
}

export interface ColumnValues {
  /** One array per request, in canonical units. */
  values: number[][];
  /** File line number of each row, for later checks (monotonicity). */
  lines: number[];
}

function otherDelimiterIn(text: string, start: number, end: number, delimiter: Delimiter): Delimiter | undefined {
  const others: Delimiter[] = delimiter === "," ? [";", "\t"] : delimiter === ";" ? ["\t"] : [",", ";"];
  const segment = text.slice(start, end);
  return others.find((d) => segment.includes(d));
}

/** Scratch buffers of readCsvColumns, big enough for a 4,096-value file; a larger one grows its own. */
const SCRATCH_VALUES = 4096;
const scratchValues = new Float64Array(SCRATCH_VALUES);
const scratchLines = new Int32Array(SCRATCH_VALUES);

/**
 * Reads the requested columns of every data row in one pass over the text,
 * without splitting rows into arrays of strings. Every row must have as many
 * cells as the header; blank lines and "#" comment lines are skipped.
 */
export function readCsvColumns(doc: CsvDocument, requests: ColumnRequest[]): ColumnValues {
  // The scanner below is left as it was: a branch at its top changed V8's inlining and cost a third of the plain path's time.
  return doc.quotedRows ? readQuotedColumns(doc, doc.quotedRows, requests) : scanCsvColumns(doc, requests);
}

function scanCsvColumns(doc: CsvDocument, requests: ColumnRequest[]): ColumnValues {
  const { text, fileName, delimiter, decimalComma } = doc;
  const delimiterCode = delimiter.charCodeAt(0);
  const width = doc.header.length;
  const slot = new Int32Array(width).fill(-1);
  requests.forEach((r, k) => (slot[r.cell.index] = k));
  // Typed buffers grown by doubling: pushing doubles onto plain arrays was the slowest step.
  // The values go row by row into one buffer (value k of row r at r·columns + k). The buffers
  // are scratch space (the result is copied out into plain arrays), so a small file reuses
  // the module's instead of allocating its own: with thousands of small files per upload the
  // allocations, not the reading, were the cost.
  const columns = requests.length;
  const fitsScratch = columns <= SCRATCH_VALUES;
  let capacity = fitsScratch ? Math.floor(SCRATCH_VALUES / columns) : 1;
  let buffer = fitsScratch ? scratchValues : new Float64Array(columns);
  let lineBuffer = scratchLines;
  let rows = 0;
  // Next delimiter at or after the cursor, cached so a line without one does not rescan the rest of the file.
  let nextDelim = text.indexOf(delimiter, doc.dataOffset);
  let pos = doc.dataOffset;
  let lineNo = doc.headerLine;
  while (pos < text.length) {
    lineNo++;
    const nl = text.indexOf("\n", pos);
    const next = nl === -1 ? text.length : nl + 1;
    let end = nl === -1 ? text.length : nl;
    if (end > pos && text.charCodeAt(end - 1) === 13) end--;
    const lineStart = pos;
    pos = next;
    if (isBlankRange(text, lineStart, end)) continue;
    if (text.charCodeAt(firstNonSpace(text, lineStart, end)) === 35) continue;
    if (rows === capacity) {
      capacity *= 2;
      const grown = new Float64Array(capacity * columns);
      grown.set(buffer.subarray(0, rows * columns));
      buffer = grown;
      const grownLines = new Int32Array(capacity);
      grownLines.set(lineBuffer.subarray(0, rows));
      lineBuffer = grownLines;
    }
    let cellStart = lineStart;
    let cell = 0;
    for (;;) {
      // A requested cell holding a plain number is read in one pass that also finds its end.
      const wanted = cell < width ? slot[cell] : -1;
      const plainEnd = wanted !== -1 ? readPlainNumber(text, cellStart, end, delimiterCode, decimalComma, plainValue, 0) : -1;
      if (plainEnd !== -1) {
        const r = requests[wanted];
        const x = plainValue[0];
        const v = r.conversion.toCanonical(x);
        if (r.conversion.invalid !== undefined || !inRange(v, r.range)) {
          let s = cellStart;
          let e = plainEnd;
          while (s < e && text.charCodeAt(s) === 32) s++;
          while (e > s && text.charCodeAt(e - 1) === 32) e--;
          convertChecked(doc, r, x, lineNo, cell, text.slice(s, e));
        }
        buffer[rows * columns + wanted] = v;
        cell++;
        if (plainEnd >= end) break;
        cellStart = plainEnd + 1;
        continue;
      }
      if (nextDelim !== -1 && nextDelim < cellStart) nextDelim = text.indexOf(delimiter, cellStart);
      const cellEnd = nextDelim !== -1 && nextDelim < end ? nextDelim : end;
      if (cell < width) {
        const k = slot[cell];
        if (k !== -1) {
          let s = cellStart;
          let e = cellEnd;
          while (s < e && (text.charCodeAt(s) === 32 || text.charCodeAt(s) === 9)) s++;
          while (e > s && (text.charCodeAt(e - 1) === 32 || text.charCodeAt(e - 1) === 9)) e--;
          const x = parseNumberAt(text, s, e, decimalComma);
          if (!Number.isFinite(x)) {
            checkRowShape(doc, lineStart, end, next, lineNo);
            throwCellError(doc, requests[k], lineNo, cell, text.slice(s, e), x);
          }
          const r = requests[k];
          const v = r.conversion.toCanonical(x);
          if (r.conversion.invalid !== undefined || !inRange(v, r.range)) convertChecked(doc, r, x, lineNo, cell, text.slice(s, e));
          buffer[rows * columns + k] = v;
        }
      }
      cell++;
      if (cellEnd >= end) break;
      cellStart = cellEnd + 1;
    }
    if (cell !== width) checkRowShape(doc, lineStart, end, next, lineNo);
    lineBuffer[rows++] = lineNo;
  }
  const values = requests.map((_, k) => columnToPlainArray(buffer, k, columns, rows));
  return { values, lines: columnToPlainArray(lineBuffer, 0, 1, rows) };
}

const isBlankChar = (c: number) => c === 32 || c === 9;

/**
 * readCsvColumns for a file with quotes, whose rows csv-tokens.ts already split: the same checks and
 * messages, reading each number straight from the text between its cell's bounds (or from the
 * cell strings of a record csv-parse read).
 */
function readQuotedColumns(doc: CsvDocument, rows: CsvSpans, requests: ColumnRequest[]): ColumnValues {
  const width = doc.header.length;
  const count = rows.lines.length;
  const { body, firstCell, bounds } = rows;
  const values = requests.map(() => new Array<number>(count));
  for (let r = 0; r < count; r++) {
    const parsed = rows.parsed.size > 0 ? rows.parsed.get(r) : undefined;
    const base = firstCell[r];
    if ((parsed ? parsed.length : firstCell[r + 1] - base) !== width) throwQuotedRowShape(doc, rows, r);
    for (let k = 0; k < requests.length; k++) {
      const req = requests[k];
      const cell = req.cell.index;
      const textCell = parsed ? parsed[cell] : body;
      let s = parsed ? 0 : bounds[2 * (base + cell)];
      let e = parsed ? textCell.length : bounds[2 * (base + cell) + 1];
      while (s < e && isBlankChar(textCell.charCodeAt(s))) s++;
      while (e > s && isBlankChar(textCell.charCodeAt(e - 1))) e--;
      const x = parseNumberAt(textCell, s, e, doc.decimalComma);
      if (!Number.isFinite(x)) throwCellError(doc, req, quotedCellLine(rows, r, cell), cell, textCell.slice(s, e), x);
      const v = req.conversion.toCanonical(x);
      if (req.conversion.invalid !== undefined || !inRange(v, req.range)) {
        convertChecked(doc, req, x, quotedCellLine(rows, r, cell), cell, textCell.slice(s, e));
      }
      values[k][r] = v;
    }
  }
  return { values, lines: rows.lines };
}

/** The physical line of a cell of a quoted file: its record's line, plus line breaks inside earlier cells. */
function quotedCellLine(rows: CsvSpans, r: number, cell: number): number {
  const parsed = rows.parsed.get(r);
  return parsed ? cellLine(parsed, rows.lines[r], cell) : rows.lines[r];
}

function throwQuotedRowShape(doc: CsvDocument, rows: CsvSpans, r: number): never {
  const { fileName, delimiter } = doc;
  const width = doc.header.length;
  const record = recordCells(rows, r);
  const cell = record.length;
  const line = rows.lines[r];
  const others: Delimiter[] = delimiter === "," ? [";", "\t"] : delimiter === ";" ? ["\t"] : [",", ";"];
  const other = cell < width ? others.find((d) => record.some((c) => c.includes(d))) : undefined;
  if (other !== undefined) {
    throw new IngestError({
      fileName,
      code: "mixed-delimiters",
      line,
      detail: `row has ${cell} cell${cell === 1 ? "" : "s"} when split on ${DELIMITER_NAMES[delimiter]}s (the header's delimiter) but contains ${DELIMITER_NAMES[other]}s; use one delimiter throughout`,
      expected: `${width} cells separated by ${DELIMITER_NAMES[delimiter]}s`,
    });
  }
  const truncated = cell < width && r === rows.lines.length - 1;
  throw new IngestError({
    fileName,
    code: truncated ? "truncated" : "cell-count",
    line,
    detail: `row has ${cell} cell${cell === 1 ? "" : "s"}, expected ${width} (one per header column)${truncated ? "; the file is truncated" : ""}`,
    expected: `${width} cells`,
  });
}

/**
 * Column `column` of a row-by-row buffer as a plain array, copied with a loop: several
 * times faster than Array.from on a typed array.
 */
function columnToPlainArray(source: Float64Array | Int32Array, column: number, columns: number, rows: number): number[] {
  const out = new Array<number>(rows);
  for (let r = 0; r < rows; r++) out[r] = source[r * columns + column];
  return out;
}

/** Throws when the row does not have one cell per header column. */
function checkRowShape(doc: CsvDocument, lineStart: number, end: number, next: number, lineNo: number): void {
  const { text, fileName, delimiter } = doc;
  const width = doc.header.length;
  let cell = 1;
  for (let i = lineStart; i < end; i++) if (text[i] === delimiter) cell++;
  if (cell === width) return;
  const other = otherDelimiterIn(text, lineStart, end, delimiter);
  if (other !== undefined && cell < width) {
    throw new IngestError({
      fileName,
      code: "mixed-delimiters",
      line: lineNo,
      detail: `row has ${cell} cell${cell === 1 ? "" : "s"} when split on ${DELIMITER_NAMES[delimiter]}s (the header's delimiter) but contains ${DELIMITER_NAMES[other]}s; use one delimiter throughout`,
      expected: `${width} cells separated by ${DELIMITER_NAMES[delimiter]}s`,
    });
  }
  const truncated = cell < width && isBlankRange(text, next, text.length);
  throw new IngestError({
    fileName,
    code: cell < width && truncated ? "truncated" : "cell-count",
    line: lineNo,
    detail: `row has ${cell} cell${cell === 1 ? "" : "s"}, expected ${width} (one per header column)${truncated ? "; the file is truncated" : ""}`,
    expected: `${width} cells`,
  });
}

function unitLabel(r: ColumnRequest): string {
  return r.conversion.unit;
}

function throwCellError(doc: CsvDocument, r: ColumnRequest, line: number, cell: number, found: string, x: number): never {
  const base = { fileName: doc.fileName, line, column: cell + 1, field: r.cell.raw, found: shortenFound(found) };
  const expected = `a number in ${unitLabel(r)}`;
  if (found === "") {
    throw new IngestError({ ...base, code: "empty-cell", expected, detail: `expected a number in ${unitLabel(r)}, found an empty cell` });
  }
  if (looksNonFinite(found) || (!Number.isNaN(x) && !Number.isFinite(x))) {
    throw new IngestError({
      ...base,
      code: "non-finite",
      expected,
      detail: `expected a finite number in ${unitLabel(r)}, found "${shortenFound(found)}"`,
    });
  }
  // "6,01" in a comma or tab file: say why, since the same cell is read in a semicolon file.
  const commaHint =
    !doc.decimalComma && found.includes(",") && Number.isFinite(parseNumberAt(found, 0, found.length, true))
      ? `; a decimal comma is read only in semicolon-delimited files: write ${shortenFound(found.replace(",", "."))} or use semicolons`
      : "";
  throw new IngestError({
    ...base,
    code: "bad-number",
    expected,
    detail: `expected a number in ${unitLabel(r)}, found "${shortenFound(found)}"${commaHint}`,
  });
}

function convertChecked(doc: CsvDocument, r: ColumnRequest, x: number, line: number, cell: number, found: string): number {
  const outOfRange = (detail: string, expected?: string) =>
    new IngestError({
      fileName: doc.fileName,
      code: "out-of-range",
      line,
      column: cell + 1,
      field: r.cell.raw,
      found: shortenFound(found),
      expected,
      detail,
    });
  const invalid = r.conversion.invalid?.(x);
  if (invalid !== undefined) throw outOfRange(`${invalid}, found ${found} ${r.conversion.unit}`);
  const v = r.conversion.toCanonical(x);
  if (!inRange(v, r.range)) {
    const range = describeRange(r.range);
    throw outOfRange(`${found} ${r.conversion.unit} is outside the plausible range for ${describeQuantity(r.quantity)} (${range})`, range);
  }
  return v;
}

/** Finds a column by normalized name and checks its unit against the quantity. */
export function findColumn(
  doc: CsvDocument,
  name: string,
  quantity: Quantity,
  range: ValueRange,
): ColumnRequest | undefined {
  const cell = doc.header.find((c) => c.name === name);
  if (!cell) return undefined;
  return columnRequest(doc, cell, quantity, range);
}

export function columnRequest(doc: CsvDocument, cell: HeaderCell, quantity: Quantity, range: ValueRange): ColumnRequest {
  if (cell.unit === undefined || cell.unit === "") {
    throw new IngestError({
      fileName: doc.fileName,
      code: "missing-unit",
      line: doc.headerLine,
      column: cell.index + 1,
      field: cell.raw,
      expected: `a unit in brackets: ${acceptedUnits(quantity)}`,
      detail: `column "${cell.raw}" has no unit; write it in brackets, e.g. "${cell.name} [${acceptedUnits(quantity).split(",")[0]}]"`,
    });
  }
  const conversion = findConversion(cell.unit, quantity);
  if (!conversion) {
    throw new IngestError({
      fileName: doc.fileName,
      code: "unknown-unit",
      line: doc.headerLine,
      column: cell.index + 1,
      field: cell.raw,
      expected: acceptedUnits(quantity),
      found: shortenFound(cell.unit),
      detail: `unknown unit "${shortenFound(cell.unit)}" for ${describeQuantity(quantity)}; expected one of ${acceptedUnits(quantity)}`,
    });
  }
  return { cell, conversion, range, quantity };
}

export function requireColumn(doc: CsvDocument, name: string, quantity: Quantity, range: ValueRange, example: string): ColumnRequest {
  const found = findColumn(doc, name, quantity, range);
  if (found) return found;
  throw new IngestError({
    fileName: doc.fileName,
    code: "missing-column",
    line: doc.headerLine,
    field: name,
    expected: example,
    detail: `required column "${example}" is missing; the header has ${doc.header.map((c) => `"${c.raw}"`).join(", ")}`,
  });
}

/** Strictly increasing values; equal neighbours are duplicates. */
export function checkIncreasing(doc: CsvDocument, request: ColumnRequest, values: number[], lines: number[]): void {
  for (let i = 1; i < values.length; i++) {
    if (values[i] > values[i - 1]) continue;
    const same = values[i] === values[i - 1];
    throw new IngestError({
      fileName: doc.fileName,
      code: same ? "duplicate-value" : "non-monotonic",
      line: lines[i],
      column: request.cell.index + 1,
      field: request.cell.raw,
      expected: "strictly increasing values",
      detail: same
        ? `"${request.cell.raw}" repeats the value of line ${lines[i - 1]}; each value must appear once`
        : `"${request.cell.raw}" decreases after line ${lines[i - 1]}; values must be strictly increasing`,
    });
  }
}

export function requireRows(doc: CsvDocument, lines: number[], minimum: number): void {
  if (lines.length >= minimum) return;
  throw new IngestError({
    fileName: doc.fileName,
    code: "too-few-points",
    line: doc.headerLine,
    expected: `at least ${minimum} data row${minimum === 1 ? "" : "s"}`,
    detail: `found ${lines.length} data row${lines.length === 1 ? "" : "s"} after the header, expected at least ${minimum}`,
  });
}

/** Header columns no request uses, for a warning. */
export function unusedColumns(doc: CsvDocument, requests: ColumnRequest[]): string[] {
  const used = new Set(requests.map((r) => r.cell.index));
  return doc.header.filter((c) => !used.has(c.index)).map((c) => c.raw);
}

/** The text of one cell, found again by its line (for messages that quote a value as written); undefined if not found. */
export function cellText(doc: CsvDocument, line: number, index: number): string | undefined {
  if (doc.quotedRows) {
    const r = doc.quotedRows.lines.indexOf(line);
    return r === -1 ? undefined : recordCells(doc.quotedRows, r)[index];
  }
  let pos = 0;
  for (let n = 1; n < line; n++) {
    const nl = doc.text.indexOf("\n", pos);
    if (nl === -1) return undefined;
    pos = nl + 1;
  }
  const nl = doc.text.indexOf("\n", pos);
  return doc.text.slice(pos, nl === -1 ? doc.text.length : nl).split(doc.delimiter)[index];
}
