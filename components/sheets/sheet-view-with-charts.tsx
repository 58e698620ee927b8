import type { SheetModel } from "@/lib/sheet/types";
import { renderSheetChartSvgs } from "@/lib/server/pdf/render-chart";
import { SheetView } from "@/components/sheet/sheet-view";

/** The web sheet with its charts drawn on the server from the model's own Vega-Lite specs. */
export async function SheetViewWithCharts({ model }: { model: SheetModel }) {
  const chartSvgs = await renderSheetChartSvgs(model);
  return <SheetView model={model} chartSvgs={chartSvgs} />;
}
