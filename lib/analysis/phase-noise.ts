import type { PhaseNoiseTrace } from "../ingest/types";
import { parameterName } from "../domain/parameter-names";
import {
  computeMultiplicationPenaltyDb,
  computeSpotPhaseNoise,
  computeThermalNoiseDensityDbmHz,
  computeThermalPhaseNoiseFloor,
  DECADE_OFFSETS_HZ,
  findSpurs,
  integratePhaseNoise,
  interpolatePhaseNoiseDbcHz,
  noiseBandwidthHz,
  REFERENCE_TEMPERATURE_K,
  spurPowerDbc,
  type SpotPhaseNoise,
} from "../rf";
import { lowerBound } from "../rf/sorted-search";
import { computeMedian } from "../stats";
import { errorMessage, makeParameter, makeSeries, roundCondition } from "./curves";
import type { Section } from "./section";
import type { Curve, DeriveOptions, DerivedParameter } from "./types";
import { formatNumber, formatQuantity } from "../format/quantity";
import { settingSourceWords, type SpurBandwidth } from "../domain/analysis-settings";
import { AnalysisSettingError, describeBand, describeSpurBandwidth, ENGINE_INTEGRATION_BAND_HZ, type ResolvedSetting } from "./settings";

const DEFAULT_SPUR_THRESHOLD_DB = 10;

/**
 * Residual/additive phase noise: spot L(f) per decade, integrated noise and
 * jitter, excess over ideal ×N, far-out floor against kT, discrete spurs
 * (IEEE Std 1139-2008: L(f) = ½·Sφ(f), dBc/Hz).
 */
export function analyzePhaseNoise(data: PhaseNoiseTrace, options: DeriveOptions, maxPoints: number): Section {
  const out: Derivation = { data, settings: options.phaseNoise ?? {}, base: { carrierFrequencyHz: data.carrierFrequencyHz }, parameters: [], warnings: [] };
  const spots = addSpotNoise(out);
  addIntegratedNoise(out);
  addMultiplicationExcess(out, spots);
  addNoiseFloor(out);
  const spurs = addSpurs(out);
  const curves: Curve[] = [
    {
      id: "phase-noise",
      title: `${parameterName("spot-phase-noise")} L(f)`,
      x: { label: "Offset", unit: "Hz", scale: "log" },
      y: { label: "L(f)", unit: "dBc/Hz" },
      series: [makeSeries("L(f)", data.offsetHz, data.lDbcHz, { maxPoints, logX: true, keep: spurs.map((spur) => lowerBound(data.offsetHz, spur.offsetHz)) })],
      markers: spurs.map((spur) => ({ label: "spur", x: spur.offsetHz, y: spur.levelDbcHz })),
    },
  ];
  return { parameters: out.parameters, warnings: out.warnings, curves };
}

interface Derivation {
  data: PhaseNoiseTrace;
  settings: NonNullable<DeriveOptions["phaseNoise"]>;
  base: { carrierFrequencyHz: number };
  parameters: DerivedParameter[];
  warnings: string[];
}

const firstOffsetHz = (data: PhaseNoiseTrace) => data.offsetHz[0];
const lastOffsetHz = (data: PhaseNoiseTrace) => data.offsetHz[data.offsetHz.length - 1];

/**
 * L(f) at each decade offset inside the trace. Each spot and the integral see only the points they
 * need (the parser guarantees increasing offsets), so a 100,000-point trace is not re-sorted for every figure.
 */
function addSpotNoise(out: Derivation): SpotPhaseNoise[] {
  const { data } = out;
  const offsets = data.offsetHz;
  const spots = DECADE_OFFSETS_HZ.filter((f) => f >= firstOffsetHz(data) && f <= lastOffsetHz(data)).map((offsetHz) => {
    const k = Math.min(Math.max(lowerBound(offsets, offsetHz), 1), offsets.length - 1);
    return computeSpotPhaseNoise(sliceTrace(data, k - 1, k + 1), [offsetHz])[0];
  });
  for (const spot of spots) {
    out.parameters.push(makeParameter("spot-phase-noise", spot.phaseNoiseDbcHz, { ...out.base, offsetHz: spot.offsetHz }));
  }
  return spots;
}

/**
 * Integrated phase noise, rms phase and rms jitter over the integration band, each carrying the band
 * and where it came from. A band the engineer stated (file, upload, command line) that reaches outside
 * the trace is refused; a default band (the device class's, or the engine's) is narrowed to the trace
 * and the narrowing is said in a warning.
 */
