import { formatNumber } from "../format/quantity";
import { pairSweep, type SweepPoint } from "./sweep";

/** Leading points whose gain agrees with the first within this are the small-signal reference, dB. */
export const DEFAULT_LINEAR_TOLERANCE_DB = 0.1;

export interface CompressionOptions {
  inputPowerDbm: ArrayLike<number>;
  /** Gain (or −conversion loss) at each input step, dB. */
  gainDb: ArrayLike<number>;
  /**
   * The small-signal reference is the mean gain of the leading points that agree with the first
   * point's gain within this tolerance, dB; 0.1 by default.
   */
  linearToleranceDb?: number;
  /**
   * The engineer's choice: the small-signal gain is the gain at this input (interpolated between
   * steps), and the compression point is looked for above it. Must lie within the sweep.
   */
  referenceInputPowerDbm?: number;
  /** Compression to find, dB below small-signal gain; 1 for P1dB. */
  compressionDb?: number;
  /**
   * Word `nonLinearStart` when the sweep does not start linear (default true). A caller that never
   * shows it (a multiplier's sweep, which has no linear region) skips composing it: two thousand
   * small sweeps spent a tenth of their analysis printing numbers for a message nobody reads.
   */
  describeNonLinearStart?: boolean;
}

/** How the small-signal gain was taken, for the report beside the figure. */
export interface SmallSignalReference {
  smallSignalGainDb: number;
  /** "leading-points": mean of the agreeing leading steps; "stated-drive": the engineer's reference drive. */
  method: "leading-points" | "stated-drive";
  /** Input of the last point of the reference (the stated drive, or the last agreeing leading step), dBm. */
  referenceInputPowerDbm: number;
  /** How many sweep points the reference averages (1 for a stated drive). */
  pointCount: number;
  /** Set when the sweep does not start in its linear region: the second step already disagrees with the first. */
  nonLinearStart?: string;
}

export type CompressionPoint = SmallSignalReference &
  (
    | {
        reached: true;
        compressionDb: number;
        inputCompressionPointDbm: number;
        /** Output at the compression point: input + small-signal gain − compression. */
        outputCompressionPointDbm: number;
      }
    | {
        reached: false;
        compressionDb: number;
        /** Most compression seen in the sweep, dB (can be negative for gain expansion). */
        maxCompressionSeenDb: number;
        /** Highest input of the sweep: the compression point, if any, lies above it. */
        maxInputPowerDbm: number;
        reason: string;
      }
  );

/**
 * Input and output 1 dB compression point from a gain-vs-input sweep: the input at which the
 * gain has fallen 1 dB below its small-signal (linear) value (Pozar, Microwave Engineering,
 * 4th ed., the section on gain compression; Razavi, RF Microelectronics, §2.2: "the input level
 * that causes the small-signal gain to drop by 1 dB"; both from memory). The compression point is
 * interpolated linearly between the two sweep points that straddle (small-signal gain − 1 dB)
 * (Kundert, "Accurate and Rapid Measurement of IP2 and IP3", The Designer's Guide); the first
 * crossing above the reference counts.
 */
