/**
 * The compare table as CSV (RFC 4180: comma-separated, CRLF line ends, a field with a comma, a quote
 * or a line break in double quotes, a quote doubled), in UTF-8 with a byte-order mark so that a
 * spreadsheet reads "°" and "Δ" as they are. One line per figure, as on the page: the parameter, the
 * figure, the line's unit, which side is better, whether the conditions differ, then per sheet its
 * value (hyphen-minus, the digits the page shows), its conditions and its basis, then the better sheets.
 */
import { betterDirectionWords } from "./better-direction";
import type { CompareRow, CompareTable } from "./compare-table";

const BOM = "\uFEFF";

export function compareTableCsv(table: CompareTable): string {
  const header = [
    "Parameter",
    "Symbol",
    "Figure",
    "Unit",
    "Better",
    "Conditions",
    ...table.sheets.flatMap((s) => [s.label, `${s.label} conditions`, `${s.label} basis`]),
    "Better value",
  ];
  const lines = table.rows.map((row) => [
    row.label,
    row.symbol,
    row.field,
    row.unit,
    row.direction ? betterDirectionWords[row.direction] : "",
    conditionsWords(row),
    ...row.cells.flatMap((cell) => (cell ? [cell.text.replace(/\u2212/g, "-"), cell.conditionsText, cell.basis] : ["", "", ""])),
    table.sheets.filter((_, i) => row.cells[i]?.better).map((s) => s.label).join("; "),
  ]);
  return csvDocument([header, ...lines]);
}

/** Lines of fields as one CSV text: the one writer of Benchfold's CSV downloads (compare, a released sheet's specifications). */
export function csvDocument(lines: string[][]): string {
  return BOM + lines.map((fields) => fields.map(csvField).join(",")).join("\r\n") + "\r\n";
}

/** "same", "differ: band, temperature", or "" when one sheet alone states the figure. */
export function conditionsWords(row: Pick<CompareRow, "conditionsMatch" | "differingConditions" | "statedCount">): string {
  if (!row.conditionsMatch) return `differ: ${row.differingConditions.join(", ")}`;
  return row.statedCount > 1 ? "same" : "";
}

/** "KDX-2G4-B_KQH-2G-A-compare.csv": only safe filename characters. */
export function compareCsvFileName(table: Pick<CompareTable, "sheets">): string {
  const safe = (s: string) => s.replace(/[^A-Za-z0-9._-]+/g, "_");
  return `${table.sheets.map((s) => `${safe(s.partNumber)}-${safe(s.letter)}`).join("_")}-compare.csv`;
}

/**
 * One field. Text that a spreadsheet would run as a formula (it starts with =, +, −, @, a tab or a
 * carriage return: OWASP, "CSV Injection") is set off with a leading apostrophe, unless it is a plain
 * number such as −3.0 or +7, which is what the figures are.
 */
export function csvField(text: string): string {
  let value = text;
  if (/^[=+\-@\t\r]/.test(value) && !/^[+-]?\d+(?:\.\d+)?$/.test(value)) value = `'${value}`;
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}