function addIntegratedNoise(out: Derivation): void {
  const { data, settings } = out;
  const offsets = data.offsetHz;
  const chosen = settings.integrationBand ?? { value: ENGINE_INTEGRATION_BAND_HZ, source: "engine" as const };
  const traceBand = { startHz: firstOffsetHz(data), stopHz: lastOffsetHz(data) };
  let { startHz, stopHz } = chosen.value;
  if (startHz < traceBand.startHz || stopHz > traceBand.stopHz) {
    const stated = chosen.source === "file" || chosen.source === "upload" || chosen.source === "cli";
    const what = `The integration band ${describeBand(chosen.value)} (set by ${settingSourceWords[chosen.source]})`;
    if (stated) {
      throw new AnalysisSettingError(
        "integrationBand",
        `${what} reaches outside the trace, which spans ${describeBand(traceBand)}; state a band within the trace`,
      );
    }
    startHz = Math.max(startHz, traceBand.startHz);
    stopHz = Math.min(stopHz, traceBand.stopHz);
    if (!(stopHz > startHz)) {
      out.warnings.push(`Integrated phase noise not computed: ${what} does not overlap the trace, which spans ${describeBand(traceBand)}`);
      return;
    }
    out.warnings.push(`${what} reaches outside the trace: narrowed to ${describeBand({ startHz, stopHz })}, the part the trace covers`);
  }
  try {
    const from = Math.max(lowerBound(offsets, startHz) - 1, 0);
    const to = Math.min(lowerBound(offsets, stopHz) + 1, offsets.length);
    const integrated = integratePhaseNoise({ trace: sliceTrace(data, from, to), startOffsetHz: startHz, stopOffsetHz: stopHz, carrierFrequencyHz: data.carrierFrequencyHz });
    const band = { ...out.base, startHz, stopHz, bandSource: chosen.source };
    out.parameters.push(makeParameter("integrated-phase-noise", integrated.integratedPhaseNoiseDbc, band));
    out.parameters.push(makeParameter("rms-phase-error", integrated.phaseRmsDeg, band));
    out.parameters.push(makeParameter("rms-jitter", integrated.jitterRmsS * 1e15, band));
  } catch (error) {
    out.warnings.push(`Integrated phase noise not computed: ${errorMessage(error)}`);
  }
}

/** A ×N multiplier's excess over the ideal 20·log10(N) at each spot, when the input's own trace is given. */
function addMultiplicationExcess(out: Derivation, spots: SpotPhaseNoise[]): void {
  const { data, settings } = out;
  const n = data.multiplicationFactor;
  if (n === undefined || n <= 1) return;
  const reference = settings.inputReference ?? (data.inputLDbcHz ? { offsetHz: data.offsetHz, lDbcHz: data.inputLDbcHz } : undefined);
  if (!reference) {
    const penaltyDb = computeMultiplicationPenaltyDb(n);
    out.parameters.push(makeParameter("ideal-multiplication-penalty", penaltyDb, { multiplicationFactor: n }));
    out.warnings.push(
      `No input reference trace: the excess over ideal ×${n} multiplication cannot be derived; an ideal ×${n} adds 20·log10(${n}) = ${formatNumber(penaltyDb, { digits: { decimals: 2 } })} dB`,
    );
    return;
  }
  const referenceTrace = { offsetHz: reference.offsetHz, phaseNoiseDbcHz: reference.lDbcHz };
  const lo = Math.max(firstOffsetHz(data), reference.offsetHz[0]);
  const hi = Math.min(lastOffsetHz(data), reference.offsetHz[reference.offsetHz.length - 1]);
  for (const spot of spots) {
    if (spot.offsetHz < lo || spot.offsetHz > hi) continue;
    const inputDbcHz = interpolatePhaseNoiseDbcHz(referenceTrace, spot.offsetHz);
    out.parameters.push(
      makeParameter("excess-over-ideal-multiplication", spot.phaseNoiseDbcHz - inputDbcHz - computeMultiplicationPenaltyDb(n), {
        ...out.base,
        offsetHz: spot.offsetHz,
        multiplicationFactor: n,
      }),
    );
  }
}

