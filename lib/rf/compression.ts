import { pairSweep } from "./sweep";

export interface CompressionOptions {
  inputPowerDbm: ArrayLike<number>;
  /** Gain (or −conversion loss) at each input step, dB. */
  gainDb: ArrayLike<number>;
  /** How many of the lowest-drive points define the small-signal gain (their mean). */
  smallSignalPointCount?: number;
  /** Compression to find, dB below small-signal gain; 1 for P1dB. */
  compressionDb?: number;
}

export type CompressionPoint =
  | {
      reached: true;
      smallSignalGainDb: number;
      compressionDb: number;
      inputCompressionPointDbm: number;
      /** Output at the compression point: input + small-signal gain − compression. */
      outputCompressionPointDbm: number;
    }
  | {
      reached: false;
      smallSignalGainDb: number;
      compressionDb: number;
      /** Most compression seen in the sweep, dB (can be negative for gain expansion). */
      maxCompressionSeenDb: number;
      /** Highest input of the sweep: the compression point, if any, lies above it. */
      maxInputPowerDbm: number;
      reason: string;
    };

/**
 * Input and output 1 dB compression point from a gain-vs-input sweep. The
 * small-signal gain is the mean of the lowest-drive points; the compression point
 * is interpolated linearly between the two sweep points that straddle
 * (small-signal gain − 1 dB) (Kundert, "Accurate and Rapid Measurement of IP2 and
 * IP3", The Designer's Guide). The first crossing counts.
 */
export function findCompressionPoint(options: CompressionOptions): CompressionPoint {
  const { smallSignalPointCount = 3, compressionDb = 1 } = options;
  const points = pairSweep(options.inputPowerDbm, options.gainDb, "input power");
  if (!(smallSignalPointCount >= 1) || !Number.isInteger(smallSignalPointCount)) {
    throw new RangeError(`Small-signal point count must be a positive integer, got ${smallSignalPointCount}`);
  }
  if (points.length <= smallSignalPointCount) {
    throw new RangeError(
      `A compression sweep needs more than ${smallSignalPointCount} points (the small-signal ones), got ${points.length}`,
    );
  }
  const smallSignal = points.slice(0, smallSignalPointCount);
  const smallSignalGainDb = smallSignal.reduce((sum, p) => sum + p.y, 0) / smallSignal.length;
  const targetGainDb = smallSignalGainDb - compressionDb;

  for (let i = smallSignalPointCount; i < points.length; i++) {
    if (points[i].y <= targetGainDb) {
      const below = points[i - 1];
      const above = points[i];
      const fraction = (below.y - targetGainDb) / (below.y - above.y);
      const inputCompressionPointDbm = below.x + fraction * (above.x - below.x);
      return {
        reached: true,
        smallSignalGainDb,
        compressionDb,
        inputCompressionPointDbm,
        outputCompressionPointDbm: inputCompressionPointDbm + targetGainDb,
      };
    }
  }
  const last = points[points.length - 1];
  return {
    reached: false,
    smallSignalGainDb,
    compressionDb,
    maxCompressionSeenDb: smallSignalGainDb - Math.min(...points.map((p) => p.y)),
    maxInputPowerDbm: last.x,
    reason: `Gain never fell ${compressionDb} dB below its small-signal value up to ${last.x} dBm input`,
  };
}
