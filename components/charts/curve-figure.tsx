import type { Curve } from "@/lib/analysis/types";
import { LazyCurveChart } from "./lazy-curve-chart";

/** A numbered figure: the chart and its caption, as on a printed sheet. */
export function CurveFigure({ curve, number, thermalFloorDbcHz }: { curve: Curve; number: number; thermalFloorDbcHz?: number }) {
  return (
    <figure className="space-y-2" data-testid="curve-figure" data-curve={curve.id}>
      <figcaption className="text-[0.9375rem]">
        <span className="running-head mr-2">Fig. {number}</span>
        <span className="font-semibold">{curve.title}</span>
      </figcaption>
      <LazyCurveChart curve={curve} thermalFloorDbcHz={thermalFloorDbcHz} />
    </figure>
  );
}