/** The far-out floor (median of the last decade, narrowed to a fifth of the log span on a short trace) and its height above kT. */
function addNoiseFloor(out: Derivation): void {
  const { data, settings } = out;
  const firstHz = firstOffsetHz(data);
  const lastHz = lastOffsetHz(data);
  const floorWidthDecades = Math.min(1, Math.log10(lastHz / firstHz) / 5);
  const floorStartHz = lastHz / 10 ** floorWidthDecades;
  // The offsets increase (the parser checks it): the floor's points are the trace's tail.
  const floorDbcHz = computeMedian(data.lDbcHz.slice(lowerBound(data.offsetHz, floorStartHz)));
  const floorBand = { ...out.base, startHz: floorStartHz, stopHz: lastHz };
  out.parameters.push(makeParameter("noise-floor", floorDbcHz, floorBand));
  if (data.carrierPowerDbm === undefined) {
    out.warnings.push("No carrier power in the file: the noise floor cannot be compared with kT");
    return;
  }
  const temperatureK = settings.referenceTemperatureK ?? REFERENCE_TEMPERATURE_K;
  const thermal = computeThermalPhaseNoiseFloor(data.carrierPowerDbm, temperatureK);
  out.parameters.push(
    makeParameter("noise-floor-above-kt", floorDbcHz - thermal.phaseNoiseDbcHz, {
      ...floorBand,
      carrierPowerDbm: data.carrierPowerDbm,
      temperatureK,
      ktDbmHz: Math.round(computeThermalNoiseDensityDbmHz(temperatureK) * 1000) / 1000,
    }),
  );
}

/**
 * Discrete spurs standing above the local noise by the threshold. With the bandwidth the trace was
 * normalised with (the file's per-offset column, else the setting in force) each is a power in dBc
 * (lib/rf spurPowerDbc), carrying its offset and the bandwidth used, and the worst of them over the
 * offsets searched is the sheet's figure; without one each stays as plotted, in dBc/Hz, and a warning
 * says why no dBc figure is given.
 */
function addSpurs(out: Derivation): ReturnType<typeof findSpurs> {
  const { data, settings } = out;
  const thresholdDb = settings.spurThresholdDb ?? DEFAULT_SPUR_THRESHOLD_DB;
  const spurs = findSpurs({ trace: { offsetHz: data.offsetHz, phaseNoiseDbcHz: data.lDbcHz }, thresholdDb });
  const bandwidthAt = (offsetHz: number): ResolvedSetting<SpurBandwidth> | undefined => {
    const column = data.spurBandwidthColumn;
    if (column) return { value: { kind: column.kind, hz: column.hz[lowerBound(data.offsetHz, offsetHz)] }, source: "file" };
    return settings.spurBandwidth;
  };
  const stated = settings.spurBandwidth;
  if (data.spurBandwidthColumn && stated && stated.source !== "file") {
    out.warnings.push(
      `Analyzer bandwidth: the file's ${data.spurBandwidthColumn.kind}_bandwidth column is used at each offset; ${settingSourceWords[stated.source]}'s ${describeSpurBandwidth(stated.value)} is not`,
    );
  }
  let worstDbc: number | undefined;
  const unconverted: number[] = [];
  for (const spur of spurs) {
    const bandwidth = bandwidthAt(spur.offsetHz);
    if (!bandwidth) {
      out.parameters.push(makeParameter("spur", spur.levelDbcHz, { ...out.base, offsetHz: spur.offsetHz }));
      unconverted.push(spur.offsetHz);
      continue;
    }
    const enbwHz = noiseBandwidthHz(bandwidth.value);
    const levelDbc = spurPowerDbc(spur.levelDbcHz, enbwHz);
    worstDbc = worstDbc === undefined ? levelDbc : Math.max(worstDbc, levelDbc);
    out.parameters.push(
      makeParameter("discrete-spur", levelDbc, {
        ...out.base,
        offsetHz: spur.offsetHz,
        noiseBandwidthHz: roundCondition(enbwHz, 6),
        ...(bandwidth.value.kind === "resolution" ? { resolutionBandwidthHz: bandwidth.value.hz } : {}),
        bandwidthSource: bandwidth.source,
      }),
    );
  }
  if (worstDbc !== undefined) {
    out.parameters.push(makeParameter("worst-discrete-spur", worstDbc, { ...out.base, startHz: firstOffsetHz(data), stopHz: lastOffsetHz(data) }));
  }
  if (unconverted.length > 0) {
    const where = unconverted.map((f) => formatQuantity(f, "Hz", { digits: { maxSignificant: 6 } })).join(", ");
    out.warnings.push(
      `No noise or resolution bandwidth stated: the spur${unconverted.length === 1 ? "" : "s"} at ${where} ${unconverted.length === 1 ? "is" : "are"} given as plotted, in dBc/Hz, not in dBc; ` +
        `state the analyzer's bandwidth (a "# resolution_bandwidth:" or "# noise_bandwidth:" line or column, or the upload's field) for the spur power`,
    );
  }
  return spurs;
}

function sliceTrace(data: PhaseNoiseTrace, from: number, to: number) {
  return { offsetHz: data.offsetHz.slice(from, to), phaseNoiseDbcHz: data.lDbcHz.slice(from, to) };
}
