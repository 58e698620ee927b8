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
  const floors = points.map((_, i) => {
    const window: number[] = [];
    for (let j = 0; j < points.length; j++) {
      // The 1e-9 decade slack keeps points exactly on the window edge on both sides despite rounding.
      const inWindow = Math.abs(logOffsets[j] - logOffsets[i]) <= windowDecades / 2 + 1e-9;
      if (j !== i && inWindow) window.push(points[j].phaseNoiseDbcHz);
    }
    return window.length > 0 ? median(window) : points[i].phaseNoiseDbcHz;
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

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}
