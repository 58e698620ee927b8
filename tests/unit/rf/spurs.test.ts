import { describe, expect, it } from "vitest";
import { findSpurs } from "@/lib/rf/spurs";
import { mulberry32 } from "@/lib/stats/seeded-random";

// Constructed trace: a −10 dB/decade floor sampled 20 points per decade from 10 Hz to 10 MHz,
// with spurs injected at known offsets.
const offsetHz = Array.from({ length: 121 }, (_, i) => 10 * 10 ** (i / 20));
const floorDbcHz = offsetHz.map((f) => -100 - 10 * Math.log10(f / 10));

describe("discrete spurs", () => {
  it("finds injected spurs above the running-median floor", () => {
    const levels = [...floorDbcHz];
    levels[40] += 25; // 1 kHz
    levels[80] += 15; // 100 kHz
    levels[100] += 6; // 1 MHz: below the 10 dB threshold
    const spurs = findSpurs({ trace: { offsetHz, phaseNoiseDbcHz: levels } });
    expect(spurs.map((s) => Math.round(s.offsetHz))).toEqual([1000, 100000]);
    expect(spurs[0].levelDbcHz).toBeCloseTo(floorDbcHz[40] + 25, 10);
    expect(spurs[0].riseDb).toBeCloseTo(25, 10);
    expect(spurs[1].localFloorDbcHz).toBeCloseTo(floorDbcHz[80], 10);
  });

  it("merges adjacent points of one spur at its peak", () => {
    const levels = [...floorDbcHz];
    levels[60] += 14;
    levels[61] += 20;
    const spurs = findSpurs({ trace: { offsetHz, phaseNoiseDbcHz: levels } });
    expect(spurs.length).toBe(1);
    expect(spurs[0].offsetHz).toBeCloseTo(offsetHz[61], 6);
  });

  it("finds nothing on a clean trace and honours the threshold", () => {
    expect(findSpurs({ trace: { offsetHz, phaseNoiseDbcHz: floorDbcHz } })).toEqual([]);
    const levels = [...floorDbcHz];
    levels[100] += 6;
    expect(findSpurs({ trace: { offsetHz, phaseNoiseDbcHz: levels }, thresholdDb: 5 }).length).toBe(1);
  });
});

/**
 * The definition written out the slow way: for every point, sort the levels of the other points
 * within ±window/2 decades and take the middle (or the mean of the two middles). findSpurs skips
 * the median where the window's lowest level already rules a spur out and selects it (or slides a
 * Fenwick tree) elsewhere; on every trace below it must give exactly these spurs.
 */
function spursByDefinition(offsetHz: number[], levels: number[], thresholdDb: number, windowDecades: number) {
  const half = windowDecades / 2 + 1e-9;
  const logs = offsetHz.map((f) => Math.log10(f));
  const spurs: { offsetHz: number; levelDbcHz: number; localFloorDbcHz: number; riseDb: number }[] = [];
  let current: (typeof spurs)[number] | undefined;
  for (let i = 0; i < levels.length; i++) {
    const inWindow: number[] = [];
    let size = 0;
    for (let j = 0; j < levels.length; j++) {
      if (Math.abs(logs[j] - logs[i]) > half) continue;
      size++;
      if (j !== i) inWindow.push(levels[j]);
    }
    inWindow.sort((a, b) => a - b);
    const m = inWindow.length >> 1;
    const floor = size <= 1 ? levels[i] : inWindow.length % 2 === 1 ? inWindow[m] : (inWindow[m - 1] + inWindow[m]) / 2;
    const riseDb = levels[i] - floor;
    if (riseDb > thresholdDb) {
      const candidate = { offsetHz: offsetHz[i], levelDbcHz: levels[i], localFloorDbcHz: floor, riseDb };
      if (!current || candidate.levelDbcHz > current.levelDbcHz) current = candidate;
    } else if (current) {
      spurs.push(current);
      current = undefined;
    }
  }
  if (current) spurs.push(current);
  return spurs;
}

describe("discrete spurs against the definition", () => {
  // Seeded traces: flat to −60 dB/decade, smooth to 6 dB of noise, levels on a 0.5 dB grid
  // (ties), thresholds down to −1 dB, windows from 0.05 to 4 decades (a 4-decade window makes
  // most points candidates and takes the Fenwick path).
  const random = mulberry32(20261202);
  const cases = Array.from({ length: 120 }, (_, n) => {
    const count = 50 + Math.floor(random() * 600);
    const decades = 1 + random() * 6;
    const slope = [0, -10, -30, -60][n % 4];
    const noiseDb = [0, 0.3, 2, 6][Math.floor(n / 4) % 4];
    const grid = n % 3 === 0;
    const offsetHz = Array.from({ length: count }, (_, i) => 10 * 10 ** ((decades * i) / count));
    const levels = offsetHz.map((f) => {
      const level = -90 + slope * Math.log10(f / 10) + noiseDb * (random() - 0.5) + (random() < 0.01 ? 20 * random() : 0);
      return grid ? Math.round(level * 2) / 2 : level;
    });
    return { offsetHz, levels, thresholdDb: [10, 3, 0, -1][n % 4 === 0 ? 0 : Math.floor(random() * 4)], windowDecades: [0.05, 0.3, 1, 4][Math.floor(random() * 4)] };
  });
  it.each(cases.map((c, n) => [n, c] as const))("trace %i", (_, c) => {
    const found = findSpurs({ trace: { offsetHz: c.offsetHz, phaseNoiseDbcHz: c.levels }, thresholdDb: c.thresholdDb, windowDecades: c.windowDecades });
    expect(found).toEqual(spursByDefinition(c.offsetHz, c.levels, c.thresholdDb, c.windowDecades));
  });
});
