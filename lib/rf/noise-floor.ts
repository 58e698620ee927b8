/** Boltzmann constant, exact by the 2019 SI definition. */
export const BOLTZMANN_J_PER_K = 1.380649e-23;

/** IEEE reference temperature for noise figure, T0 = 290 K. */
export const REFERENCE_TEMPERATURE_K = 290;

/** Half of the thermal noise is phase modulation, half amplitude: 10·log10(2) dB. */
const PM_SHARE_DB = 10 * Math.log10(2);

/**
 * Available thermal noise density kT in dBm/Hz: 10·log10(k·T / 1 mW).
 * At 290 K this is −173.975 dBm/Hz; the trade rounds it to −174 dBm/Hz (common practice).
 */
export function computeThermalNoiseDensityDbmHz(temperatureK = REFERENCE_TEMPERATURE_K): number {
  if (!(temperatureK > 0)) throw new RangeError(`Temperature must be positive, got ${temperatureK} K`);
  return 10 * Math.log10(BOLTZMANN_J_PER_K * temperatureK * 1000);
}

/** How far a measured noise floor lies above kT, dB (the excess noise of the measurement chain and device). */
export function computeFloorAboveThermalDb(noiseFloorDbmHz: number, temperatureK = REFERENCE_TEMPERATURE_K): number {
  return noiseFloorDbmHz - computeThermalNoiseDensityDbmHz(temperatureK);
}

export interface ThermalPhaseNoiseFloor {
  /** All thermal noise relative to the carrier: kT − P, dBc/Hz (about −174 − P at 290 K). */
  totalNoiseDbcHz: number;
  /**
   * The phase-modulation half only: kT − 3.01 dB − P, dBc/Hz (about −177 − P at 290 K).
   * This is the floor an L(f) trace can reach, since L = Sφ/2 (IEEE Std 1139-2008) and
   * additive thermal noise splits equally into AM and PM (common practice).
   */
  phaseNoiseDbcHz: number;
}

/** The floor kT sets for a carrier of the given power, with no added device noise. */
export function computeThermalPhaseNoiseFloor(
  carrierPowerDbm: number,
  temperatureK = REFERENCE_TEMPERATURE_K,
): ThermalPhaseNoiseFloor {
  const thermalDbmHz = computeThermalNoiseDensityDbmHz(temperatureK);
  return {
    totalNoiseDbcHz: thermalDbmHz - carrierPowerDbm,
    phaseNoiseDbcHz: thermalDbmHz - PM_SHARE_DB - carrierPowerDbm,
  };
}

/** L(f) from an analyzer noise marker: marker (dBm/Hz) − carrier (dBm) (IEEE Std 1139-2008 usage). */
export function computePhaseNoiseFromMarkerDbcHz(markerDbmHz: number, carrierPowerDbm: number): number {
  return markerDbmHz - carrierPowerDbm;
}
