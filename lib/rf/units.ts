/**
 * Power, voltage and ratio conversions. dBm is referred to 1 mW; dBµV to 1 µV rms.
 * Vrms = √(P·Z) for a sinusoid into a resistive load Z.
 */

export const DEFAULT_IMPEDANCE_OHM = 50;

export function convertDbmToMilliwatts(powerDbm: number): number {
  return 10 ** (powerDbm / 10);
}

export function convertMilliwattsToDbm(powerMw: number): number {
  if (!(powerMw > 0)) throw new RangeError(`Power must be positive to express in dBm, got ${powerMw} mW`);
  return 10 * Math.log10(powerMw);
}

export function convertDbmToWatts(powerDbm: number): number {
  return convertDbmToMilliwatts(powerDbm) / 1000;
}

export function convertWattsToDbm(powerW: number): number {
  return convertMilliwattsToDbm(powerW * 1000);
}

export function convertDbmToVrms(powerDbm: number, impedanceOhm = DEFAULT_IMPEDANCE_OHM): number {
  assertImpedance(impedanceOhm);
  return Math.sqrt(convertDbmToWatts(powerDbm) * impedanceOhm);
}

export function convertVrmsToDbm(voltageVrms: number, impedanceOhm = DEFAULT_IMPEDANCE_OHM): number {
  assertImpedance(impedanceOhm);
  return convertWattsToDbm((voltageVrms * voltageVrms) / impedanceOhm);
}

/** dBµV = dBm + 10·log10(Z·10⁻³ W) + 120: 1 mW into Z gives √(Z·10⁻³) V. */
export function convertDbmToDbuv(powerDbm: number, impedanceOhm = DEFAULT_IMPEDANCE_OHM): number {
  assertImpedance(impedanceOhm);
  return powerDbm + 10 * Math.log10(impedanceOhm * 1e-3) + 120;
}

export function convertDbuvToDbm(voltageDbuv: number, impedanceOhm = DEFAULT_IMPEDANCE_OHM): number {
  assertImpedance(impedanceOhm);
  return voltageDbuv - 10 * Math.log10(impedanceOhm * 1e-3) - 120;
}

export function convertDbToPowerRatio(ratioDb: number): number {
  return 10 ** (ratioDb / 10);
}

export function convertPowerRatioToDb(powerRatio: number): number {
  if (!(powerRatio > 0)) throw new RangeError(`Power ratio must be positive, got ${powerRatio}`);
  return 10 * Math.log10(powerRatio);
}

export function convertDbToVoltageRatio(ratioDb: number): number {
  return 10 ** (ratioDb / 20);
}

export function convertVoltageRatioToDb(voltageRatio: number): number {
  if (!(voltageRatio > 0)) throw new RangeError(`Voltage ratio must be positive, got ${voltageRatio}`);
  return 20 * Math.log10(voltageRatio);
}

function assertImpedance(impedanceOhm: number): void {
  if (!(impedanceOhm > 0)) throw new RangeError(`Impedance must be positive, got ${impedanceOhm} Ω`);
}
