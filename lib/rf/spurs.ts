import { type PhaseNoiseTrace, readSortedTrace } from "./phase-noise";
import { medianInPlace } from "../stats/select-kth";
import { lowerBound } from "./sorted-search";

export interface FindSpursOptions {
  trace: PhaseNoiseTrace;
  /** A point is a spur when it rises more than this above the local floor, dB. */
  thresholdDb?: number;
  /** Width of the running-median window, decades of offset (centred on each point). */
  windowDecades?: number;
}

/**
 * A discrete spur as the trace plots it: its peak value in dBc/Hz. A spur is a discrete tone, so
 * its power in dBc depends on the bandwidth the analyzer normalised the trace with
 * (spurPowerDbc below), which the trace alone does not carry.
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
  const { offsetHz: offsets, phaseNoiseDbcHz: levels } = readSortedTrace(options.trace);
  const count = offsets.length;
  const logOffsets = new Float64Array(count);
  for (let i = 0; i < count; i++) logOffsets[i] = Math.log10(offsets[i]);
  // The 1e-9 decade slack keeps points exactly on the window edge on both sides despite rounding.
  const halfWindow = windowDecades / 2 + 1e-9;
  // A point's floor is only needed when the point could be a spur. The median of the other points
  // in the window is never below the window's lowest level, and rounding a difference is monotonic,
  // so a point within thresholdDb of that lowest level (a running minimum, O(1) per step) is no
  // spur and its median is left uncomputed. Only the others (the spurs and their near misses) get
  // the exact median; on a 100,000-point trace that is a handful of points instead of every one.
  const candidates: number[] = [];
  const candidateLow: number[] = [];
  const candidateHigh: number[] = [];
  let candidateWork = 0;
  let widestWindow = 0;
  const minQueue = new Int32Array(count);
  let queueHead = 0;
  let queueTail = 0;
  let low = 0;
  let high = -1;
  for (let i = 0; i < count; i++) {
    while (high + 1 < count && logOffsets[high + 1] - logOffsets[i] <= halfWindow) {
      high++;
      while (queueTail > queueHead && levels[minQueue[queueTail - 1]] >= levels[high]) queueTail--;
      minQueue[queueTail++] = high;
    }
    while (logOffsets[i] - logOffsets[low] > halfWindow) low++;
    while (minQueue[queueHead] < low) queueHead++;
    const size = high - low + 1;
    if (size > 1 ? levels[i] - levels[minQueue[queueHead]] > thresholdDb : 0 > thresholdDb) {
      candidates.push(i);
      candidateLow.push(low);
      candidateHigh.push(high);
      candidateWork += size;
      if (size > widestWindow) widestWindow = size;
    }
  }
  // Every other point's floor is its own level (a rise of 0, no spur), as a one-point window's is.
  const floors = new Float64Array(candidates.length);
  for (let c = 0; c < candidates.length; c++) floors[c] = levels[candidates[c]];
  // Few candidates: select each median from a copy of its window (linear time). Many (a steep or
  // noisy trace): slide a Fenwick tree of the levels across the whole trace (n log n, built once).
  if (candidateWork <= 64 * count) {
    const scratch = new Float64Array(widestWindow);
    for (let c = 0; c < candidates.length; c++) {
      if (candidateHigh[c] > candidateLow[c]) floors[c] = medianWithoutPoint(levels, candidateLow[c], candidateHigh[c], candidates[c], scratch);
    }
  } else {
    const window = new LevelCounts(levels);
    let inLow = 0;
    let inHigh = -1;
    for (let c = 0; c < candidates.length; c++) {
      while (inHigh < candidateHigh[c]) window.add(++inHigh, 1);
      while (inLow < candidateLow[c]) window.add(inLow++, -1);
      if (window.size > 1) floors[c] = window.medianWithout(candidates[c]);
    }
  }

  // Runs of adjacent spur points are one spur: a point that is not a candidate, or a candidate
  // that does not rise enough, ends a run.
  const spurs: Spur[] = [];
  let current: Spur | undefined;
  let previous = -2;
  for (let c = 0; c < candidates.length; c++) {
    const i = candidates[c];
    const riseDb = levels[i] - floors[c];
    if (current && i !== previous + 1) {
      spurs.push(current);
      current = undefined;
    }
    if (riseDb > thresholdDb) {
      const candidate = { offsetHz: offsets[i], levelDbcHz: levels[i], localFloorDbcHz: floors[c], riseDb };
      if (!current) current = candidate;
      else if (candidate.levelDbcHz > current.levelDbcHz) current = candidate;
      previous = i;
    } else if (current) {
      spurs.push(current);
      current = undefined;
    }
  }
  if (current) spurs.push(current);
  return spurs;
}

/**
 * The median of levels[low…high] without point `point` (as LevelCounts.medianWithout gives it:
 * the middle value, or the mean of the two middle values), by selection on a copy in `scratch`.
 */
