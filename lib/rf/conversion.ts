/** Loss of an ideal two-way power split, 10·log10(2) dB. */
export const TWO_WAY_SPLIT_LOSS_DB = 10 * Math.log10(2);

/** Conversion loss CL = P_in − P_out, positive for a lossy device (Wentworth, Applied Electromagnetics, eq. 10.87). */
export function computeConversionLossDb(inputPowerDbm: number, outputPowerDbm: number): number {
  return inputPowerDbm - outputPowerDbm;
}

/** Conversion gain = P_out − P_in, the negative of conversion loss. */
export function computeConversionGainDb(inputPowerDbm: number, outputPowerDbm: number): number {
  return outputPowerDbm - inputPowerDbm;
}

export interface PerPortDriveOptions {
  totalInputPowerDbm: number;
  /** Splitter or hybrid loss beyond the ideal split, dB (positive). */
  splitterExcessLossDb?: number;
  /** Cable loss between splitter output and device port, dB (positive). */
  cableLossDb?: number;
  /** Number of ways of the split; 2 for a doubler fed on both ports. */
  splitWays?: number;
}

/**
 * Drive reaching each port when one source feeds several ports through a splitter:
 * total − 10·log10(ways) − excess loss − cable loss (common practice de-embedding).
 */
export function computePerPortDriveDbm(options: PerPortDriveOptions): number {
  const { totalInputPowerDbm, splitterExcessLossDb = 0, cableLossDb = 0, splitWays = 2 } = options;
  if (!(splitWays >= 1) || !Number.isInteger(splitWays)) {
    throw new RangeError(`Split ways must be a positive integer, got ${splitWays}`);
  }
  return totalInputPowerDbm - 10 * Math.log10(splitWays) - splitterExcessLossDb - cableLossDb;
}
