/**
 * A released sheet's specification table as CSV, through the compare table's writer (`csvDocument`:
 * RFC 4180, CRLF, UTF-8 with a byte-order mark, formula-like text set off). One line per row and
 * condition group, as the sheet prints it: the parameter, its symbol, one column per condition
 * column of the sheet as printed, min, typ and max with the sheet's digits (hyphen-minus for the true minus,
 * so that a spreadsheet reads numbers),
 * the unit, the basis of a stated limit (and whether typ is the measured mean), the units behind the figure.
 */
import { csvDocument } from "./compare-csv";
import { limitBasisWords } from "../domain/sheets";
import type { SheetModel } from "../sheet/types";

export function specificationsCsv(model: Pick<SheetModel, "specifications">): string {
  const { conditionColumns, rows } = model.specifications;
  const header = ["Parameter", "Symbol", ...conditionColumns.map((c) => c.label), "Min", "Typ", "Max", "Unit", "Basis", "Typ is measured mean", "Units measured"];
  const lines = rows.map((row) => [
    row.label,
    row.symbol,
    // Conditions stay as printed: "−40 °C" with its true minus is text to a spreadsheet, not a formula.
    ...conditionColumns.map((_, i) => row.conditions[i] ?? ""),
    plain(row.min.text),
    plain(row.typ.text),
    plain(row.max.text),
    row.unit,
    row.min.text || row.max.text ? limitBasisWords[row.basis].choice : "",
    row.typIsMeasuredMean ? "yes" : "no",
    String(row.n),
  ]);
  return csvDocument([header, ...lines]);
}

/** The sheet prints a true minus (U+2212); a spreadsheet reads a number with a hyphen-minus. */
function plain(text: string): string {
  return text.replace(/\u2212/g, "-").replace(/[\u00a0\u202f]/g, " ");
}