export function findCompressionPoint(options: CompressionOptions): CompressionPoint {
  const { compressionDb = 1 } = options;
  const points = pairSweep(options.inputPowerDbm, options.gainDb, "input power");
  if (points.length < 2) throw new RangeError(`A compression sweep needs at least 2 points, got ${points.length}`);
  const reference = findSmallSignalReference(points, options);
  const { smallSignalGainDb } = reference;
  const targetGainDb = smallSignalGainDb - compressionDb;

  let from = points.findIndex((p) => p.x > reference.referenceInputPowerDbm);
  if (from < 1) from = points.length;
  for (let i = from; i < points.length; i++) {
    if (points[i].y <= targetGainDb) {
      const below = points[i - 1];
      const above = points[i];
      const fraction = (below.y - targetGainDb) / (below.y - above.y);
      const inputCompressionPointDbm = below.x + fraction * (above.x - below.x);
      // The reference is this call's own object: completed in place (a spread into a new object
      // was the largest cost of this function over thousands of small sweeps).
      return Object.assign(reference, { reached: true as const, compressionDb, inputCompressionPointDbm, outputCompressionPointDbm: inputCompressionPointDbm + targetGainDb });
    }
  }
  const last = points[points.length - 1];
  let lowestGainDb = Infinity;
  for (const p of points) lowestGainDb = Math.min(lowestGainDb, p.y);
  return Object.assign(reference, {
    reached: false as const,
    compressionDb,
    maxCompressionSeenDb: smallSignalGainDb - lowestGainDb,
    maxInputPowerDbm: last.x,
    reason: `Gain never fell ${compressionDb} dB below its small-signal value up to ${formatNumber(last.x, { digits: { maxDecimals: 2 } })} dBm input`,
  });
}

/**
 * The small-signal gain: at the stated reference drive, else the mean of the leading points whose
 * gain agrees with the first point's within the tolerance. A second point that already disagrees
 * means the sweep does not start in its linear region (it starts compressed, or expanding): the
 * first point alone is the reference, and the result says so.
 */
export function findSmallSignalReference(
  points: readonly SweepPoint[],
  options: Pick<CompressionOptions, "linearToleranceDb" | "referenceInputPowerDbm" | "describeNonLinearStart">,
): SmallSignalReference {
  const { linearToleranceDb = DEFAULT_LINEAR_TOLERANCE_DB, referenceInputPowerDbm } = options;
  if (!(linearToleranceDb > 0)) throw new RangeError(`The linear-region tolerance must be above 0 dB, got ${linearToleranceDb}`);
  const first = points[0];
  const last = points[points.length - 1];
  if (referenceInputPowerDbm !== undefined) {
    if (!(referenceInputPowerDbm >= first.x && referenceInputPowerDbm < last.x)) {
      throw new RangeError(
        `The reference drive ${describeDbm(referenceInputPowerDbm)} lies outside the sweep, which runs from ${describeDbm(first.x)} to ${describeDbm(last.x)} (the reference must lie below the last step)`,
      );
    }
    return { smallSignalGainDb: interpolateGain(points, referenceInputPowerDbm), method: "stated-drive", referenceInputPowerDbm, pointCount: 1 };
  }
  let count = 1;
  let sum = first.y;
  while (count < points.length && Math.abs(points[count].y - first.y) <= linearToleranceDb) sum += points[count++].y;
  const reference: SmallSignalReference = {
    smallSignalGainDb: sum / count,
    method: "leading-points",
    referenceInputPowerDbm: points[count - 1].x,
    pointCount: count,
  };
  if (count === 1 && options.describeNonLinearStart !== false) {
    const stepDb = points[1].y - first.y;
    reference.nonLinearStart =
      `The sweep does not start in its linear region: the gain changes by ${formatNumber(stepDb, { digits: { decimals: 2 }, signed: true })} dB ` +
      `from ${describeDbm(first.x)} to ${describeDbm(points[1].x)} (tolerance ${formatNumber(linearToleranceDb, { digits: { maxDecimals: 2 } })} dB), ` +
      `so the small-signal gain is the first point's alone; start the sweep lower or state a reference drive`;
  }
  return reference;
}

function interpolateGain(points: readonly SweepPoint[], inputDbm: number): number {
  let high = 1;
  while (high < points.length - 1 && points[high].x < inputDbm) high++;
  const low = points[high - 1];
  const fraction = (inputDbm - low.x) / (points[high].x - low.x);
  return low.y + fraction * (points[high].y - low.y);
}

function describeDbm(powerDbm: number): string {
  return `${formatNumber(powerDbm, { digits: { maxDecimals: 2 }, signed: true })} dBm`;
}
