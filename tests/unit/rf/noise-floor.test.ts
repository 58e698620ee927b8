import { describe, expect, it } from "vitest";
import {
  BOLTZMANN_J_PER_K,
  computeFloorAboveThermalDb,
  computePhaseNoiseFromMarkerDbcHz,
  computeThermalNoiseDensityDbmHz,
  computeThermalPhaseNoiseFloor,
} from "@/lib/rf/noise-floor";

describe("thermal noise floor", () => {
  it("uses the exact SI Boltzmann constant", () => {
    // SI Brochure, 9th edition (2019): k = 1.380649e-23 J/K exactly.
    expect(BOLTZMANN_J_PER_K).toBe(1.380649e-23);
  });

  // 10·log10(k·T/1 mW): k exact (SI Brochure 9th ed. 2019) [computed] −173.975 dBm/Hz at 290 K, −173.828 at 300 K.
  it.each([
    { temperatureK: 290, densityDbmHz: -173.975 },
    { temperatureK: 300, densityDbmHz: -173.828 },
  ])("kT at $temperatureK K", ({ temperatureK, densityDbmHz }) => {
    expect(computeThermalNoiseDensityDbmHz(temperatureK)).toBeCloseTo(densityDbmHz, 3);
  });

  it("defaults to 290 K, which the trade rounds to −174 dBm/Hz (common practice)", () => {
    expect(computeThermalNoiseDensityDbmHz()).toBeCloseTo(-174, 1);
  });

  it("expresses a measured floor as dB above kT", () => {
    // −165 dBm/Hz measured: 8.975 dB above kT at 290 K [computed].
    expect(computeFloorAboveThermalDb(-165)).toBeCloseTo(8.975, 3);
  });

  it("sets the L(f) floor for a carrier: −174 − P total, −177 − P for the PM half", () => {
    // IEEE Std 1139-2008: L = Sφ/2; thermal noise splits equally into AM and PM (common practice).
    const floor = computeThermalPhaseNoiseFloor(10);
    expect(floor.totalNoiseDbcHz).toBeCloseTo(-183.975, 3);
    expect(floor.phaseNoiseDbcHz).toBeCloseTo(-186.985, 3);
  });

  it("reads L(f) from a noise marker (noise marker − carrier, common practice)", () => {
    expect(computePhaseNoiseFromMarkerDbcHz(-142.5, 3)).toBe(-145.5);
  });
});
