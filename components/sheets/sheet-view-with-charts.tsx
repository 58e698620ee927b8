import type { SheetModel } from "@/lib/sheet/types";
import { SheetView } from "@/components/sheet/sheet-view";

/**
 * The web sheet with its charts, once the page's server-side drawing of the model's Vega-Lite
 * specs (a promise, so the sheet streams in behind a Suspense fallback) has finished.
 */
export async function SheetViewWithCharts({ model, chartSvgs }: { model: SheetModel; chartSvgs: Promise<Record<string, string>> }) {
  return <SheetView model={model} chartSvgs={await chartSvgs} />;
}
