import type { SheetModel } from "@/lib/sheet/types";
import { SheetView, type SheetViewProps } from "@/components/sheet/sheet-view";

/**
 * The web sheet with its charts, once the page's server-side drawing of the model's Vega-Lite
 * specs (a promise, so the sheet streams in behind a Suspense fallback) has finished.
 */
export async function SheetViewWithCharts({
  model,
  chartSvgs,
  withdrawn,
}: {
  model: SheetModel;
  chartSvgs: Promise<Record<string, string>>;
  withdrawn?: SheetViewProps["withdrawn"];
}) {
  return <SheetView model={model} chartSvgs={await chartSvgs} withdrawn={withdrawn} />;
}
