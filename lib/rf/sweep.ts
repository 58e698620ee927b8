export interface SweepPoint {
  x: number;
  y: number;
}

/** Pairs two sweep arrays, drops non-finite pairs, sorts by x and refuses duplicate x. */
export function pairSweep(xs: ArrayLike<number>, ys: ArrayLike<number>, xLabel: string): SweepPoint[] {
  if (xs.length !== ys.length) {
    throw new RangeError(`Sweep arrays differ in length: ${xs.length} ${xLabel} values, ${ys.length} readings`);
  }
  const points: SweepPoint[] = [];
  let increasing = true;
  for (let i = 0; i < xs.length; i++) {
    if (!(Number.isFinite(xs[i]) && Number.isFinite(ys[i]))) continue;
    if (points.length > 0 && !(xs[i] > points[points.length - 1].x)) increasing = false;
    points.push({ x: xs[i], y: ys[i] });
  }
  // Parsed sweeps are already strictly increasing (the parser checks it): then there is
  // nothing to sort and no duplicate to find.
  if (increasing) return points;
  points.sort((p, q) => p.x - q.x);
  for (let i = 1; i < points.length; i++) {
    if (points[i].x === points[i - 1].x) throw new RangeError(`Duplicate ${xLabel} step at ${points[i].x}`);
  }
  return points;
}

export interface LineFit {
  slope: number;
  intercept: number;
}

/** Ordinary least-squares line y = slope·x + intercept. */
export function fitLine(points: readonly SweepPoint[]): LineFit {
  if (points.length < 2) throw new RangeError("A line fit needs at least two points");
  const n = points.length;
  const meanX = points.reduce((sum, p) => sum + p.x, 0) / n;
  const meanY = points.reduce((sum, p) => sum + p.y, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (const p of points) {
    sxx += (p.x - meanX) ** 2;
    sxy += (p.x - meanX) * (p.y - meanY);
  }
  if (sxx === 0) throw new RangeError("A line fit needs at least two distinct x values");
  const slope = sxy / sxx;
  return { slope, intercept: meanY - slope * meanX };
}

/** Least-squares intercept of a line whose slope is fixed. */
export function fitLineWithSlope(points: readonly SweepPoint[], slope: number): LineFit {
  if (points.length < 1) throw new RangeError("A line fit needs at least one point");
  const intercept = points.reduce((sum, p) => sum + p.y - slope * p.x, 0) / points.length;
  return { slope, intercept };
}
