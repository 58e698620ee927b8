import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { ScrollTable } from "@/components/ui/scroll-table";
import { Notation } from "@/components/sheet/notation";
import { betterDirectionWords } from "@/lib/catalog/better-direction";
import type { CompareChart, CompareCharts } from "@/lib/catalog/compare-charts";
import { comparePath, type CompareSheetRef } from "@/lib/catalog/compare-selection";
import type { CompareRow, CompareSheet, CompareTable } from "@/lib/catalog/compare-table";
import { SERIES_STYLES } from "@/lib/charts/styles";
import { formatDate } from "@/lib/format";

export type CompareViewProps =
  | { issues: string[] }
  | {
      issues?: undefined;
      table: CompareTable;
      charts: CompareCharts;
      /** Server-drawn SVG of each overlay panel, keyed by panel id. */
      chartSvgs: Record<string, string>;
      /** The selection as asked (a revision may be "current") and with letters. */
      selection: CompareSheetRef[];
      lettered: CompareSheetRef[];
      csvHref: string;
    };

const FIELD_WORDS = { min: "Min", typ: "Typ", max: "Max" } as const;
const STANDING_WORDS = { current: "Current", superseded: "↻ Superseded", withdrawn: "⊘ Withdrawn" } as const;

/**
 * Two to four released sheets side by side: who they are (with the line style each keeps on the
 * curves), the specification figures aligned in one table with the better value marked and any
 * difference of conditions said, the typical curves overlaid, and the table as CSV. Drawn on the
 * server; the curves are SVG made from the same specs as everywhere, so the page ships no chart code.
 */
export function CompareView(props: CompareViewProps) {
  return (
    <>
      <PageHeader
        runningHead="Public catalog"
        title="Compare released sheets"
        lead="Figures as each released sheet states them, aligned by parameter and conditions, in one unit per line; the typical curves of every sheet on the same axes."
      />
      {props.issues ? <CompareIssues issues={props.issues} /> : <CompareBody {...props} />}
    </>
  );
}

function CompareIssues({ issues }: { issues: string[] }) {
  return (
    <div className="space-y-6">
      <div className="space-y-2" data-testid="compare-issues">
        {issues.map((issue) => (
          <Notice key={issue} tone="error">
            {issue}
          </Notice>
        ))}
      </div>
      <EmptyState title="Nothing to compare yet" testId="compare-empty">
        <p>
          Tick two to four sheets in the <Link href="/catalog">catalog</Link> and choose <em>Compare selected</em>, or write the address yourself:{" "}
          <code>/compare?sheets=organization/part/revision,…</code> with a revision letter or <code>current</code>.
        </p>
      </EmptyState>
    </div>
  );
}

function CompareBody({ table, charts, chartSvgs, selection, lettered, csvHref }: Exclude<CompareViewProps, { issues: string[] }>) {
  const movable = selection.some((s) => s.revision === "current");
  return (
    <div className="space-y-10">
      <SheetKeys table={table} selection={selection} />
      <div className="flex flex-wrap items-center gap-4">
        <a href={csvHref} download className={buttonClass.secondary} data-testid="compare-csv">
          Download the table (CSV)
        </a>
        <Link href="/catalog" className={buttonClass.quiet}>
          Change the selection in the catalog
        </Link>
        {movable ? (
          <Link href={comparePath(lettered)} className={buttonClass.quiet}>
            This comparison with revision letters (it will not move with a new release)
          </Link>
        ) : null}
      </div>
      <CompareSpecTable table={table} />
      <CompareCurves charts={charts} chartSvgs={chartSvgs} />
    </div>
  );
}

/** The line style a sheet keeps on every overlay (its place in the selection), drawn as the legend draws it. */
function StyleKey({ index }: { index: number }) {
  const style = SERIES_STYLES[index % SERIES_STYLES.length];
  const mark = { cx: 22, cy: 7, fill: style.colour };
  return (
    <svg width="44" height="14" viewBox="0 0 44 14" aria-hidden="true" className="shrink-0">
      <line x1="2" y1="7" x2="42" y2="7" stroke={style.colour} strokeWidth="2" strokeDasharray={style.dash.length ? style.dash.join(" ") : undefined} />
      {style.shape === "circle" ? <circle {...mark} r="3.5" /> : null}
      {style.shape === "square" ? <rect x="18.5" y="3.5" width="7" height="7" fill={style.colour} /> : null}
      {style.shape === "triangle-up" ? <polygon points="22,2.5 26.5,11 17.5,11" fill={style.colour} /> : null}
      {style.shape === "diamond" ? <polygon points="22,2 27,7 22,12 17,7" fill={style.colour} /> : null}
      {style.shape === "cross" ? <path d="M18 3 L26 11 M26 3 L18 11" stroke={style.colour} strokeWidth="2.2" /> : null}
      {style.shape === "triangle-down" ? <polygon points="17.5,3 26.5,3 22,11.5" fill={style.colour} /> : null}
    </svg>
  );
}

