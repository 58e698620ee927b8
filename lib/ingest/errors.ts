/**
 * The one error every parser throws. It carries where the problem is and a
 * short kebab-case code; the app maps codes to HTTP statuses (422, and 413 for
 * "too-large"), so nothing here knows about HTTP.
 */
export type IngestErrorCode =
  | "empty-file"
  | "binary-file"
  | "invalid-encoding"
  | "too-large"
  | "unknown-kind"
  | "missing-header"
  | "mixed-delimiters"
  | "bad-quoting"
  | "cell-count"
  | "empty-cell"
  | "bad-number"
  | "non-finite"
  | "unknown-unit"
  | "missing-unit"
  | "missing-column"
  | "duplicate-column"
  | "missing-metadata"
  | "bad-metadata"
  | "duplicate-metadata"
  | "out-of-range"
  | "implausible-value"
  | "non-monotonic"
  | "duplicate-value"
  | "too-few-points"
  | "missing-option-line"
  | "bad-option-line"
  | "unsupported-parameter"
  | "port-count"
  | "missing-port-count"
  | "bad-keyword"
  | "missing-keyword"
  | "frequency-count-mismatch"
  | "reference-count"
  | "truncated"
  | "unsupported-feature";

export interface IngestErrorDetails {
  fileName: string;
  code: IngestErrorCode;
  /** What went wrong, without the location prefix. */
  detail: string;
  /** 1-based line number in the file. */
  line?: number;
  /** 1-based field number on the line (CSV cell, or Touchstone value). */
  column?: number;
  /** Column header, metadata key or Touchstone keyword concerned. */
  field?: string;
  /** What was expected, e.g. "a number in dBm". */
  expected?: string;
  /** The offending text, shortened. */
  found?: string;
}

const FOUND_MAX_CHARS = 40;

export function shortenFound(text: string): string {
  const clean = text.replace(/[\u0000-\u001f]/g, "?");
  return clean.length > FOUND_MAX_CHARS ? `${clean.slice(0, FOUND_MAX_CHARS)}…` : clean;
}

function formatLocation(d: IngestErrorDetails): string {
  let where = d.fileName;
  if (d.line !== undefined) where += ` line ${d.line}`;
  if (d.column !== undefined) where += `${d.line !== undefined ? "," : ""} column ${d.column}`;
  if (d.field !== undefined) where += ` ("${d.field}")`;
  return where;
}

export class IngestError extends Error {
  readonly fileName: string;
  readonly code: IngestErrorCode;
  readonly line?: number;
  readonly column?: number;
  readonly field?: string;
  readonly expected?: string;
  readonly found?: string;

  constructor(details: IngestErrorDetails) {
    super(`${formatLocation(details)}: ${details.detail}`);
    this.name = "IngestError";
    this.fileName = details.fileName;
    this.code = details.code;
    this.line = details.line;
    this.column = details.column;
    this.field = details.field;
    this.expected = details.expected;
    this.found = details.found;
  }

  toJSON() {
    return {
      code: this.code,
      message: this.message,
      fileName: this.fileName,
      line: this.line,
      column: this.column,
      field: this.field,
      expected: this.expected,
      found: this.found,
    };
  }
}

export function isIngestError(value: unknown): value is IngestError {
  return value instanceof IngestError;
}
