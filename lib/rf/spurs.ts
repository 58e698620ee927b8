import { type PhaseNoiseTrace, sortTrace } from "./phase-noise";

export interface FindSpursOptions {
  trace: PhaseNoiseTrace;
  /** A point is a spur when it rises more than this above the local floor, dB. */
  thresholdDb?: number;
  /** Width of the running-median window, decades of offset (centred on each point). */
  windowDecades?: number;
}

/**
 * A discrete spur. Its level is the trace's peak value in dBc/Hz as plotted: a
 * spur is a discrete tone, so its true power in dBc depends on the analyzer's
 * resolution bandwidth, which a trace does not carry. Octavo reports the peak
 * dBc/Hz reading and says so.
 */
export interface Spur {
  offsetHz: number;
  levelDbcHz: number;
  /** Running median of the trace around the spur, dBc/Hz. */
  localFloorDbcHz: number;
  /** levelDbcHz − localFloorDbcHz, dB. */
  riseDb: number;
}

/**
 * Spurs in a phase-noise trace: local peaks more than thresholdDb above the
 * running median of the other points within ±windowDecades/2 of their offset
 * (the point itself is left out so a spur does not raise its own floor). Adjacent
 * points above the threshold count as one spur at the highest of them.
 */
export function findSpurs(options: FindSpursOptions): Spur[] {
  const { thresholdDb = 10, windowDecades = 0.3 } = options;
  if (!(windowDecades > 0)) throw new RangeError(`Window must be positive, got ${windowDecades} decades`);
  const points = sortTrace(options.trace);
  const logOffsets = points.map((p) => Math.log10(p.offsetHz));
  // The 1e-9 decade slack keeps points exactly on the window edge on both sides despite rounding.
  const halfWindow = windowDecades / 2 + 1e-9;
  // The window slides with the offset: a sorted copy of its levels is kept up to date, so each
  // floor costs a binary search and a splice instead of a scan and a sort of the whole trace.
  const window: number[] = [];
  let low = 0;
  let high = -1;
  const floors = points.map((point, i) => {
    while (high + 1 < points.length && logOffsets[high + 1] - logOffsets[i] <= halfWindow) {
      high++;
      window.splice(lowerBound(window, points[high].phaseNoiseDbcHz), 0, points[high].phaseNoiseDbcHz);
    }
    while (logOffsets[i] - logOffsets[low] > halfWindow) {
      window.splice(lowerBound(window, points[low].phaseNoiseDbcHz), 1);
      low++;
    }
    return window.length > 1 ? medianWithout(window, point.phaseNoiseDbcHz) : point.phaseNoiseDbcHz;
  });

  const spurs: Spur[] = [];
  let current: Spur | undefined;
  for (let i = 0; i < points.length; i++) {
    const point = points[i];
    const riseDb = point.phaseNoiseDbcHz - floors[i];
    if (riseDb > thresholdDb) {
      const candidate = {
        offsetHz: point.offsetHz,
        levelDbcHz: point.phaseNoiseDbcHz,
        localFloorDbcHz: floors[i],
        riseDb,
      };
      if (!current) current = candidate;
      else if (candidate.levelDbcHz > current.levelDbcHz) current = candidate;
    } else if (current) {
      spurs.push(current);
      current = undefined;
    }
  }
  if (current) spurs.push(current);
  return spurs;
}

/** Median of a sorted list with one occurrence of `excluded` left out (the point itself). */
function medianWithout(sorted: readonly number[], excluded: number): number {
  const skip = lowerBound(sorted, excluded);
  const count = sorted.length - 1;
  const at = (k: number) => sorted[k < skip ? k : k + 1];
  const middle = count >> 1;
  return count % 2 === 1 ? at(middle) : (at(middle - 1) + at(middle)) / 2;
}

function lowerBound(sorted: readonly number[], value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
