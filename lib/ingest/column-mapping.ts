/**
 * Foreign CSV files: a bench script's own headers mapped onto our conventions
 * (fixtures/FORMATS.md). The mapped file is rewritten into our format and read by
 * the ordinary parser, so a mapped file meets exactly the same checks; errors are
 * then moved back to the line and column of the original file.
 */
import { cellLine, outsideQuotes, tokenizeCsv, type CsvRecords } from "./csv-tokens";
import { decodeInput } from "./text-guards";
import { IngestError } from "./errors";
import { parseMeasurementFile } from "./parse-measurement-file";
import type { MappableKind } from "../domain/measurements";
import type { ParsedMeasurement } from "./types";

export type { MappableKind };

/** Our column names per kind, with the units each accepts (the parser converts them). */
export const mappingTargets: Record<MappableKind, { target: string; label: string; units: string[]; required: boolean }[]> = {
  "drive-sweep": [
    { target: "input_power", label: "Total input power", units: ["dBm", "mW", "W"], required: true },
    ...[1, 2, 3, 4, 5, 6].map((n) => ({ target: `p${n}_out`, label: `Output at ${n}× the input frequency`, units: ["dBm", "mW", "W"], required: false })),
  ],
  "frequency-sweep": [
    { target: "frequency", label: "Frequency", units: ["Hz", "kHz", "MHz", "GHz"], required: true },
    { target: "conversion_loss", label: "Conversion loss", units: ["dB"], required: false },
    { target: "output_power", label: "Output power", units: ["dBm", "mW", "W"], required: false },
    { target: "input_power", label: "Input power", units: ["dBm", "mW", "W"], required: false },
    { target: "isolation_lo_rf", label: "Isolation LO–RF", units: ["dB"], required: false },
    { target: "isolation_lo_if", label: "Isolation LO–IF", units: ["dB"], required: false },
    { target: "isolation_rf_if", label: "Isolation RF–IF", units: ["dB"], required: false },
  ],
  "two-tone": [
    { target: "input_power", label: "Input power per tone", units: ["dBm", "mW", "W"], required: true },
    { target: "fund_out", label: "Fundamental output per tone", units: ["dBm", "mW", "W"], required: true },
    { target: "im3_out", label: "Third-order product output", units: ["dBm", "mW", "W"], required: true },
  ],
  "phase-noise": [
    { target: "offset", label: "Offset frequency", units: ["Hz", "kHz", "MHz", "GHz"], required: true },
    { target: "L", label: "L(f), single-sideband phase noise", units: ["dBc/Hz"], required: true },
  ],
};

export type ColumnMappingEntry = { column: string; target: string; unit: string };

export type ForeignTable = {
  delimiter: "," | ";" | "\t";
  /** 1-based line of the header row. */
  headerLine: number;
  headers: string[];
  /** Up to `previewRows` data rows, split into cells. */
  preview: string[][];
};

function detectDelimiter(line: string): ForeignTable["delimiter"] {
  const counts = { "\t": 0, ";": 0, ",": 0 };
  for (const ch of outsideQuotes(line)) if (ch === "\t" || ch === ";" || ch === ",") counts[ch] += 1;
  if (counts["\t"] > 0) return "\t";
  return counts[";"] > counts[","] ? ";" : ",";
}

interface ForeignRecords {
  text: string;
  delimiter: ForeignTable["delimiter"];
  headerLine: number;
  headers: string[];
  /** Data records after the header (csv-parse: quotes honoured), with the physical line each starts on. */
  rows: CsvRecords;
}

/** The header row (first line that is neither blank nor a `#` line) and the records after it, quotes honoured. */
function readForeignRecords(fileName: string, text: string): ForeignRecords {
  let pos = 0;
  let lineNo = 0;
  while (pos < text.length) {
    lineNo++;
    const nl = text.indexOf("\n", pos);
    const line = text.slice(pos, nl === -1 ? text.length : nl);
    if (line.trim() !== "" && !line.trimStart().startsWith("#")) {
      const delimiter = detectDelimiter(line);
      const records = tokenizeCsv({ fileName, text, from: pos, firstLine: lineNo, delimiter });
      return {
        text,
        delimiter,
        headerLine: lineNo,
        headers: records.cells[0].map((h) => h.trim()),
        rows: { cells: records.cells.slice(1), lines: records.lines.slice(1) },
      };
    }
    pos = nl === -1 ? text.length : nl + 1;
  }
  throw new IngestError({ fileName, code: "missing-header", detail: "no header row: every line is blank or a # line" });
}

/** The header row and a preview of the data; quoted cells ("Output, dBm") are read as RFC 4180 says. */
export function readForeignTable(fileName: string, bytes: Uint8Array, previewRows = 5): ForeignTable {
  const { delimiter, headerLine, headers, rows } = readForeignRecords(fileName, decodeInput({ fileName, bytes }));
  const preview = rows.cells.slice(0, previewRows).map((r) => r.map((c) => c.trim()));
  return { delimiter, headerLine, headers, preview };
}

