import { NoDataNotice } from "./no-data-notice";
import { Notation } from "./notation";
import { SheetHeading } from "./sheet-heading";
import type { SheetModel } from "@/lib/sheet/types";

/** The column heads every specifications table starts with: the web sheet's and the workspace's clickable one. */
export function SpecHeadCells({ columns }: { columns: SheetModel["specifications"]["conditionColumns"] }) {
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

export function SheetSpecTable({ model }: { model: SheetModel }) {
  const { specifications } = model;
  const legend = new Map(specifications.basisLegend.map((b) => [b.mark, b.text]));
  return (
    <section aria-labelledby="sheet-specifications" className="mt-10">
      <SheetHeading id="sheet-specifications">Electrical specifications</SheetHeading>
      {specifications.rows.length === 0 && model.noDataNotice ? (
        <NoDataNotice text={model.noDataNotice} />
      ) : (
      <div className="overflow-x-auto">
        <table className="sheet-table">
          <thead>
            <tr>
              <SpecHeadCells columns={specifications.conditionColumns} />
            </tr>
          </thead>
          <tbody>
            {specifications.rows.map((row) => (
              <tr key={row.groupId}>
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
                <td className="num figure">{row.min.text}</td>
                <td className={`num figure ${row.typIsMeasuredMean ? "text-ink-muted" : ""}`}>{row.typ.text}</td>
                <td className="num figure">{row.max.text}</td>
                <td className="unit whitespace-nowrap">{row.unit}</td>
                <td>
                  <abbr title={legend.get(row.basisMark)} className="no-underline">
                    {row.basisMark}
                  </abbr>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
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
