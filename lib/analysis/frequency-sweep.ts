import type { FrequencySweep } from "../ingest/types";
import { parameterName } from "../domain/parameter-names";
import { computeConversionLossDb } from "../rf";
import { summarizeSample } from "../stats";
import { makeParameter, makeSeries } from "./curves";
import type { Section } from "./section";
import type { Curve, DerivedParameter } from "./types";

const ISOLATION_PATHS = [
  { key: "isolationLoRfDb", path: "LO-RF" },
  { key: "isolationLoIfDb", path: "LO-IF" },
  { key: "isolationRfIfDb", path: "RF-IF" },
] as const;

/** Conversion loss min/typ/max and isolation minimum over the swept band (band edges in the conditions). */
export function analyzeFrequencySweep(data: FrequencySweep, maxPoints: number): Section {
  const parameters: DerivedParameter[] = [];
  const warnings: string[] = [];
  const curves: Curve[] = [];
  const f = data.frequencyHz;
  const band: Record<string, number> = { startHz: f[0], stopHz: f[f.length - 1] };
  if (data.loPowerDbm !== undefined) band.loPowerDbm = data.loPowerDbm;
  if (data.ifFrequencyHz !== undefined) band.ifFrequencyHz = data.ifFrequencyHz;
  if (data.loFrequencyHz !== undefined) band.loFrequencyHz = data.loFrequencyHz;
  const decimate = { maxPoints };
  const xAxis = { label: "Frequency", unit: "Hz", scale: "linear" as const };

  let conversionLossDb = data.conversionLossDb;
  if (!conversionLossDb && data.inputPowerDbm && data.outputPowerDbm) {
    const input = data.inputPowerDbm;
    conversionLossDb = data.outputPowerDbm.map((out, i) => computeConversionLossDb(input[i], out));
  }
  if (conversionLossDb) {
    const summary = summarizeSample(conversionLossDb);
    parameters.push(makeParameter("conversion-loss", summary.min, { statistic: "min", ...band }));
    parameters.push(makeParameter("conversion-loss", summary.median, { statistic: "typ", ...band }));
    parameters.push(makeParameter("conversion-loss", summary.max, { statistic: "max", ...band }));
    curves.push({
      id: "conversion-loss-vs-frequency",
      title: "Conversion loss vs frequency",
      x: xAxis,
      y: { label: parameterName("conversion-loss"), unit: "dB" },
      series: [makeSeries("conversion loss", f, conversionLossDb, decimate)],
    });
  } else {
    warnings.push("No conversion-loss column and no input/output pair: conversion loss not derived");
  }

  const isolationSeries = [];
  for (const { key, path } of ISOLATION_PATHS) {
    const values = data[key];
    if (!values) continue;
    parameters.push(makeParameter("isolation", summarizeSample(values).min, { path, statistic: "min", ...band }));
    isolationSeries.push(makeSeries(path, f, values, decimate));
  }
  if (isolationSeries.length > 0) {
    curves.push({
      id: "isolation-vs-frequency",
      title: "Isolation vs frequency",
      x: xAxis,
      y: { label: parameterName("isolation"), unit: "dB" },
      series: isolationSeries,
    });
  }
  return { parameters, warnings, curves };
}