/** A cell written back in our format: quoted only when it holds the delimiter or a quote; line breaks become spaces. */
function writeCell(cell: string, delimiter: string): string {
  const flat = cell.includes("\n") ? cell.replace(/\r?\n/g, " ") : cell;
  return flat.includes(delimiter) || flat.includes('"') ? `"${flat.replace(/"/g, '""')}"` : flat;
}

/** The key a saved mapping is found by: the header cells, trimmed and lower-cased, in order. */
export function headerKey(headers: string[]): string {
  return headers.map((h) => h.trim().toLowerCase()).join("\u001f");
}

/** Checks a mapping against the table and the kind; returns what is wrong in words, or nothing. */
export function findMappingProblems(kind: MappableKind, headers: string[], mapping: ColumnMappingEntry[]): string[] {
  const problems: string[] = [];
  const targets = new Map(mappingTargets[kind].map((t) => [t.target, t]));
  const seenTargets = new Set<string>();
  for (const entry of mapping) {
    if (!headers.includes(entry.column)) problems.push(`column "${entry.column}" is not in the file's header`);
    const target = targets.get(entry.target);
    if (!target) problems.push(`"${entry.target}" is not a quantity of a ${kind} file`);
    else if (!target.units.includes(entry.unit)) problems.push(`${target.label} takes ${target.units.join(", ")}, not "${entry.unit}"`);
    if (seenTargets.has(entry.target)) problems.push(`"${entry.target}" is mapped twice`);
    seenTargets.add(entry.target);
  }
  for (const t of mappingTargets[kind]) if (t.required && !seenTargets.has(t.target)) problems.push(`map a column to ${t.label}`);
  return problems;
}

/**
 * Rewrites a foreign file into our convention and parses it. `metadata` supplies `# key: value`
 * lines the file lacks (our metadata keys, e.g. serial, input_frequency); lines the file has win.
 */
export function parseMappedFile(opts: {
  fileName: string;
  bytes: Uint8Array;
  kind: MappableKind;
  mapping: ColumnMappingEntry[];
  metadata?: Record<string, string>;
  maxBytes?: number;
  /** As ParseOptions.passive: the device class's switch (default true). */
  passive?: boolean;
}): ParsedMeasurement {
  const { fileName, kind, mapping } = opts;
  const text = decodeInput({ fileName, bytes: opts.bytes, maxBytes: opts.maxBytes });
  const table = readForeignRecords(fileName, text);
  const problems = findMappingProblems(kind, table.headers, mapping);
  if (problems.length) {
    throw new IngestError({ fileName, code: "missing-column", line: table.headerLine, detail: `the column mapping does not fit this file: ${problems.join("; ")}` });
  }
  const before = text.split(/\r?\n/).slice(0, table.headerLine - 1);
  const keep = mapping.map((m) => table.headers.indexOf(m.column));
  const present = new Set(before.map((l) => /^\s*#\s*([A-Za-z0-9_]+)\s*:/.exec(l)?.[1]?.toLowerCase()).filter(Boolean) as string[]);
  const added = [`# kind: ${kind}`, ...Object.entries(opts.metadata ?? {}).filter(([k, v]) => v !== "" && !present.has(k)).map(([k, v]) => `# ${k}: ${v}`)].filter(
    (l) => !(l.startsWith("# kind:") && present.has("kind")),
  );
  // Each written line remembers where it came from: the original line, and the data record if any.
  const out: string[] = [...added, ...before];
  const origin: (number | undefined)[] = [...added.map(() => undefined), ...before.map((_, i) => i + 1)];
  const recordOf: (number | undefined)[] = out.map(() => undefined);
  out.push(mapping.map((m) => `${m.target} [${m.unit}]`).join(table.delimiter));
  origin.push(table.headerLine);
  recordOf.push(undefined);
  table.rows.cells.forEach((cells, r) => {
    out.push(keep.map((k) => writeCell(cells[k] ?? "", table.delimiter)).join(table.delimiter));
    origin.push(table.rows.lines[r]);
    recordOf.push(r);
  });
  try {
    return parseMeasurementFile({ fileName, text: out.join("\n"), kind, maxBytes: Number.POSITIVE_INFINITY, passive: opts.passive });
  } catch (error) {
    if (!(error instanceof IngestError)) throw error;
    const at = error.line === undefined ? undefined : error.line - 1;
    const column = error.column !== undefined && keep[error.column - 1] !== undefined ? keep[error.column - 1] + 1 : undefined;
    const record = at === undefined ? undefined : recordOf[at];
    let line = at === undefined ? undefined : origin[at];
    if (record !== undefined && column !== undefined) line = cellLine(table.rows.cells[record], table.rows.lines[record], column - 1);
    const field = column !== undefined ? table.headers[column - 1] : error.field;
    const detail = error.message.slice(error.message.indexOf(": ") + 2);
    throw new IngestError({ fileName, code: error.code, line, column, field, detail, expected: error.expected, found: error.found });
  }
}