function SheetKeys({ table, selection }: { table: CompareTable; selection: CompareSheetRef[] }) {
  return (
    <section aria-labelledby="compare-sheets-title">
      <h2 id="compare-sheets-title" className="mb-3 text-lg font-semibold">
        {table.sheets.length} sheets
      </h2>
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4" data-testid="compare-sheets">
        {table.sheets.map((sheet, i) => (
          <li key={sheet.key} className="border-t-2 border-ink pt-3" data-testid="compare-sheet">
            <p className="flex items-center gap-2">
              <StyleKey index={i} />
              <Link href={sheet.path} className="font-semibold">
                {sheet.label}
              </Link>
            </p>
            <p className="mt-1 text-sm">{sheet.title}</p>
            <p className="mt-1 text-sm text-ink-muted">
              {sheet.organizationName} · {sheet.deviceClassLabel} · released {formatDate(sheet.releasedOn)}
              {sheet.standing !== "current" ? (
                <>
                  {" "}
                  · <span className="font-semibold text-ink">{STANDING_WORDS[sheet.standing]}</span>
                </>
              ) : null}
            </p>
            {table.sheets.length > 2 ? (
              <p className="mt-1 text-sm">
                <Link href={comparePath(selection.filter((_, j) => j !== i))} aria-label={`Remove ${sheet.label} from the comparison`}>
                  Remove
                </Link>
              </p>
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}

function CompareSpecTable({ table }: { table: CompareTable }) {
  const figures = new Map<number, CompareRow[]>();
  for (const row of table.rows) figures.set(row.figure, [...(figures.get(row.figure) ?? []), row]);
  const mismatched = table.rows.some((r) => !r.conditionsMatch);
  return (
    <section aria-labelledby="compare-table-title">
      <h2 id="compare-table-title" className="mb-2 text-lg font-semibold">
        Specifications side by side
      </h2>
      <p className="mb-3 max-w-prose text-sm text-ink-muted" id="compare-table-legend">
        <span className="font-semibold text-ink">✓ Better</span> marks the better value of a line where the parameter has a better side (lower loss, higher suppression or
        isolation, balance nearer zero: common practice); ties are all marked, and a setting such as the optimum drive is never marked. A dash: the sheet states no such figure.
        {mismatched ? " Where the conditions differ, the line says which, and each value is given with its own." : ""}
      </p>
      <ScrollTable label="Specifications of the compared sheets" testId="compare-table">
        <caption className="sr-only">Specifications of {table.sheets.map((s) => s.label).join(", ")}, one line per figure</caption>
        <thead>
          <tr>
            <th scope="col">Parameter</th>
            <th scope="col">Figure</th>
            <th scope="col">Unit</th>
            {table.sheets.map((sheet, i) => (
              <th key={sheet.key} scope="col" className="num">
                <span className="inline-flex items-center gap-1.5">
                  <StyleKey index={i} />
                  {sheet.label}
                </span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {[...figures.values()].flatMap((rows) =>
            rows.map((row, i) => (
              <tr
                key={row.id}
                // A figure's min, typ and max read as one block: a rule above the block, none inside it.
                className={i > 0 ? "[&>*]:border-t-0" : undefined}
                data-testid="compare-row"
                data-field={row.field}
                data-conditions={row.conditionsMatch ? "same" : "differ"}
              >
                <th scope="row" className="align-top">
                  {i === 0 ? <ParameterCell row={row} /> : <span className="sr-only">{row.label}</span>}
                </th>
                <td>{FIELD_WORDS[row.field]}</td>
                <td className="whitespace-nowrap">{row.unit}</td>
                {row.cells.map((cell, j) => (
                  <td key={table.sheets[j].key} className="num" data-testid="compare-cell" data-better={cell?.better ? "true" : undefined}>
                    <CompareCellView cell={cell} row={row} sheet={table.sheets[j]} />
                  </td>
                ))}
              </tr>
            )),
          )}
        </tbody>
      </ScrollTable>
    </section>
  );
}

function ParameterCell({ row }: { row: CompareRow }) {
  return (
    <>
      <span className="font-semibold">
        <Notation text={row.label} />
      </span>{" "}
      <span className="text-ink-muted">
        <Notation text={row.symbol} />
      </span>
      {row.conditionsText ? (
        <span className="block text-sm font-normal text-ink-muted">
          <Notation text={row.conditionsText} />
        </span>
      ) : null}
      {row.direction ? <span className="block text-sm font-normal text-ink-muted">{betterDirectionWords[row.direction]}</span> : null}
      {!row.conditionsMatch ? (
        <span className="mt-1 block text-sm font-semibold text-signal-deep" data-testid="compare-mismatch">
          ≠ Conditions differ: {row.differingConditions.join(", ")}
        </span>
      ) : null}
    </>
  );
}

function CompareCellView({ cell, row, sheet }: { cell: CompareRow["cells"][number]; row: CompareRow; sheet: CompareSheet }) {
  if (!cell) {
    return (
      <>
        <span aria-hidden="true" className="text-ink-muted">
          —
        </span>
        <span className="sr-only">{sheet.label} states no {FIELD_WORDS[row.field].toLowerCase()}</span>
      </>
    );
  }
  return (
    <>
      <span className={`figure whitespace-nowrap ${cell.better ? "font-semibold" : ""}`}>
        {cell.better ? (
          <>
            <span aria-hidden="true">✓ </span>
            <span className="sr-only">Better: </span>
          </>
        ) : null}
        {cell.text}
      </span>
      {cell.stated ? (
        <span className="block text-sm text-ink-muted">
          stated as {cell.stated.text} {cell.stated.unit}
        </span>
      ) : null}
      {!row.conditionsMatch && cell.ownConditionsText ? (
        <span className="block whitespace-nowrap text-sm text-ink-muted">
          <Notation text={cell.ownConditionsText} />
        </span>
      ) : null}
    </>
  );
}

function CompareCurves({ charts, chartSvgs }: { charts: CompareCharts; chartSvgs: Record<string, string> }) {
  return (
    <section aria-labelledby="compare-curves-title">
      <h2 id="compare-curves-title" className="mb-2 text-lg font-semibold">
        Typical curves
      </h2>
      <p className="mb-4 max-w-prose text-sm text-ink-muted">
        Each sheet&apos;s typical curve is the median of its units at each point, read from the released sheet&apos;s own chart; every sheet keeps its colour, dash and point
        shape on every plot.
      </p>
      {charts.charts.length === 0 ? (
        <EmptyState title="No curve in common" testId="compare-no-curves">
          <p>These sheets carry no chart of the same kind, so no curves can be drawn on the same axes. Each sheet&apos;s own page has its charts.</p>
        </EmptyState>
      ) : (
        <div className="space-y-10" data-testid="compare-curves">
          {charts.charts.map((chart) => (
            <CompareChartView key={chart.chartId} chart={chart} chartSvgs={chartSvgs} />
          ))}
        </div>
      )}
      {charts.single.length ? (
        <p className="mt-6 text-sm text-ink-muted" data-testid="compare-single-charts">
          Not compared, as no other sheet has them:{" "}
          {charts.single.map((s, i) => (
            <span key={s.label}>
              {i > 0 ? "; " : ""}
              {s.label}: {s.titles.join(", ")}
            </span>
          ))}
          .
        </p>
      ) : null}
    </section>
  );
}

function CompareChartView({ chart, chartSvgs }: { chart: CompareChart; chartSvgs: Record<string, string> }) {
  const stated = chart.sources.filter((s) => s.drawnAt !== null);
  const missing = chart.sources.filter((s) => s.drawnAt === null);
  const leftOut = chart.panels.flatMap((p) => p.traces.filter((t) => t.leftOut).map((t) => `${t.label} on ${p.title}: ${t.leftOut}`));
  return (
    <section aria-labelledby={`compare-chart-${chart.chartId}`} data-testid="compare-chart">
      <h3 id={`compare-chart-${chart.chartId}`} className="font-semibold">
        {chart.title}
      </h3>
      {chart.conditionsDiffer ? (
        <p className="mt-1 text-sm" data-testid="compare-chart-mismatch">
          <span className="font-semibold text-signal-deep">≠ Drawn under different conditions:</span>{" "}
          {stated.map((s, i) => (
            <span key={s.label}>
              {i > 0 ? "; " : ""}
              {s.label} at {s.drawnAt}
            </span>
          ))}
          .
        </p>
      ) : (
        <p className="mt-1 text-sm text-ink-muted">Every sheet drew it at {stated[0]?.drawnAt}.</p>
      )}
      {missing.length ? <p className="mt-1 text-sm text-ink-muted">{missing.map((s) => s.label).join(", ")}: no such chart on the sheet.</p> : null}
      {leftOut.length ? <p className="mt-1 text-sm text-ink-muted">Left off: {leftOut.join("; ")}.</p> : null}
      <div className="mt-3 grid gap-8 lg:grid-cols-2">
        {chart.panels.map((panel) => (
          <figure key={panel.id} className="min-w-0" data-testid="compare-panel">
            {chart.panels.length > 1 ? <figcaption className="mb-1 text-sm font-semibold">{panel.series}</figcaption> : null}
            {chartSvgs[panel.id] ? (
              <div
                role="img"
                aria-label={panel.description}
                className="[&>svg]:h-auto [&>svg]:max-w-full"
                // Markup made on our server by Vega from lib/charts' spec; Vega escapes the text it writes.
                dangerouslySetInnerHTML={{ __html: chartSvgs[panel.id] }}
              />
            ) : (
              <p className="border border-rule p-4 text-sm text-ink-muted">{panel.description}</p>
            )}
            {panel.coincide ? <p className="mt-1 text-sm text-ink-muted">The curves coincide: each lies under the last one drawn.</p> : null}
          </figure>
        ))}
      </div>
      {chart.unmatched.length ? (
        <p className="mt-2 text-sm text-ink-muted">
          Only one sheet has {chart.unmatched.map((u) => `${u.series} (${u.label})`).join(", ")}: not drawn here.
        </p>
      ) : null}
    </section>
  );
}
