import type { SheetModel } from "@/lib/sheet/types";
import { SheetStatistics, SheetTraceability } from "./sheet-annex";
import { SheetHeading } from "./sheet-heading";
import { SheetPrintStyle } from "./sheet-print-style";
import { SheetProse } from "./sheet-prose";
import { SheetSpecTable } from "./sheet-spec-table";

export interface SheetViewProps {
  model: SheetModel;
  /**
   * Chart SVG markup by chart id, made on the server from the model's own
   * Vega-Lite specs (lib/server/charts/render-chart.ts renderSheetChartSvgs).
   * A chart without markup shows its text description.
   */
  chartSvgs?: Record<string, string>;
}

/** The characterization sheet as a web page; lays out the sheet model and computes nothing. */
export function SheetView({ model, chartSvgs = {} }: SheetViewProps) {
  const { header } = model;
  const proseById = new Map(model.prose.map((section) => [section.id, section]));
  const description = proseById.get("description");
  const features = proseById.get("features");
  const laterProse = model.prose.filter((section) => section.id !== "description" && section.id !== "features");
  return (
    <article className="sheet-view mx-auto max-w-page px-4 py-8 text-ink" aria-labelledby="sheet-title">
      <SheetPrintStyle />
      {header.banner ? (
        <div role="status" className="sheet-banner mb-6 border border-signal bg-signal-wash px-4 py-3">
          <p className="font-semibold tracking-[0.08em] text-signal">{header.banner}</p>
          <p className="text-sm">
            This revision is {header.stateLabel.toLowerCase()}. Figures may change before release; do not design in from this sheet.
          </p>
        </div>
      ) : null}

      <header>
        <p className="running-head">Characterization sheet · {header.deviceClassLabel}</p>
        <h1 id="sheet-title" className="mt-1 text-4xl font-semibold">
          {header.partNumber}
        </h1>
        <p className="mt-1 text-xl">{header.title}</p>
        <p className="mt-2 text-ink-muted">
          {header.organizationName} · <span className="font-semibold text-ink">{header.revisionText}</span> ·{" "}
          <span className={header.released ? "" : "text-signal"}>{header.stateLabel}</span> ·{" "}
          <time dateTime={header.date} className="figure">
            {header.date}
          </time>
        </p>
        {model.keyFacts.length > 0 ? (
          <dl className="mt-6 grid grid-cols-2 gap-4 border-t-[1.5px] border-ink pt-3 sm:grid-cols-4">
            {model.keyFacts.map((fact) => (
              <div key={fact.label}>
                <dt className="text-sm text-ink-muted">{fact.label}</dt>
                <dd className="whitespace-nowrap text-lg">
                  <span className="figure">{fact.value}</span>
                  {fact.unit ? <span className="unit">{`\u00a0${fact.unit}`}</span> : null}
                </dd>
              </div>
            ))}
          </dl>
        ) : null}
      </header>

      <div className="mt-8 grid gap-8 md:grid-cols-5">
        <section aria-labelledby="sheet-description" className="md:col-span-3">
          <SheetHeading id="sheet-description">{description?.title ?? "Description"}</SheetHeading>
          <div className="max-w-prose">{description ? <SheetProse blocks={description.blocks} /> : null}</div>
        </section>
        <section aria-labelledby="sheet-features" className="md:col-span-2">
          <SheetHeading id="sheet-features">{features?.title ?? "Key features"}</SheetHeading>
          {features ? <SheetProse blocks={features.blocks} /> : null}
        </section>
      </div>

      <SheetSpecTable model={model} />

      <section aria-labelledby="sheet-ratings" className="sheet-keep mt-10">
        <SheetHeading id="sheet-ratings">Absolute maximum ratings</SheetHeading>
        <table className="sheet-table max-w-2xl">
          <thead>
            <tr>
              <th scope="col">Rating</th>
              <th scope="col" className="num">
                Value
              </th>
              <th scope="col">Unit</th>
            </tr>
          </thead>
          <tbody>
            {model.absoluteMaximumRatings.map((rating) => (
              <tr key={rating.label}>
                <th scope="row">{rating.label}</th>
                <td className="num figure">{rating.missing ? <span className="text-signal">to be stated</span> : rating.value}</td>
                <td className="unit">{rating.unit}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <section aria-labelledby="sheet-cautions" className="sheet-keep mt-10">
        <SheetHeading id="sheet-cautions">Cautions</SheetHeading>
        <ol className="max-w-prose list-decimal space-y-1 pl-5">
          {model.cautions.map((caution) => (
            <li key={caution}>{caution}</li>
          ))}
        </ol>
      </section>

      {model.charts.length > 0 ? (
        <section aria-labelledby="sheet-charts" className="mt-10">
          <SheetHeading id="sheet-charts">Typical performance</SheetHeading>
          <div className="grid gap-8 lg:grid-cols-2">
            {model.charts.map((chart, i) => (
              <figure key={chart.id} className="min-w-0">
                <figcaption className="mb-1 font-semibold">
                  Figure {i + 1}. {chart.title}
                </figcaption>
                {chartSvgs[chart.id] ? (
                  <div
                    role="img"
                    aria-label={chart.description}
                    className="[&>svg]:h-auto [&>svg]:max-w-full"
                    // Markup made on our server by Vega from the model's own spec; Vega escapes text it writes.
                    dangerouslySetInnerHTML={{ __html: chartSvgs[chart.id] }}
                  />
                ) : (
                  <p className="border border-rule p-4 text-sm text-ink-muted">{chart.description}</p>
                )}
                <p className="mt-1 text-sm text-ink-muted">{chart.caption}</p>
              </figure>
            ))}
          </div>
        </section>
      ) : null}

      {laterProse.map((section) => (
        <section key={section.id} aria-labelledby={`sheet-prose-${section.id}`} className="mt-10">
          <SheetHeading id={`sheet-prose-${section.id}`}>{section.title}</SheetHeading>
          <div className="max-w-prose">
            <SheetProse blocks={section.blocks} />
          </div>
        </section>
      ))}

      <SheetTraceability model={model} />
      <SheetStatistics model={model} />

      {model.revisionHistory.length > 0 ? (
        <section aria-labelledby="sheet-history" className="sheet-keep mt-10">
          <SheetHeading id="sheet-history">Revision history</SheetHeading>
          <table className="sheet-table max-w-3xl">
            <thead>
              <tr>
                <th scope="col">Revision</th>
                <th scope="col">Date</th>
                <th scope="col">Changes</th>
              </tr>
            </thead>
            <tbody>
              {model.revisionHistory.map((entry) => (
                <tr key={`${entry.label}|${entry.date}`}>
                  <th scope="row">{entry.label}</th>
                  <td className="figure whitespace-nowrap">{entry.date}</td>
                  <td>{entry.summary}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}

      {!header.released && model.issues.length > 0 ? (
        <section aria-labelledby="sheet-review-notes" className="sheet-no-print mt-10 border-l-2 border-signal pl-4">
          <h2 id="sheet-review-notes" className="font-semibold">
            Review notes <span className="font-normal text-ink-muted">(not shown on a released sheet)</span>
          </h2>
          <ul className="mt-2 list-disc space-y-1 pl-5">
            {model.issues.map((issue, i) => (
              <li key={i}>{issue.message}</li>
            ))}
          </ul>
        </section>
      ) : null}
    </article>
  );
}
