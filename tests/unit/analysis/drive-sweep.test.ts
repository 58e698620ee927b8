import { describe, expect, it } from "vitest";
import { analyzeExample, log10, pick, valueOf } from "./helpers";
import { addCompressionPoint } from "@/lib/analysis/compression";

// fixtures/examples/drive-sweep-doubler.csv: splitter_excess_loss 0.4 dB, cable_loss 0.6 dB, wanted order 2, 1 GHz.
describe("drive sweep of a doubler (drive-sweep-doubler.csv)", () => {
  const result = analyzeExample("drive-sweep-doubler.csv");
  const p = result.parameters;

  it("de-embeds the per-port drive and computes CL at a step", () => {
    // Per-port drive = total − 10·log10(2) − splitter excess − cable loss (common practice):
    const perPortDbm = 14 - 10 * log10(2) - 0.4 - 0.6;
    const step = pick(p, "conversion-loss", { sourcePowerDbm: 14 });
    expect(step.conditions.perPortDriveDbm).toBeCloseTo(perPortDbm, 3);
    // CL = P_in − P_out (Wentworth eq. 10.87); P_in is what reaches both ports: per-port + 3.01 dB = 13.0 dBm; p2_out = 3.47 dBm.
    expect(step.value).toBeCloseTo(perPortDbm + 10 * log10(2) - 3.47, 9);
    expect(step.value).toBeCloseTo(9.53, 9);
    expect(valueOf(p, "conversion-loss", { sourcePowerDbm: -5 })).toBeCloseTo(-5 - 1 - -37.53, 9);
  });

  it("finds the optimum drive by a parabola through the best step and its neighbours", () => {
    // CL at per-port 8.99 / 9.99 / 10.99 dBm: 9.81 / 9.53 / 9.53 dB (rows 13, 14, 15 dBm). Symmetric about 10.49:
    // a = ((9.53 − 9.53) − (9.53 − 9.81)) / (2·1²) = 0.14 dB/dB², vertex = 9.53 − a·0.5² = 9.495 dB.
    const perPort14 = 14 - 10 * log10(2) - 1;
    expect(valueOf(p, "optimum-drive")).toBeCloseTo(perPort14 + 0.5, 6);
    expect(valueOf(p, "conversion-loss", { drive: "optimum" })).toBeCloseTo(9.53 - 0.14 * 0.25, 6);
  });

  it("gives harmonic suppression in dBc at the step nearest the optimum (P_wanted − P_order)", () => {
    // Row at 14 dBm: p1 −22.60, p2 3.47, p3 −26.05, p4 −20.30 (sign convention of lib/rf/harmonics.ts, common practice: positive dBc = below the wanted 2f output).
    expect(valueOf(p, "harmonic-suppression", { order: 1 })).toBeCloseTo(3.47 - -22.6, 9);
    expect(valueOf(p, "harmonic-suppression", { order: 3 })).toBeCloseTo(3.47 - -26.05, 9);
    expect(valueOf(p, "harmonic-suppression", { order: 4 })).toBeCloseTo(3.47 - -20.3, 9);
    expect(p.some((x) => x.name === "harmonic-suppression" && x.conditions.order === 2)).toBe(false);
  });

  it("reports no P1dB, and warns of none: a doubler's conversion gain rises from its lowest-drive value, it was never meant to compress", () => {
    expect(pick(p, "input-p1db").value).toBeNull();
    expect(result.warnings.filter((w) => /compression|linear region/i.test(w))).toEqual([]);
  });

  it("still warns a sweep of the fundamental that never compresses, or starts outside its linear region", () => {
    const flat = { inputPowerDbm: [-10, -5, 0, 5], gainDb: [-6, -6, -6, -6.2], base: {}, options: {} };
    const warned: string[] = [];
    addCompressionPoint({ ...flat, parameters: [], warnings: warned });
    expect(warned.some((w) => w.startsWith("No 1 dB compression in this sweep"))).toBe(true);
    const quiet: string[] = [];
    addCompressionPoint({ ...flat, parameters: [], warnings: quiet, compressionExpected: false });
    expect(quiet).toEqual([]);
  });

  it("uses catalog units and plain-JSON curves", () => {
    expect(pick(p, "optimum-drive").unit).toBe("dBm");
    expect(pick(p, "harmonic-suppression", { order: 1 }).unit).toBe("dBc");
    const curve = result.curves.find((c) => c.id === "conversion-loss-vs-drive")!;
    expect(curve.series[0].points).toHaveLength(26);
    expect(JSON.parse(JSON.stringify(result.curves))).toEqual(result.curves);
  });

  it("honours a different split", () => {
    const single = analyzeExample("drive-sweep-doubler.csv", { driveSweep: { splitWays: 1 } });
    // One way: no 3.01 dB split, so per-port = total − 1 dB; CL unchanged since P_in still excludes the corrections.
    expect(pick(single.parameters, "conversion-loss", { sourcePowerDbm: 14 }).conditions.perPortDriveDbm).toBe(13);
    expect(valueOf(single.parameters, "conversion-loss", { sourcePowerDbm: 14 })).toBeCloseTo(9.53, 9);
  });
});
