import { describe, expect, it } from "vitest";
import {
  TWO_WAY_SPLIT_LOSS_DB,
  computeConversionGainDb,
  computeConversionLossDb,
  computePerPortDriveDbm,
} from "@/lib/rf/conversion";

describe("conversion loss", () => {
  // CL = P_in − P_out: Wentworth, Applied Electromagnetics (Wiley 2007), eq. 10.87.
  it.each([
    // Doubler worked example computed from CL = P_in − P_out (Wentworth, Applied Electromagnetics, Wiley 2007, eq. 10.87): +10 dBm in, 2f at −3 dBm → 13 dB.
    { inputPowerDbm: 10, outputPowerDbm: -3, lossDb: 13 },
    // A +7 dBm-class mixer: −10 dBm RF, −16.5 dBm IF → 6.5 dB, inside the 4.5–9 dB trade range (common practice).
    { inputPowerDbm: -10, outputPowerDbm: -16.5, lossDb: 6.5 },
  ])("$inputPowerDbm dBm in, $outputPowerDbm dBm out", ({ inputPowerDbm, outputPowerDbm, lossDb }) => {
    expect(computeConversionLossDb(inputPowerDbm, outputPowerDbm)).toBeCloseTo(lossDb, 12);
    expect(computeConversionGainDb(inputPowerDbm, outputPowerDbm)).toBeCloseTo(-lossDb, 12);
  });
});

describe("per-port drive through a split", () => {
  it("uses 10·log10(2) = 3.0103 dB for the ideal two-way split", () => {
    // 10·log10(2) = 3.0103 dB: per-port drive through an ideal two-way split (common practice) [computed].
    expect(TWO_WAY_SPLIT_LOSS_DB).toBeCloseTo(3.0103, 4);
  });

  // total − 3.0103 dB − excess − cable: common practice.
  it.each([
    { totalInputPowerDbm: 16, splitterExcessLossDb: 0, cableLossDb: 0, perPortDbm: 12.9897 },
    { totalInputPowerDbm: 16, splitterExcessLossDb: 0.4, cableLossDb: 0.25, perPortDbm: 12.3397 },
    { totalInputPowerDbm: 10, splitterExcessLossDb: 0.5, cableLossDb: 0, perPortDbm: 6.4897 },
  ])("$totalInputPowerDbm dBm total", ({ totalInputPowerDbm, splitterExcessLossDb, cableLossDb, perPortDbm }) => {
    expect(computePerPortDriveDbm({ totalInputPowerDbm, splitterExcessLossDb, cableLossDb })).toBeCloseTo(perPortDbm, 4);
  });

  it("handles a four-way split: 10·log10(4) = 6.0206 dB", () => {
    expect(computePerPortDriveDbm({ totalInputPowerDbm: 10, splitWays: 4 })).toBeCloseTo(3.9794, 4);
  });

  it("refuses a fractional number of ways", () => {
    expect(() => computePerPortDriveDbm({ totalInputPowerDbm: 10, splitWays: 1.5 })).toThrow(RangeError);
  });
});