function medianWithoutPoint(levels: ArrayLike<number>, low: number, high: number, point: number, scratch: Float64Array): number {
  let size = 0;
  for (let j = low; j <= high; j++) if (j !== point) scratch[size++] = levels[j];
  return medianInPlace(scratch, size);
}

/**
 * A multiset of some of a trace's levels (the points in the window), kept as counts per
 * rank in a Fenwick (binary indexed) tree: Fenwick, "A new data structure for cumulative
 * frequency tables", Software: Practice and Experience 24(3), 1994. Equal levels share a rank.
 */
class LevelCounts {
  /** The trace's levels in ascending order; a rank is an index into it. */
  private readonly sortedLevels: Float64Array;
  /** Rank of each trace point's level. */
  private readonly rankOf: Int32Array;
  /** tree[r] (1-based) counts the ranks r − (r & −r) … r − 1. */
  private readonly tree: Int32Array;
  /** Largest power of two ≤ the number of ranks, where the k-th search starts. */
  private readonly topStep: number;
  size = 0;

  constructor(levels: ArrayLike<number>) {
    this.sortedLevels = new Float64Array(levels).sort();
    this.rankOf = new Int32Array(levels.length);
    for (let i = 0; i < levels.length; i++) this.rankOf[i] = lowerBound(this.sortedLevels, levels[i]);
    this.tree = new Int32Array(levels.length + 1);
    let step = 1;
    while (step * 2 <= levels.length) step *= 2;
    this.topStep = step;
  }

  /** Adds (delta 1) or removes (delta −1) the level of trace point `point`. */
  add(point: number, delta: number): void {
    this.size += delta;
    for (let r = this.rankOf[point] + 1; r < this.tree.length; r += r & -r) this.tree[r] += delta;
  }

  /** The k-th lowest level in the window, k counted from 0. */
  kthLowest(k: number): number {
    let rank = 0;
    let remaining = k;
    for (let step = this.topStep; step > 0; step >>= 1) {
      if (rank + step < this.tree.length && this.tree[rank + step] <= remaining) {
        rank += step;
        remaining -= this.tree[rank];
      }
    }
    return this.sortedLevels[rank];
  }

  /** Median of the window with point `point`'s own level left out once (the point itself). */
  medianWithout(point: number): number {
    this.add(point, -1);
    const middle = this.size >> 1;
    const median = this.size % 2 === 1 ? this.kthLowest(middle) : (this.kthLowest(middle - 1) + this.kthLowest(middle)) / 2;
    this.add(point, 1);
    return median;
  }
}

/**
 * Equivalent noise bandwidth of a Gaussian filter over its 3 dB bandwidth: for |H(f)|² = exp(−a·f²)
 * with a·(B₃/2)² = ln 2, ∫|H|² df = √(π/a), so ENBW/B₃ = √π / (2·√ln 2) ≈ 1.0645. Swept and FFT
 * analyzers use near-Gaussian resolution filters whose noise bandwidth is 1.05 to 1.13 times the 3 dB
 * bandwidth (Keysight Application Note 150, Spectrum Analysis Basics, ch. 5, noise-power bandwidth);
 * the ideal Gaussian's factor sits at the low end, so a spur read through it is at most about 0.3 dB low.
 */
export const GAUSSIAN_NOISE_BANDWIDTH_PER_RBW = Math.sqrt(Math.PI) / (2 * Math.sqrt(Math.LN2));

/** The equivalent noise bandwidth a stated bandwidth stands for, Hz: a noise bandwidth as it is, a 3 dB RBW through the Gaussian factor. */
export function noiseBandwidthHz(bandwidth: { kind: "noise" | "resolution"; hz: number }): number {
  return bandwidth.kind === "noise" ? bandwidth.hz : bandwidth.hz * GAUSSIAN_NOISE_BANDWIDTH_PER_RBW;
}

/**
 * A discrete spur's power relative to the carrier, dBc, from its reading on a trace normalised to 1 Hz.
 * The analyzer divides the power in its filter by the filter's noise bandwidth B to print dBc/Hz; a
 * discrete tone passes the filter whole, so its reading is P_spur − 10·log10(B / 1 Hz) and
 * P_spur = L_plotted + 10·log10(B) (Keysight AN 150 ch. 5: a level measured in one bandwidth is moved to
 * another by 10·log(BW₂/BW₁)).
 */
export function spurPowerDbc(levelDbcHz: number, noiseBandwidthHz: number): number {
  if (!(noiseBandwidthHz > 0)) throw new RangeError(`The noise bandwidth must be above 0 Hz, got ${noiseBandwidthHz}`);
  return levelDbcHz + 10 * Math.log10(noiseBandwidthHz);
}
