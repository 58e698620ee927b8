import { proseLayout } from "@/lib/sheet/prose-layout";
import { RuledTable } from "@/components/ui/ruled-table";
import type { SheetModel } from "@/lib/sheet/types";
import { Notation } from "./notation";
import { SheetHeading } from "./sheet-heading";
import { SheetProse } from "./sheet-prose";

type ModelProps = { model: SheetModel };

export function SheetRatings({ model }: ModelProps) {
  return (
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
  );
}

export function SheetCautions({ model }: ModelProps) {
  return (
    <section aria-labelledby="sheet-cautions" className="sheet-keep mt-10">
      <SheetHeading id="sheet-cautions">Cautions</SheetHeading>
      <ol className="max-w-prose list-decimal space-y-1 pl-5">
        {model.cautions.map((caution) => (
          <li key={caution}>{caution}</li>
        ))}
      </ol>
    </section>
  );
}

/** The typical-performance charts: server-made SVG where there is one, else the chart's text description. */
export function SheetCharts({ model, chartSvgs }: ModelProps & { chartSvgs: Record<string, string> }) {
  if (model.charts.length === 0) return null;
  return (
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
                className="[&>svg]:h-auto [&>svg]:w-full [&>svg]:max-w-full"
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
  );
}

/** The prose sections after the description and the key features, in the template's order. */
export function SheetLaterProse({ model }: ModelProps) {
  const laterProse = proseLayout(model.prose).later;
  return (
    <>
      {laterProse.map((section) => (
        <section key={section.id} aria-labelledby={`sheet-prose-${section.id}`} className="mt-10">
          <SheetHeading id={`sheet-prose-${section.id}`}>{section.title}</SheetHeading>
          <div className="max-w-prose">
            <SheetProse blocks={section.blocks} />
          </div>
        </section>
      ))}
    </>
  );
}

export function SheetRevisionHistory({ model }: ModelProps) {
  if (model.revisionHistory.length === 0) return null;
  return (
    <section aria-labelledby="sheet-history" className="sheet-keep mt-10">
      <SheetHeading id="sheet-history">Revision history</SheetHeading>
      <RuledTable
        className="max-w-3xl"
        columns={[{ head: "Revision", rowHeader: true }, { head: "Date", cellClassName: "figure whitespace-nowrap" }, { head: "Changes" }]}
        rows={model.revisionHistory.map((entry) => ({ key: `${entry.label}|${entry.date}`, cells: [entry.label, entry.date, <Notation key="summary" text={entry.summary} />] }))}
      />
    </section>
  );
}

/** The build's open issues and the checks that were made, on a sheet that is not released; never printed. */
export function SheetReviewNotes({ model }: ModelProps) {
  const checks = model.reviewChecks ?? [];
  if (model.header.released || (model.issues.length === 0 && checks.length === 0)) return null;
  return (
    <section aria-labelledby="sheet-review-notes" className="sheet-no-print mt-10 border-l-2 border-signal pl-4">
      <h2 id="sheet-review-notes" className="font-semibold">
        Review notes <span className="font-normal text-ink-muted">(not shown on a released sheet)</span>
      </h2>
      {model.issues.length > 0 ? (
        <ul className="mt-2 list-disc space-y-1 pl-5">
          {model.issues.map((issue, i) => (
            <li key={i}>{issue.message}</li>
          ))}
        </ul>
      ) : (
        <p className="mt-2">No open issue.</p>
      )}
      {checks.map((text, i) => (
        <p key={i} className="mt-2 max-w-prose text-sm text-ink-muted" data-testid="review-checks">
          {text}
        </p>
      ))}
    </section>
  );
}
