"use client";

import dynamic from "next/dynamic";
import type { Curve } from "@/lib/analysis/types";

// vega + vega-lite + vega-embed weigh ~880 KB: loaded only where a chart is shown, in the browser.
const CurveChart = dynamic(() => import("./curve-chart"), {
  ssr: false,
  loading: () => (
    <div className="flex h-[292px] items-center justify-center border border-dashed border-rule text-sm text-ink-muted" aria-hidden="true">
      Drawing the chart…
    </div>
  ),
});

export function LazyCurveChart({ curve, thermalFloorDbcHz }: { curve: Curve; thermalFloorDbcHz?: number }) {
  return <CurveChart curve={curve} thermalFloorDbcHz={thermalFloorDbcHz} />;
}
