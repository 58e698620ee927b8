import type { TwoTone } from "../ingest/types";
import { computeInterceptPoint, fitInterceptPoint, predictThirdOrderProducts } from "../rf";
import { findSmallSignalReference } from "../rf/compression";
import { pairSweep } from "../rf/sweep";
import { addCompressionPoint } from "./compression";
import { errorMessage, makeParameter, makeSeries, roundCondition } from "./curves";
import type { Section } from "./section";
import type { Curve, DeriveOptions, DerivedParameter } from "./types";

/** Tone gain within this of its small-signal value counts as small-signal for the intercept fit. */
const SMALL_SIGNAL_GAIN_TOLERANCE_DB = 0.2;

/**
 * Two-tone intercept (Kundert, "Accurate and Rapid Measurement of IP2 and IP3"):
 * slope-1 and slope-3 lines fitted over the small-signal points, with the free
 * slopes reported, and the single-point figure at the lowest drive as a cross-check.
 */
export function analyzeTwoTone(data: TwoTone, options: DeriveOptions, maxPoints: number): Section {
  const parameters: DerivedParameter[] = [];
  const warnings: string[] = [];
  const input = data.inputPowerPerToneDbm;
  const tone = data.fundamentalOutputDbm;
  const im3 = data.im3OutputDbm;
  const n = input.length;
  const base: Record<string, number> = {};
  if (data.toneSpacingHz !== undefined) base.toneSpacingHz = data.toneSpacingHz;
  if (data.loPowerDbm !== undefined) base.loPowerDbm = data.loPowerDbm;
  // The RF a mixer's intercept is stated at: tone 1 (the product beside it is 2f1 − f2).
  if (data.tone1FrequencyHz !== undefined) base.rfFrequencyHz = data.tone1FrequencyHz;

  const gainDb = tone.map((out, i) => out - input[i]);
  let maxInputPowerDbm = options.twoTone?.maxInputPowerDbm;
  if (maxInputPowerDbm === undefined) {
    // The same small-signal reference as the compression point: the leading steps that agree with the first.
    const { smallSignalGainDb } = findSmallSignalReference(pairSweep(input, gainDb, "input power"), { linearToleranceDb: options.compression?.linearToleranceDb });
    let last = 0;
    while (last + 1 < n && Math.abs(gainDb[last + 1] - smallSignalGainDb) <= SMALL_SIGNAL_GAIN_TOLERANCE_DB) last++;
    maxInputPowerDbm = input[last];
  }

  try {
    const fit = fitInterceptPoint({ inputPowerDbm: input, outputPowerDbm: tone, im3OutputPowerDbm: im3, maxInputPowerDbm });
    const fitConditions = { ...base, method: "slope-fit", maxInputPowerDbm: roundCondition(maxInputPowerDbm) };
    // Unequal tones: the im3 column is the product beside tone 1, so OIP3 = (2·P1 + P2 − P_IM)/2 adds half the level difference.
    const levelCorrectionDb = (data.tone2RelativeLevelDb ?? 0) / 2;
    parameters.push(makeParameter("iip3", fit.iip3Dbm + levelCorrectionDb, fitConditions));
    parameters.push(makeParameter("oip3", fit.oip3Dbm + levelCorrectionDb, fitConditions));
    if (data.tone2RelativeLevelDb !== undefined) addPredictedProducts(data, fit.oip3Dbm + levelCorrectionDb, base, parameters);
    parameters.push(makeParameter("fundamental-slope", fit.fundamentalSlope, fitConditions));
    parameters.push(makeParameter("im3-slope", fit.im3Slope, fitConditions));
    warnings.push(...fit.warnings);
  } catch (error) {
    warnings.push(`Slope-fitted intercept not computed: ${errorMessage(error)}`);
  }

  const levelCorrectionDb = (data.tone2RelativeLevelDb ?? 0) / 2;
  const single = computeInterceptPoint({ inputPowerDbm: input[0], outputPowerDbm: tone[0], im3OutputPowerDbm: im3[0] });
  const singleConditions = { ...base, method: "single-point", inputPowerDbm: roundCondition(input[0]) };
  parameters.push(makeParameter("iip3", single.iip3Dbm + levelCorrectionDb, singleConditions));
  parameters.push(makeParameter("oip3", single.oip3Dbm + levelCorrectionDb, singleConditions));
  for (let i = 0; i < n; i++) {
    parameters.push(makeParameter("delta-im", tone[i] - im3[i], { ...base, inputPowerDbm: roundCondition(input[i]) }));
  }

  addCompressionPoint({ inputPowerDbm: input, gainDb, base: { ...base, method: "two-tone, per tone" }, options, parameters, warnings });

  const decimate = { maxPoints };
  const curves: Curve[] = [
    {
      id: "two-tone-transfer",
      title: "Tone and IM3 output vs input per tone",
      x: { label: "Input per tone", unit: "dBm", scale: "linear" },
      y: { label: "Output", unit: "dBm" },
      series: [makeSeries("tone", input, tone, decimate), makeSeries("IM3", input, im3, decimate)],
    },
  ];
  return { parameters, warnings, curves };
}

/**
 * Both third-order products at every step from the fitted OIP3 and the two tone levels
 * (lib/rf/intermod.ts predictThirdOrderProducts): tone 1 is the measured tone output, tone 2 that
 * plus the file's `# tone2_relative_level:`.
 */
function addPredictedProducts(data: TwoTone, oip3Dbm: number, base: Record<string, number>, parameters: DerivedParameter[]): void {
  const offsetDb = data.tone2RelativeLevelDb ?? 0;
  for (let i = 0; i < data.inputPowerPerToneDbm.length; i++) {
    const tone1OutputDbm = data.fundamentalOutputDbm[i];
    const products = predictThirdOrderProducts({ oip3Dbm, tone1OutputDbm, tone2OutputDbm: tone1OutputDbm + offsetDb });
    const at = { ...base, inputPowerDbm: roundCondition(data.inputPowerPerToneDbm[i]), tone2RelativeLevelDb: offsetDb };
    parameters.push(makeParameter("im3-predicted", products.lowerDbm, { ...at, product: "2f1-f2" }));
    parameters.push(makeParameter("im3-predicted", products.upperDbm, { ...at, product: "2f2-f1" }));
  }
}
