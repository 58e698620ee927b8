import { fitLine, fitLineWithSlope, pairSweep } from "./sweep";
import { formatNumber } from "../format/quantity";

/**
 * Two-tone third-order intercept (Kundert, "Accurate and Rapid Measurement of IP2
 * and IP3", The Designer's Guide):
 *   ΔIM = P_out,tone − P_IM3, OIP3 = P_out + ΔIM/2, IIP3 = P_in + ΔIM/2.
 * Powers are per tone. For a mixer P_out = P_in − CL, so IIP3 = OIP3 + CL.
 */

export interface InterceptPointOptions {
  /** Input power of one tone, dBm. */
  inputPowerDbm: number;
  /** Output power of one wanted tone, dBm. */
  outputPowerDbm: number;
  /** Output power of one third-order product (2f1 − f2 or 2f2 − f1), dBm. */
  im3OutputPowerDbm: number;
}

export interface InterceptPoint {
  deltaImDb: number;
  oip3Dbm: number;
  iip3Dbm: number;
}

export function computeInterceptPoint(options: InterceptPointOptions): InterceptPoint {
  const { inputPowerDbm, outputPowerDbm, im3OutputPowerDbm } = options;
  const deltaImDb = outputPowerDbm - im3OutputPowerDbm;
  return { deltaImDb, oip3Dbm: outputPowerDbm + deltaImDb / 2, iip3Dbm: inputPowerDbm + deltaImDb / 2 };
}

export interface InterceptFitOptions {
  inputPowerDbm: ArrayLike<number>;
  outputPowerDbm: ArrayLike<number>;
  im3OutputPowerDbm: ArrayLike<number>;
  /** Only points at or below this input are fitted (the small-signal region); all points by default. */
  maxInputPowerDbm?: number;
  /** Warn when a fitted slope differs from 1 (tone) or 3 (IM3) by more than these, dB/dB. */
  fundamentalSlopeTolerance?: number;
  im3SlopeTolerance?: number;
}

export interface InterceptFit {
  /** From lines of fixed slope 1 and 3 fitted by least squares: the reported figures. */
  iip3Dbm: number;
  oip3Dbm: number;
  /** Free least-squares slopes, dB/dB: near 1 and 3 when the data lie in the small-signal region. */
  fundamentalSlope: number;
  im3Slope: number;
  /** Intersection of the two free-slope lines, for comparison; NaN when they are parallel. */
  iip3FreeSlopeDbm: number;
  oip3FreeSlopeDbm: number;
  pointCount: number;
  warnings: string[];
}

/**
 * Slope-fitted intercept over several drive levels. Lines of slope 1 (tone) and
 * 3 (IM3) are fitted by least squares on the small-signal points; they meet at
 * P_in = (b1 − b3)/2. Free slopes are reported with warnings so a reviewer can see
 * whether the data were in the 3:1 region.
 */
export function fitInterceptPoint(options: InterceptFitOptions): InterceptFit {
  const { maxInputPowerDbm = Infinity, fundamentalSlopeTolerance = 0.1, im3SlopeTolerance = 0.3 } = options;
  const tone = pairSweep(options.inputPowerDbm, options.outputPowerDbm, "input power");
  const im3 = pairSweep(options.inputPowerDbm, options.im3OutputPowerDbm, "input power");
  const toneUsed = tone.filter((p) => p.x <= maxInputPowerDbm);
  const im3Used = im3.filter((p) => p.x <= maxInputPowerDbm);
  if (toneUsed.length < 2 || im3Used.length < 2) {
    throw new RangeError(
      `An intercept fit needs at least two small-signal points, got ${Math.min(toneUsed.length, im3Used.length)}`,
    );
  }
  const fixedTone = fitLineWithSlope(toneUsed, 1);
  const fixedIm3 = fitLineWithSlope(im3Used, 3);
  const iip3Dbm = (fixedTone.intercept - fixedIm3.intercept) / 2;

  const freeTone = fitLine(toneUsed);
  const freeIm3 = fitLine(im3Used);
  const iip3FreeSlopeDbm =
    freeIm3.slope === freeTone.slope ? Number.NaN : (freeTone.intercept - freeIm3.intercept) / (freeIm3.slope - freeTone.slope);

  const warnings: string[] = [];
  if (Math.abs(freeTone.slope - 1) > fundamentalSlopeTolerance) {
    warnings.push(`Tone output slope is ${formatSlope(freeTone.slope)} dB/dB, not 1: the fitted points may be compressed`);
  }
  if (Math.abs(freeIm3.slope - 3) > im3SlopeTolerance) {
    warnings.push(
      `IM3 slope is ${formatSlope(freeIm3.slope)} dB/dB, not 3: the points may be compressed or near the noise floor`,
    );
  }
  return {
    iip3Dbm,
    oip3Dbm: iip3Dbm + fixedTone.intercept,
    fundamentalSlope: freeTone.slope,
    im3Slope: freeIm3.slope,
    iip3FreeSlopeDbm,
    oip3FreeSlopeDbm: freeTone.slope * iip3FreeSlopeDbm + freeTone.intercept,
    pointCount: Math.min(toneUsed.length, im3Used.length),
    warnings,
  };
}

function formatSlope(slope: number): string {
  return formatNumber(slope, { digits: { decimals: 2 } });
}


export interface ThirdOrderProductsOptions {
  /** Output third-order intercept, dBm (the equal-tone definition above). */
  oip3Dbm: number;
  /** Output power of the tone at f1 and of the tone at f2, dBm. */
  tone1OutputDbm: number;
  tone2OutputDbm: number;
}

export interface ThirdOrderProducts {
  /** Output power of the product at 2f1 − f2 (beside the f1 tone), dBm. */
  lowerDbm: number;
  /** Output power of the product at 2f2 − f1 (beside the f2 tone), dBm. */
  upperDbm: number;
}

/**
 * Both third-order products of two tones of unequal level, from OIP3:
 *   P(2f1 − f2) = 2·P1 + P2 − 2·OIP3,   P(2f2 − f1) = P1 + 2·P2 − 2·OIP3   (output-referred, dBm).
 * From the memoryless cubic y = a1·x + a3·x³: the product at 2ω1 − ω2 has amplitude (3/4)|a3|·A1²·A2
 * and the one at 2ω2 − ω1 (3/4)|a3|·A1·A2² (Razavi, RF Microelectronics, 2nd ed., §2.2, from memory);
 * with equal tones both reduce to P_IM3 = 3·P − 2·OIP3, i.e. ΔIM = 2·(OIP3 − P) as in Kundert.
 */
export function predictThirdOrderProducts(options: ThirdOrderProductsOptions): ThirdOrderProducts {
  const { oip3Dbm, tone1OutputDbm, tone2OutputDbm } = options;
  return {
    lowerDbm: 2 * tone1OutputDbm + tone2OutputDbm - 2 * oip3Dbm,
    upperDbm: tone1OutputDbm + 2 * tone2OutputDbm - 2 * oip3Dbm,
  };
}

/**
 * OIP3 from one reading of the product beside tone 1 when the tones differ in level: the first
 * formula above solved for OIP3, OIP3 = (2·P1 + P2 − P(2f1 − f2))/2. With P2 = P1 it is Kundert's
 * P_out + ΔIM/2.
 */
export function computeUnequalToneOip3Dbm(options: { tone1OutputDbm: number; tone2OutputDbm: number; lowerProductDbm: number }): number {
  return (2 * options.tone1OutputDbm + options.tone2OutputDbm - options.lowerProductDbm) / 2;
}
