"use client";

import dynamic from "next/dynamic";
import type { ChartMedium } from "@/lib/charts";

// vega + vega-lite + vega-embed weigh ~880 KB: loaded only where a chart is shown, in the browser.
const SpecChart = dynamic(() => import("./spec-chart"), {
  ssr: false,
  loading: () => (
    <div className="flex h-[292px] items-center justify-center border border-dashed border-rule text-sm text-ink-muted" aria-hidden="true">
      Drawing the chart…
    </div>
  ),
});

/** A ready Vega-Lite spec from lib/charts (a review overlay), drawn in the browser only. */
export function LazySpecChart({ spec, medium, testId }: { spec: Record<string, unknown>; medium?: ChartMedium; testId: string }) {
  return <SpecChart spec={spec} medium={medium} testId={testId} />;
}
