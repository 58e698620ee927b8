import type { Metadata } from "next";
import { CompareView } from "@/components/catalog/compare-view";
import { buildCompareCharts } from "@/lib/catalog/compare-charts";
import { compareCsvPath, parseCompareSelection } from "@/lib/catalog/compare-selection";
import { isAppError } from "@/lib/errors";
import { loadComparison } from "@/lib/server/catalog/load-comparison";
import { renderChartSvgs } from "@/lib/server/charts/render-chart";

export const metadata: Metadata = {
  title: "Compare released sheets",
  description: "Two to four released RF datasheets side by side: specifications aligned by parameter and conditions, and their typical curves on the same axes.",
};

type SearchParams = Record<string, string | string[] | undefined>;

/** Overlays are drawn on the server at this width (pixels) and scale down with the column. */
const PANEL_WIDTH = 560;

/**
 * The selection lives in the address (`?sheets=org/part/rev,…`). A selection that cannot be read,
 * of one sheet or of more than four, or naming a sheet that is not released, is said on the page in
 * words that name it; GET /api/v1/compare/csv answers the same with a 4xx.
 */
export default async function ComparePage({ searchParams }: { searchParams: Promise<SearchParams> }) {
  const parsed = parseCompareSelection(await searchParams);
  if (!parsed.ok) return <CompareView issues={parsed.issues.map((i) => i.message)} />;
  let comparison;
  try {
    comparison = await loadComparison(parsed.sheets);
  } catch (error) {
    if (isAppError(error) && (error.code === "not-found" || error.code === "invalid")) return <CompareView issues={[error.message]} />;
    throw error;
  }
  const charts = buildCompareCharts(comparison.models, { width: PANEL_WIDTH });
  const chartSvgs = await renderChartSvgs(charts.charts.flatMap((c) => c.panels));
  return (
    <CompareView
      table={comparison.table}
      charts={charts}
      chartSvgs={chartSvgs}
      selection={parsed.sheets}
      lettered={comparison.lettered}
      csvHref={compareCsvPath(parsed.sheets)}
    />
  );
}
