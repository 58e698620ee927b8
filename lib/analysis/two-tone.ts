import type { TwoTone } from "../ingest/types";
import { computeInterceptPoint, findCompressionPoint, fitInterceptPoint } from "../rf";
import { errorMessage, makeParameter, makeSeries, roundCondition } from "./curves";
import type { Section } from "./section";
import type { Curve, DeriveOptions, DerivedParameter } from "./types";

/** Tone gain within this of its small-signal value counts as small-signal for the intercept fit. */
const SMALL_SIGNAL_GAIN_TOLERANCE_DB = 0.2;
const SMALL_SIGNAL_POINT_COUNT = 3;

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

  const gainDb = tone.map((out, i) => out - input[i]);
  let maxInputPowerDbm = options.twoTone?.maxInputPowerDbm;
  if (maxInputPowerDbm === undefined) {
    const count = Math.min(SMALL_SIGNAL_POINT_COUNT, n);
    const smallSignalGainDb = gainDb.slice(0, count).reduce((sum, g) => sum + g, 0) / count;
    let last = 0;
    while (last + 1 < n && Math.abs(gainDb[last + 1] - smallSignalGainDb) <= SMALL_SIGNAL_GAIN_TOLERANCE_DB) last++;
    maxInputPowerDbm = input[last];
  }

  try {
    const fit = fitInterceptPoint({ inputPowerDbm: input, outputPowerDbm: tone, im3OutputPowerDbm: im3, maxInputPowerDbm });
    const fitConditions = { ...base, method: "slope-fit", maxInputPowerDbm: roundCondition(maxInputPowerDbm) };
    parameters.push(makeParameter("iip3", fit.iip3Dbm, fitConditions));
    parameters.push(makeParameter("oip3", fit.oip3Dbm, fitConditions));
    parameters.push(makeParameter("fundamental-slope", fit.fundamentalSlope, fitConditions));
    parameters.push(makeParameter("im3-slope", fit.im3Slope, fitConditions));
    warnings.push(...fit.warnings);
  } catch (error) {
    warnings.push(`Slope-fitted intercept not computed: ${errorMessage(error)}`);
  }

  const single = computeInterceptPoint({ inputPowerDbm: input[0], outputPowerDbm: tone[0], im3OutputPowerDbm: im3[0] });
  const singleConditions = { ...base, method: "single-point", inputPowerDbm: roundCondition(input[0]) };
  parameters.push(makeParameter("iip3", single.iip3Dbm, singleConditions));
  parameters.push(makeParameter("oip3", single.oip3Dbm, singleConditions));
  for (let i = 0; i < n; i++) {
    parameters.push(makeParameter("delta-im", tone[i] - im3[i], { ...base, inputPowerDbm: roundCondition(input[i]) }));
  }

  if (n > SMALL_SIGNAL_POINT_COUNT) {
    const compression = findCompressionPoint({ inputPowerDbm: input, gainDb, smallSignalPointCount: SMALL_SIGNAL_POINT_COUNT });
    const conditions = { ...base, method: "two-tone, per tone" };
    if (compression.reached) {
      parameters.push(makeParameter("input-p1db", compression.inputCompressionPointDbm, conditions));
      parameters.push(makeParameter("output-p1db", compression.outputCompressionPointDbm, conditions));
    } else {
      parameters.push(makeParameter("input-p1db", null, conditions));
      parameters.push(makeParameter("output-p1db", null, conditions));
      warnings.push(`No 1 dB compression in this sweep: ${compression.reason}`);
    }
  }

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
