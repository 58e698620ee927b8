import { describe, expect, it } from "vitest";
import {
  convertDbToPowerRatio,
  convertDbToVoltageRatio,
  convertDbmToDbuv,
  convertDbmToMilliwatts,
  convertDbmToVrms,
  convertDbmToWatts,
  convertDbuvToDbm,
  convertMilliwattsToDbm,
  convertPowerRatioToDb,
  convertVoltageRatioToDb,
  convertVrmsToDbm,
  convertWattsToDbm,
} from "@/lib/rf/units";

describe("power and voltage units", () => {
  // Vrms = √(P·Z) and dBµV = dBm + 10·log10(Z·1e-3) + 120: the units' definitions [computed].
  it.each([
    { powerDbm: 0, impedanceOhm: 50, vrms: 0.22361, dbuv: 106.99, digits: 5 },
    // −20 dBm = 0.02236 Vrms = 86.99 dBµV in 50 Ω: a test-equipment maker's published conversion FAQ (from memory).
    { powerDbm: -20, impedanceOhm: 50, vrms: 0.02236, dbuv: 86.99, digits: 5 },
    // 0 dBm = 108.751 dBµV in 75 Ω: [computed].
    { powerDbm: 0, impedanceOhm: 75, vrms: Math.sqrt(0.075), dbuv: 108.751, digits: 3 },
    // LO drive classes in 50 Ω: +7 dBm = 0.5006 V, +13 dBm = 0.9988 V, [computed] (LO drive classes: common practice).
    { powerDbm: 7, impedanceOhm: 50, vrms: 0.5006, dbuv: 113.99, digits: 4 },
    { powerDbm: 13, impedanceOhm: 50, vrms: 0.9988, dbuv: 119.99, digits: 4 },
  ])("$powerDbm dBm in $impedanceOhm Ω", ({ powerDbm, impedanceOhm, vrms, dbuv, digits }) => {
    expect(convertDbmToVrms(powerDbm, impedanceOhm)).toBeCloseTo(vrms, digits);
    expect(convertDbmToDbuv(powerDbm, impedanceOhm)).toBeCloseTo(dbuv, 2);
    expect(convertVrmsToDbm(convertDbmToVrms(powerDbm, impedanceOhm), impedanceOhm)).toBeCloseTo(powerDbm, 12);
    expect(convertDbuvToDbm(convertDbmToDbuv(powerDbm, impedanceOhm), impedanceOhm)).toBeCloseTo(powerDbm, 12);
  });

  it("defaults to 50 Ω", () => {
    expect(convertDbmToVrms(0)).toBe(convertDbmToVrms(0, 50));
    expect(convertDbmToDbuv(0)).toBe(convertDbmToDbuv(0, 50));
  });

  // Definition of the dBm: 0 dBm = 1 mW, +30 dBm = 1 W.
  it.each([
    { powerDbm: 0, milliwatts: 1, watts: 0.001 },
    { powerDbm: 30, milliwatts: 1000, watts: 1 },
    { powerDbm: -30, milliwatts: 0.001, watts: 1e-6 },
    { powerDbm: 10 * Math.log10(2), milliwatts: 2, watts: 0.002 },
  ])("$powerDbm dBm = $milliwatts mW", ({ powerDbm, milliwatts, watts }) => {
    expect(convertDbmToMilliwatts(powerDbm)).toBeCloseTo(milliwatts, 12);
    expect(convertDbmToWatts(powerDbm)).toBeCloseTo(watts, 14);
    expect(convertMilliwattsToDbm(milliwatts)).toBeCloseTo(powerDbm, 12);
    expect(convertWattsToDbm(watts)).toBeCloseTo(powerDbm, 12);
  });

  // Definition of the decibel: 3.0103 dB = ×2 in power, 6.0206 dB = ×2 in voltage.
  it.each([
    { ratioDb: 10 * Math.log10(2), power: 2, voltage: Math.SQRT2 },
    { ratioDb: 20, power: 100, voltage: 10 },
    { ratioDb: -6.0206, power: 0.25, voltage: 0.5 },
  ])("$ratioDb dB", ({ ratioDb, power, voltage }) => {
    expect(convertDbToPowerRatio(ratioDb)).toBeCloseTo(power, 4);
    expect(convertDbToVoltageRatio(ratioDb)).toBeCloseTo(voltage, 4);
    expect(convertPowerRatioToDb(power)).toBeCloseTo(ratioDb, 4);
    expect(convertVoltageRatioToDb(voltage)).toBeCloseTo(ratioDb, 4);
  });

  it("refuses non-positive powers and impedances", () => {
    expect(() => convertMilliwattsToDbm(0)).toThrow(RangeError);
    expect(() => convertPowerRatioToDb(-1)).toThrow(RangeError);
    expect(() => convertDbmToVrms(0, 0)).toThrow(RangeError);
  });
});
