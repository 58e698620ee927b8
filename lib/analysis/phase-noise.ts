import type { PhaseNoiseTrace } from "../ingest/types";
import {
  computeMultiplicationPenaltyDb,
  computeSpotPhaseNoise,
  computeThermalNoiseDensityDbmHz,
  computeThermalPhaseNoiseFloor,
  DECADE_OFFSETS_HZ,
  findSpurs,
  integratePhaseNoise,
  interpolatePhaseNoiseDbcHz,
  REFERENCE_TEMPERATURE_K,
} from "../rf";
import { lowerBound } from "../rf/sorted-search";
import { computeMedian } from "../stats";
import { errorMessage, makeParameter, makeSeries } from "./curves";
import type { Section } from "./section";
import type { Curve, DeriveOptions, DerivedParameter } from "./types";

export const DEFAULT_INTEGRATION_START_HZ = 10;
export const DEFAULT_INTEGRATION_STOP_HZ = 1e6;
const DEFAULT_SPUR_THRESHOLD_DB = 10;

/**
 * Residual/additive phase noise: spot L(f) per decade, integrated noise and
 * jitter, excess over ideal ×N, far-out floor against kT, discrete spurs
 * (IEEE Std 1139-2008: L(f) = ½·Sφ(f), dBc/Hz).
 */
export function analyzePhaseNoise(data: PhaseNoiseTrace, options: DeriveOptions, maxPoints: number): Section {
  const parameters: DerivedParameter[] = [];
  const warnings: string[] = [];
  const settings = options.phaseNoise ?? {};
  const trace = { offsetHz: data.offsetHz, phaseNoiseDbcHz: data.lDbcHz };
  const offsets = data.offsetHz;
  const firstHz = offsets[0];
  const lastHz = offsets[offsets.length - 1];
  const base = { carrierFrequencyHz: data.carrierFrequencyHz };

  // Each spot and the integral see only the points they need (the parser guarantees increasing
  // offsets), so a 100,000-point trace is not re-sorted for every figure.
  const spots = DECADE_OFFSETS_HZ.filter((f) => f >= firstHz && f <= lastHz).map((offsetHz) => {
    const k = Math.min(Math.max(lowerBound(offsets, offsetHz), 1), offsets.length - 1);
    return computeSpotPhaseNoise(sliceTrace(data, k - 1, k + 1), [offsetHz])[0];
  });
  for (const spot of spots) {
    parameters.push(makeParameter("spot-phase-noise", spot.phaseNoiseDbcHz, { ...base, offsetHz: spot.offsetHz }));
  }

  const startHz = settings.integrationStartHz ?? Math.max(DEFAULT_INTEGRATION_START_HZ, firstHz);
  const stopHz = settings.integrationStopHz ?? Math.min(DEFAULT_INTEGRATION_STOP_HZ, lastHz);
  try {
    const from = Math.max(lowerBound(offsets, startHz) - 1, 0);
    const to = Math.min(lowerBound(offsets, stopHz) + 1, offsets.length);
    const integrated = integratePhaseNoise({ trace: sliceTrace(data, from, to), startOffsetHz: startHz, stopOffsetHz: stopHz, carrierFrequencyHz: data.carrierFrequencyHz });
    const band = { ...base, startHz, stopHz };
    parameters.push(makeParameter("integrated-phase-noise", integrated.integratedPhaseNoiseDbc, band));
    parameters.push(makeParameter("rms-phase-error", integrated.phaseRmsDeg, band));
    parameters.push(makeParameter("rms-jitter", integrated.jitterRmsS * 1e15, band));
  } catch (error) {
    warnings.push(`Integrated phase noise not computed: ${errorMessage(error)}`);
  }

  const n = data.multiplicationFactor;
  if (n !== undefined && n > 1) {
    const reference = settings.inputReference;
    if (reference) {
      const referenceTrace = { offsetHz: reference.offsetHz, phaseNoiseDbcHz: reference.lDbcHz };
      const lo = Math.max(firstHz, reference.offsetHz[0]);
      const hi = Math.min(lastHz, reference.offsetHz[reference.offsetHz.length - 1]);
      for (const spot of spots) {
        if (spot.offsetHz < lo || spot.offsetHz > hi) continue;
        const inputDbcHz = interpolatePhaseNoiseDbcHz(referenceTrace, spot.offsetHz);
        parameters.push(
          makeParameter("excess-over-ideal-multiplication", spot.phaseNoiseDbcHz - inputDbcHz - computeMultiplicationPenaltyDb(n), {
            ...base,
            offsetHz: spot.offsetHz,
            multiplicationFactor: n,
          }),
        );
      }
    } else {
      const penaltyDb = computeMultiplicationPenaltyDb(n);
      parameters.push(makeParameter("ideal-multiplication-penalty", penaltyDb, { multiplicationFactor: n }));
      warnings.push(
        `No input reference trace: the excess over ideal ×${n} multiplication cannot be derived; an ideal ×${n} adds 20·log10(${n}) = ${penaltyDb.toFixed(2)} dB`,
      );
    }
  }

  // The far-out floor: the last decade of offset, narrowed to a fifth of the log span on a short trace.
  const floorWidthDecades = Math.min(1, Math.log10(lastHz / firstHz) / 5);
  const floorStartHz = lastHz / 10 ** floorWidthDecades;
  const floorValues: number[] = [];
  for (let i = 0; i < offsets.length; i++) if (offsets[i] >= floorStartHz) floorValues.push(data.lDbcHz[i]);
  const floorDbcHz = computeMedian(floorValues);
  const floorBand = { ...base, startHz: floorStartHz, stopHz: lastHz };
  parameters.push(makeParameter("noise-floor", floorDbcHz, floorBand));
  const temperatureK = settings.referenceTemperatureK ?? REFERENCE_TEMPERATURE_K;
  if (data.carrierPowerDbm !== undefined) {
    const thermal = computeThermalPhaseNoiseFloor(data.carrierPowerDbm, temperatureK);
    parameters.push(
      makeParameter("noise-floor-above-kt", floorDbcHz - thermal.phaseNoiseDbcHz, {
        ...floorBand,
        carrierPowerDbm: data.carrierPowerDbm,
        temperatureK,
        ktDbmHz: Math.round(computeThermalNoiseDensityDbmHz(temperatureK) * 1000) / 1000,
      }),
    );
  } else {
    warnings.push("No carrier power in the file: the noise floor cannot be compared with kT");
  }

  const thresholdDb = settings.spurThresholdDb ?? DEFAULT_SPUR_THRESHOLD_DB;
  const spurs = findSpurs({ trace, thresholdDb });
  const spurIndices: number[] = [];
  for (const spur of spurs) {
    parameters.push(makeParameter("spur", spur.levelDbcHz, { ...base, offsetHz: spur.offsetHz }));
    spurIndices.push(lowerBound(offsets, spur.offsetHz));
  }

  const curves: Curve[] = [
    {
      id: "phase-noise",
      title: "Phase noise L(f)",
      x: { label: "Offset", unit: "Hz", scale: "log" },
      y: { label: "L(f)", unit: "dBc/Hz" },
      series: [makeSeries("L(f)", offsets, data.lDbcHz, { maxPoints, logX: true, keep: spurIndices })],
      markers: spurs.map((s) => ({ label: "spur", x: s.offsetHz, y: s.levelDbcHz })),
    },
  ];
  return { parameters, warnings, curves };
}

function sliceTrace(data: PhaseNoiseTrace, from: number, to: number) {
  return { offsetHz: data.offsetHz.slice(from, to), phaseNoiseDbcHz: data.lDbcHz.slice(from, to) };
}
