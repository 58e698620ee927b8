/**
 * Foreign CSV files: a bench script's own headers mapped onto our conventions
 * (fixtures/FORMATS.md). The mapped file is rewritten into our format and read by
 * the ordinary parser, so a mapped file meets exactly the same checks; errors are
 * then moved back to the line and column of the original file.
 */
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
  for (const ch of line) if (ch === "\t" || ch === ";" || ch === ",") counts[ch] += 1;
  if (counts["\t"] > 0) return "\t";
  return counts[";"] > counts[","] ? ";" : ",";
}

/** The header row (first line that is neither blank nor a `#` line) and a preview of the data. */
export function readForeignTable(fileName: string, bytes: Uint8Array, previewRows = 5): ForeignTable {
  const text = decodeInput({ fileName, bytes });
  const lines = text.split(/\r?\n/);
  const headerIndex = lines.findIndex((l) => l.trim() !== "" && !l.trimStart().startsWith("#"));
  if (headerIndex < 0) throw new IngestError({ fileName, code: "missing-header", detail: "no header row: every line is blank or a # line" });
  const delimiter = detectDelimiter(lines[headerIndex]);
  const headers = lines[headerIndex].split(delimiter).map((h) => h.trim());
  const preview: string[][] = [];
  for (let i = headerIndex + 1; i < lines.length && preview.length < previewRows; i++) {
    if (lines[i].trim() === "" || lines[i].trimStart().startsWith("#")) continue;
    preview.push(lines[i].split(delimiter).map((c) => c.trim()));
  }
  return { delimiter, headerLine: headerIndex + 1, headers, preview };
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
}): ParsedMeasurement {
  const { fileName, kind, mapping } = opts;
  const text = decodeInput({ fileName, bytes: opts.bytes, maxBytes: opts.maxBytes });
  const table = readForeignTable(fileName, opts.bytes, 0);
  const problems = findMappingProblems(kind, table.headers, mapping);
  if (problems.length) {
    throw new IngestError({ fileName, code: "missing-column", line: table.headerLine, detail: `the column mapping does not fit this file: ${problems.join("; ")}` });
  }
  const lines = text.split(/\r?\n/);
  const keep = mapping.map((m) => table.headers.indexOf(m.column));
  const present = new Set(
    lines
      .slice(0, table.headerLine - 1)
      .map((l) => /^\s*#\s*([A-Za-z0-9_]+)\s*:/.exec(l)?.[1]?.toLowerCase())
      .filter(Boolean) as string[],
  );
  const added = [`# kind: ${kind}`, ...Object.entries(opts.metadata ?? {}).filter(([k, v]) => v !== "" && !present.has(k)).map(([k, v]) => `# ${k}: ${v}`)].filter(
    (l) => !(l.startsWith("# kind:") && present.has("kind")),
  );
  const out: string[] = [...added, ...lines.slice(0, table.headerLine - 1)];
  out.push(mapping.map((m) => `${m.target} [${m.unit}]`).join(table.delimiter));
  for (let i = table.headerLine; i < lines.length; i++) {
    const line = lines[i];
    if (line.trim() === "" || line.trimStart().startsWith("#")) {
      out.push(line);
      continue;
    }
    const cells = line.split(table.delimiter);
    out.push(keep.map((k) => cells[k] ?? "").join(table.delimiter));
  }
  const offset = added.length;
  try {
    return parseMeasurementFile({ fileName, text: out.join("\n"), kind, maxBytes: Number.POSITIVE_INFINITY });
  } catch (error) {
    if (!(error instanceof IngestError)) throw error;
    const line = error.line !== undefined && error.line > offset ? error.line - offset : undefined;
    const column = error.column !== undefined && keep[error.column - 1] !== undefined ? keep[error.column - 1] + 1 : undefined;
    const field = column !== undefined ? table.headers[column - 1] : error.field;
    const detail = error.message.slice(error.message.indexOf(": ") + 2);
    throw new IngestError({ fileName, code: error.code, line, column, field, detail, expected: error.expected, found: error.found });
  }
}
