import { pairSweep } from "./sweep";

/**
 * Harmonic suppression, sign convention used throughout Benchfold:
 *   suppressionDbc = P_wanted − P_harmonic
 * so a positive dBc figure means the harmonic lies that many dB BELOW the wanted
 * output (a doubler with 2f at −3 dBm and f at −33 dBm has 30 dBc fundamental
 * suppression). A negative figure means the unwanted order is stronger than the wanted one.
 */
export function computeSuppressionDbc(wantedOutputDbm: number, unwantedOutputDbm: number): number {
  return wantedOutputDbm - unwantedOutputDbm;
}

export interface HarmonicLevel {
  /** Harmonic order relative to the input frequency: 1 = fundamental, 2 = 2f, … */
  order: number;
  outputPowerDbm: number;
}

export interface HarmonicSuppression extends HarmonicLevel {
  /** P_wanted − P_order, positive = below the wanted output. */
  suppressionDbc: number;
}

export interface HarmonicSuppressionOptions {
  levels: readonly HarmonicLevel[];
  /** The order the device is meant to produce, 2 for a doubler. */
  wantedOrder: number;
}

/** Suppression of every order other than the wanted one, sorted by order. */
export function computeHarmonicSuppressions(options: HarmonicSuppressionOptions): HarmonicSuppression[] {
  const { levels, wantedOrder } = options;
  const wanted = levels.filter((level) => level.order === wantedOrder);
  if (wanted.length !== 1) {
    throw new RangeError(`Expected exactly one level for the wanted order ${wantedOrder}, got ${wanted.length}`);
  }
  const wantedOutputDbm = wanted[0].outputPowerDbm;
  return levels
    .filter((level) => level.order !== wantedOrder)
    .sort((a, b) => a.order - b.order)
    .map((level) => ({
      order: level.order,
      outputPowerDbm: level.outputPowerDbm,
      suppressionDbc: computeSuppressionDbc(wantedOutputDbm, level.outputPowerDbm),
    }));
}

export interface OptimumDriveOptions {
  inputPowerDbm: ArrayLike<number>;
  conversionLossDb: ArrayLike<number>;
}

export interface OptimumDrive {
  inputPowerDbm: number;
  conversionLossDb: number;
  /** "parabolic": vertex of the parabola through the best step and its neighbours;
   *  "sweep-step": best measured step (at a sweep end, or the neighbours do not form a minimum). */
  method: "parabolic" | "sweep-step";
  /** True when the best conversion is at the first or last drive step: the optimum may lie outside the sweep. */
  atSweepEnd: boolean;
}

/**
 * Drive level of best conversion (lowest loss). Between sweep steps the optimum is
 * the vertex of the parabola through the best point and its two neighbours
 * (three-point Lagrange fit, valid for uneven steps), kept inside their span.
 */
export function findOptimumDrive(options: OptimumDriveOptions): OptimumDrive {
  const points = pairSweep(options.inputPowerDbm, options.conversionLossDb, "drive");
  if (points.length === 0) throw new RangeError("Optimum drive needs at least one sweep point");
  let best = 0;
  for (let i = 1; i < points.length; i++) if (points[i].y < points[best].y) best = i;
  const atSweepEnd = points.length > 1 && (best === 0 || best === points.length - 1);
  const stepResult: OptimumDrive = {
    inputPowerDbm: points[best].x,
    conversionLossDb: points[best].y,
    method: "sweep-step",
    atSweepEnd,
  };
  if (best === 0 || best === points.length - 1) return stepResult;

  const [p0, p1, p2] = [points[best - 1], points[best], points[best + 1]];
  // Parabola y = a·x² + b·x + c through three points (divided differences).
  const d01 = (p1.y - p0.y) / (p1.x - p0.x);
  const d12 = (p2.y - p1.y) / (p2.x - p1.x);
  const a = (d12 - d01) / (p2.x - p0.x);
  if (!(a > 0)) return stepResult;
  const b = d01 - a * (p0.x + p1.x);
  const c = p0.y - a * p0.x * p0.x - b * p0.x;
  const vertexX = Math.min(p2.x, Math.max(p0.x, -b / (2 * a)));
  return {
    inputPowerDbm: vertexX,
    conversionLossDb: a * vertexX * vertexX + b * vertexX + c,
    method: "parabolic",
    atSweepEnd: false,
  };
}
