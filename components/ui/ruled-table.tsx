import { ScrollTable } from "./scroll-table";

/** One column of a ruled table: its head, whether its cells name the row (`<th scope="row">`), and their classes. */
export type RuledColumn = {
  head: React.ReactNode;
  /** The row's name: drawn as the row's header cell. */
  rowHeader?: boolean;
  /** A column of figures: right-aligned, head and cells alike. */
  numeric?: boolean;
  /** Classes of the column's cells only (e.g. "figure", "unit", "whitespace-nowrap"). */
  cellClassName?: string;
};

export type RuledRow = { key: string; cells: React.ReactNode[] };

type RuledTableProps = {
  columns: RuledColumn[];
  rows: RuledRow[];
  /** A workspace table: a focusable region that scrolls sideways on a narrow screen (ScrollTable). None: a sheet's table, printed at its own width. */
  scroll?: { label: string; testId: string };
  /** A sheet's table: its classes beside `sheet-table` (its width, "max-w-2xl"). */
  className?: string;
};

/**
 * The small ruled table that the sheet's design-in sections and the review's diff sections share: a head
 * row, then one row per entry with the row's name as its header cell. One markup, so a sheet's table and
 * the review's table of the same entries read alike.
 */
export function RuledTable({ columns, rows, scroll, className }: RuledTableProps) {
  const body = (
    <>
      <thead>
        <tr>
          {columns.map((column, i) => (
            <th key={i} scope="col" className={column.numeric ? "num" : undefined}>
              {column.head}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.key}>
            {columns.map((column, i) => {
              const cellClass = [column.numeric ? "num" : "", column.cellClassName ?? ""].filter(Boolean).join(" ") || undefined;
              return column.rowHeader ? (
                <th key={i} scope="row" className={cellClass}>
                  {row.cells[i]}
                </th>
              ) : (
                <td key={i} className={cellClass}>
                  {row.cells[i]}
                </td>
              );
            })}
          </tr>
        ))}
      </tbody>
    </>
  );
  if (scroll) {
    return (
      <ScrollTable label={scroll.label} testId={scroll.testId}>
        {body}
      </ScrollTable>
    );
  }
  return <table className={className ? `sheet-table ${className}` : "sheet-table"}>{body}</table>;
}
