import type { HTMLAttributes, ReactNode } from "react";
import { NoDataNotice } from "./no-data-notice";
import { Notation } from "./notation";
import { SheetHeading } from "./sheet-heading";
import type { SheetModel, SpecTableRow } from "@/lib/sheet/types";

type Specifications = SheetModel["specifications"];

/**
 * What a caller adds to each row of the specifications table. The web sheet and the PDF add nothing; the
 * engineers' workspace (components/sheets/spec-data-table.tsx) adds its statistics and data buttons.
 */
export interface SpecRowHook {
  /** The heads of the columns `cells` adds after Basis. */
  headCells: ReactNode;
  /** One row's cells after Basis, as many as `headCells`. */
  cells: (row: SpecTableRow) => ReactNode;
  /** Draws a min, typ or max figure the row states (e.g. as a button); the cell itself stays the table's. */
  figure?: (row: SpecTableRow, which: "min" | "typ" | "max") => ReactNode;
  /** Attributes of the row's `<tr>`, such as a data attribute or `aria-current`. */
  rowProps?: (row: SpecTableRow) => HTMLAttributes<HTMLTableRowElement> & { [data: `data-${string}`]: string | undefined };
}

/** The column heads every specifications table starts with. */
function SpecHeadCells({ columns }: { columns: Specifications["conditionColumns"] }) {
  return (
    <>
      <th scope="col">Parameter</th>
      <th scope="col">Symbol</th>
      {columns.map((column) => (
        <th key={column.id} scope="col">
          <Notation text={column.label} />
        </th>
      ))}
      <th scope="col" className="num">
        Min
      </th>
      <th scope="col" className="num">
        Typ
      </th>
      <th scope="col" className="num">
        Max
      </th>
      <th scope="col">Unit</th>
      <th scope="col">Basis</th>
    </>
  );
}

type SpecTableProps = {
  specifications: Specifications;
  /** Added columns, figures and row attributes; without it the table is the sheet's, as published. */
  hook?: SpecRowHook;
  caption?: ReactNode;
  "data-testid"?: string;
};

/** The electrical-specifications table alone: the web sheet's, and with a hook the workspace's. */
export function SpecTable({ specifications, hook, caption, "data-testid": testId }: SpecTableProps) {
  const legend = new Map(specifications.basisLegend.map((b) => [b.mark, b.text]));
  return (
    <table className="sheet-table" data-testid={testId}>
      {caption ? <caption>{caption}</caption> : null}
      <thead>
        <tr>
          <SpecHeadCells columns={specifications.conditionColumns} />
          {hook?.headCells}
        </tr>
      </thead>
      <tbody>
        {specifications.rows.map((row) => {
          const figure = (which: "min" | "typ" | "max") => (row[which].text && hook?.figure ? hook.figure(row, which) : row[which].text);
          return (
            <tr key={row.groupId} {...hook?.rowProps?.(row)}>
              <th scope="row" className="min-w-[9rem]">
                {row.label}
                {row.footnoteMarks.map((mark) => (
                  <sup key={mark} className="ml-0.5 text-ink-muted">
                    <a href={`#sheet-footnote-${mark}`} aria-label={`Footnote ${mark}`}>
                      {mark}
                    </a>
                  </sup>
                ))}
                {!row.supported ? (
                  <span className="ml-1 font-semibold text-signal" title="The data do not support this limit: see the statistics annex">
                    ! <span className="sr-only">limit not supported by the data</span>
                  </span>
                ) : null}
              </th>
              <td className="whitespace-nowrap">
                <Notation text={row.symbol} />
              </td>
              {row.conditions.map((cell, i) => (
                <td key={i} className="figure whitespace-nowrap">
                  {cell}
                </td>
              ))}
              <td className="num figure">{figure("min")}</td>
              <td className={`num figure ${row.typIsMeasuredMean ? "text-ink-muted" : ""}`}>{figure("typ")}</td>
              <td className="num figure">{figure("max")}</td>
              <td className="unit whitespace-nowrap">{row.unit}</td>
              <td>
                <abbr title={legend.get(row.basisMark)} className="no-underline">
                  {row.basisMark}
                </abbr>
              </td>
              {hook?.cells(row)}
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

export function SheetSpecTable({ model }: { model: SheetModel }) {
  const { specifications } = model;
  return (
    <section aria-labelledby="sheet-specifications" className="mt-10">
      <SheetHeading id="sheet-specifications">Electrical specifications</SheetHeading>
      {specifications.rows.length === 0 && model.noDataNotice ? (
        <NoDataNotice text={model.noDataNotice} />
      ) : (
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Electrical specifications, scrolls sideways on narrow screens">
          <SpecTable specifications={specifications} />
        </div>
      )}
      <div className="mt-3 space-y-1 text-sm text-ink-muted">
        {specifications.notes.map((note, i) => (
          <p key={i}>
            <Notation text={note} />
          </p>
        ))}
        <dl className="flex flex-wrap gap-x-5 gap-y-1">
          {specifications.basisLegend.map((entry) => (
            <div key={entry.mark} className="flex gap-1">
              <dt className="font-semibold text-ink">{entry.mark}</dt>
              <dd>{entry.text}</dd>
            </div>
          ))}
        </dl>
        {specifications.footnotes.length > 0 ? (
          <ol className="list-none">
            {specifications.footnotes.map((footnote) => (
              <li key={footnote.mark} id={`sheet-footnote-${footnote.mark}`}>
                <span className="figure">{footnote.mark}.</span> {footnote.text}
              </li>
            ))}
          </ol>
        ) : null}
        {specifications.rows.some((row) => !row.supported) ? (
          <p className="text-signal">! The data do not support this limit: see the statistics annex.</p>
        ) : null}
      </div>
    </section>
  );
}
