import { parameterCatalog, type ParameterName } from "./catalog";
import type { CurveSeries, DerivedParameter } from "./types";

export const DEFAULT_MAX_CURVE_POINTS = 2000;

export interface DecimateOptions {
  maxPoints: number;
  /** Bucket in log10(x) (for log-scale axes) instead of x. */
  logX?: boolean;
  /** Indices that must survive (spurs, markers). */
  keep?: readonly number[];
}

/**
 * Min/max decimation: the x range is cut into equal buckets and each keeps its
 * lowest and highest y, so peaks, notches and spurs stay visible; the first and
 * last points and the forced indices always stay.
 */
export function decimateSeries(xs: ArrayLike<number>, ys: ArrayLike<number>, options: DecimateOptions): [number, number][] {
  const n = Math.min(xs.length, ys.length);
  const { maxPoints, logX = false, keep = [] } = options;
  if (n <= maxPoints) {
    const all = new Array<[number, number]>(n);
    for (let i = 0; i < n; i++) all[i] = [xs[i], ys[i]];
    return all;
  }
  const keepIndices = keep.filter((i) => i >= 0 && i < n);
  const bucketCount = Math.max(1, Math.floor((maxPoints - 2 - keepIndices.length) / 2));
  const position = (i: number) => (logX ? Math.log10(xs[i]) : xs[i]);
  const start = position(0);
  const width = (position(n - 1) - start) / bucketCount || 1;
  const chosen = new Uint8Array(n);
  chosen[0] = 1;
  chosen[n - 1] = 1;
  for (const i of keepIndices) chosen[i] = 1;
  let bucket = -1;
  let minIndex = -1;
  let maxIndex = -1;
  const flush = () => {
    if (minIndex >= 0) chosen[minIndex] = 1;
    if (maxIndex >= 0) chosen[maxIndex] = 1;
  };
  for (let i = 0; i < n; i++) {
    const b = Math.min(bucketCount - 1, Math.floor((position(i) - start) / width));
    if (b !== bucket) {
      flush();
      bucket = b;
      minIndex = i;
      maxIndex = i;
    } else {
      if (ys[i] < ys[minIndex]) minIndex = i;
      if (ys[i] > ys[maxIndex]) maxIndex = i;
    }
  }
  flush();
  const points: [number, number][] = [];
  for (let i = 0; i < n; i++) if (chosen[i]) points.push([xs[i], ys[i]]);
  return points;
}

export function makeSeries(
  name: string,
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  options: DecimateOptions,
): CurveSeries {
  return { name, points: decimateSeries(xs, ys, options) };
}

/** A parameter with the catalog's unit, so names and units cannot drift apart. */
export function makeParameter(
  name: ParameterName,
  value: number | null,
  conditions: Record<string, string | number>,
): DerivedParameter {
  return { name, value: value === null || Number.isFinite(value) ? value : null, unit: parameterCatalog[name].unit, conditions };
}

/** Rounds a condition value so float noise (4.589999…) does not split statistics groups. */
export function roundCondition(value: number, decimals = 3): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}

export function errorMessage(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
