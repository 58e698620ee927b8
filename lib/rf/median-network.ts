/**
 * The median unit of several measured networks of one kind (same port count and reference
 * impedance): at each frequency and for each S(i, j), the median across units of |S| in dB and of
 * the phase unwrapped along frequency. A designer simulates with one typical part; a median is not
 * pulled by one odd unit as a mean would be, and taking magnitude and phase apart keeps a typical
 * phase where complex averaging would shrink |S| wherever the units' phases spread.
 *
 * The grid is the first network's frequencies inside the span all networks cover; another grid is
 * read there by linear interpolation in dB and unwrapped phase (never extrapolated).
 */

export type NetworkInput = {
  portCount: number;
  frequencyHz: ArrayLike<number>;
  /** Entry-major: S(i, j) at every frequency, then the next entry (as lib/ingest's TouchstoneData). */
  sRe: ArrayLike<number>;
  sIm: ArrayLike<number>;
};

export type MedianNetwork = { portCount: number; frequencyHz: number[]; magnitudeDb: Float64Array; phaseDeg: Float64Array };

/** Phase in radians along frequency without jumps of more than π (as numpy.unwrap). */
export function unwrapPhase(phaseRad: ArrayLike<number>): Float64Array {
  const out = new Float64Array(phaseRad.length);
  let offset = 0;
  for (let k = 0; k < phaseRad.length; k++) {
    if (k > 0) {
      const step = phaseRad[k] - phaseRad[k - 1];
      if (step > Math.PI) offset -= 2 * Math.PI * Math.round(step / (2 * Math.PI));
      else if (step < -Math.PI) offset += 2 * Math.PI * Math.round(-step / (2 * Math.PI));
    }
    out[k] = phaseRad[k] + offset;
  }
  return out;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/** Linear interpolation of y(x) at xi, x increasing; xi inside [x0, xn]. */
function interpolate(x: ArrayLike<number>, y: ArrayLike<number>, xi: number): number {
  let lo = 0;
  let hi = x.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (x[mid] <= xi) lo = mid;
    else hi = mid;
  }
  if (x[hi] === x[lo]) return y[lo];
  const t = (xi - x[lo]) / (x[hi] - x[lo]);
  return y[lo] + t * (y[hi] - y[lo]);
}

export function medianNetwork(networks: NetworkInput[]): MedianNetwork {
  if (networks.length === 0) throw new RangeError("No network to take the median of");
  const n = networks[0].portCount;
  if (networks.some((w) => w.portCount !== n)) throw new RangeError("Networks of different port counts cannot be merged");
  const lo = Math.max(...networks.map((w) => w.frequencyHz[0]));
  const hi = Math.min(...networks.map((w) => w.frequencyHz[w.frequencyHz.length - 1]));
  const grid = Array.from(networks[0].frequencyHz).filter((f) => f >= lo && f <= hi);
  if (grid.length === 0) throw new RangeError("The networks share no frequency span");
  const entries = n * n;
  const magnitudeDb = new Float64Array(entries * grid.length);
  const phaseDeg = new Float64Array(entries * grid.length);
  for (let e = 0; e < entries; e++) {
    const perUnit = networks.map((w) => {
      const f = w.frequencyHz.length;
      const db = new Float64Array(f);
      const rad = new Float64Array(f);
      for (let k = 0; k < f; k++) {
        const re = w.sRe[e * f + k];
        const im = w.sIm[e * f + k];
        db[k] = 20 * Math.log10(Math.hypot(re, im));
        rad[k] = Math.atan2(im, re);
      }
      return { f: w.frequencyHz, db, rad: unwrapPhase(rad) };
    });
    // Each unit's unwrapped phase is moved by whole turns to start within π of the first unit's.
    const start = interpolate(perUnit[0].f, perUnit[0].rad, grid[0]);
    const turns = perUnit.map((u) => 2 * Math.PI * Math.round((start - interpolate(u.f, u.rad, grid[0])) / (2 * Math.PI)));
    grid.forEach((fi, k) => {
      magnitudeDb[e * grid.length + k] = median(perUnit.map((u) => interpolate(u.f, u.db, fi)));
      const rad = median(perUnit.map((u, i) => interpolate(u.f, u.rad, fi) + turns[i]));
      // Printed within (−180°, 180°].
      let deg = (rad * 180) / Math.PI;
      deg -= 360 * Math.ceil((deg - 180) / 360);
      phaseDeg[e * grid.length + k] = deg;
    });
  }
  return { portCount: n, frequencyHz: grid, magnitudeDb, phaseDeg };
}
