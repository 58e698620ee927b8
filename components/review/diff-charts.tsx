import { LazySpecChart } from "@/components/charts/lazy-spec-chart";
import type { ChartOverlay, ChartOverlayPanel, SheetDiff } from "@/lib/sheet/diff-types";
import { DiffSection, type DiffHooks } from "./diff-parts";

/**
 * Both revisions' typical curves on shared axes, one plot per chart (per series when a chart has
 * several). The legend tells the revisions apart by line dash and point shape as well as colour.
 */
export function DiffCharts({ diff, hooks }: { diff: SheetDiff; hooks: DiffHooks }) {
  const panels = diff.charts.flatMap((chart) => chart.panels.map((panel) => ({ chart, panel })));
  if (panels.length === 0) return null;
  const changed = panels.filter(({ panel }) => panel.changed).length;
  return (
    <DiffSection id="diff-charts" title="Typical curves" testId="diff-charts">
      <p className="mb-4 max-w-prose text-sm text-ink-muted">
        Each plot draws the typical curve (the median of the units at each point) of {diff.previousLabel ?? "the previous revision"} and of{" "}
        {diff.nextLabel}; the legend tells them apart by line, point shape and colour. {changed} of {panels.length}{" "}
        {panels.length === 1 ? "plot differs" : "plots differ"}.
      </p>
      <div className="grid gap-8 lg:grid-cols-2">
        {panels.map(({ chart, panel }) => (
          <OverlayFigure key={panel.id} chart={chart} panel={panel} diff={diff} hooks={hooks} />
        ))}
      </div>
    </DiffSection>
  );
}

function OverlayFigure({ chart, panel, diff, hooks }: { chart: ChartOverlay; panel: ChartOverlayPanel; diff: SheetDiff; hooks: DiffHooks }) {
  const previousLabel = diff.previousLabel ?? "Previous";
  const presence =
    chart.presence === "previous-only" ? `Only in ${previousLabel}: the chart is not on the ${diff.nextLabel.toLowerCase()}.` : chart.presence === "next-only" ? `New: not in ${previousLabel}.` : null;
  return (
    <figure id={panel.anchorId} className="min-w-0 scroll-mt-24" data-testid="diff-chart" data-changed={panel.changed ? "true" : "false"}>
      <figcaption className="mb-1">
        <span className="font-semibold">{panel.title}</span>
        <span className="block text-sm text-ink-muted">
          {previousLabel}: {units(panel.previousUnitCount)} · {diff.nextLabel}: {units(panel.nextUnitCount)} ·{" "}
          {panel.changed ? "differs" : "same typical curve"}
          {presence ? ` · ${presence}` : ""}
        </span>
        {hooks.anchorActions ? (
          <span className="mt-1 block text-sm">{hooks.anchorActions({ kind: "chart", key: panel.id, anchorId: panel.anchorId, label: panel.title })}</span>
        ) : null}
      </figcaption>
      <div role="img" aria-label={panel.description}>
        <LazySpecChart spec={panel.vegaLite} testId={`diff-chart-${chart.chartId}`} />
      </div>
    </figure>
  );
}

function units(n: number): string {
  return n === 0 ? "none" : `${n} ${n === 1 ? "unit" : "units"}`;
}
