import { describe, expect, it } from "vitest";
import { findSpurs } from "@/lib/rf/spurs";

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
