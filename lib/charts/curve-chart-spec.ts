/**
 * A measurement set's curves as the workspace draws them: the engine's curves (lib/analysis), VSWR
 * beside return loss, the thermal floor on phase noise, through the one spec builder.
 */
import type { Curve, DerivedParameter } from "../analysis/types";
import { buildVegaLiteSpec } from "./build-vega-lite-spec";
import type { ChartFonts } from "./styles";

export interface CurveSpecOptions {
  /** Pixels, or "container" to follow the element's width. */
  width?: number | "container";
  height?: number;
  fonts?: ChartFonts;
  /** The thermal phase-noise floor kT − 3.01 dB − P_carrier, dBc/Hz, drawn on phase-noise plots. */
  thermalFloorDbcHz?: number;
}

/** Return loss (dB) → VSWR: |Γ| = 10^(−RL/20), VSWR = (1+|Γ|)/(1−|Γ|) (Pozar, Microwave Engineering, 4th ed., §2.3). */
export function vswrCurveFromReturnLoss(curve: Curve): Curve {
  const toVswr = (rl: number) => {
    const gamma = 10 ** (-rl / 20);
    return gamma >= 1 ? Number.POSITIVE_INFINITY : (1 + gamma) / (1 - gamma);
  };
  return {
    id: "vswr",
    title: "VSWR vs frequency",
    x: curve.x,
    y: { label: "VSWR", unit: ":1" },
    series: curve.series.map((s) => ({ name: s.name, points: s.points.filter(([, rl]) => rl > 0).map(([x, rl]) => [x, toVswr(rl)] as [number, number]) })),
  };
}

/** The thermal floor on L(f) from the engine's "noise-floor-above-kt" parameter: kT − 10·log10(2) − P_carrier. */
export function thermalFloorFromParameters(parameters: DerivedParameter[]): number | undefined {
  const p = parameters.find((q) => q.name === "noise-floor-above-kt");
  const kt = Number(p?.conditions.ktDbmHz);
  const carrier = Number(p?.conditions.carrierPowerDbm);
  if (!p || !Number.isFinite(kt) || !Number.isFinite(carrier)) return undefined;
  // Half of additive thermal noise appears as PM: L = Sφ/2 (IEEE Std 1139).
  return kt - 10 * Math.log10(2) - carrier;
}

/** Curves to draw for a set: the engine's, plus VSWR beside return loss. */
export function curvesForDisplay(curves: Curve[]): Curve[] {
  const out: Curve[] = [];
  for (const curve of curves) {
    out.push(curve);
    if (curve.id === "return-loss") out.push(vswrCurveFromReturnLoss(curve));
  }
  return out;
}

/** One curve of one measurement set, for the screen: points with tooltips, markers named in the plot. */
export function buildCurveSpec(curve: Curve, options: CurveSpecOptions = {}): Record<string, unknown> {
  const built = buildVegaLiteSpec(
    {
      title: curve.title,
      x: curve.x,
      y: curve.y,
      seriesNames: curve.series.map((s) => s.name),
      traces: curve.series.map((s) => ({ series: s.name, points: s.points })),
      markers: curve.markers,
      rules: options.thermalFloorDbcHz === undefined ? [] : [{ y: options.thermalFloorDbcHz, label: "thermal floor (kT, 290 K)" }],
    },
    { medium: "screen", width: options.width ?? "container", height: options.height ?? 260, fonts: options.fonts, points: "auto" },
  );
  // A curve with nothing finite to draw still gets a valid, empty chart.
  return built?.vegaLite ?? { $schema: "https://vega.github.io/schema/vega-lite/v6.json", description: `${curve.title}: no data.`, data: { values: [] }, mark: "line" };
}
