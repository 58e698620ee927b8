"use client";

import { useMemo } from "react";
import type { Curve } from "@/lib/analysis/types";
import { buildCurveSpec, CHART_FONTS } from "@/lib/charts";
import { usePageChartFonts, VegaView } from "./spec-chart";

export default function CurveChart({ curve, thermalFloorDbcHz }: { curve: Curve; thermalFloorDbcHz?: number }) {
  const fonts = usePageChartFonts();
  const spec = useMemo(
    () => buildCurveSpec(curve, { width: "container", height: 260, fonts: fonts ?? CHART_FONTS, thermalFloorDbcHz }),
    [curve, fonts, thermalFloorDbcHz],
  );
  return <VegaView spec={spec} testId={`chart-${curve.id}`} />;
}
