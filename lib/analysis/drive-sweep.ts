import type { DriveSweep } from "../ingest/types";
import { parameterName } from "../domain/parameter-names";
import { computeConversionLossDb, computePerPortDriveDbm } from "../rf/conversion";
import { computeSuppressionDbc, findOptimumDrive } from "../rf/harmonics";
import { addCompressionPoint } from "./compression";
import { makeParameter as makeParameterImport, makeSeries, roundCondition as roundConditionImport } from "./curves";

// The per-step functions are read into locals once: through tsx (the CLI, the benchmark) an imported
// function is a getter on its module, called again at every step of every sweep.
const makeParameter = makeParameterImport;
const roundCondition = roundConditionImport;
const perPortDrive = computePerPortDriveDbm;
const conversionLoss = computeConversionLossDb;
const suppression = computeSuppressionDbc;
import type { Section } from "./section";
import type { Curve, DeriveOptions, DerivedParameter } from "./types";

/**
 * Drive sweep of a multiplier (or a mixer used as a doubler, both ports fed
 * through a splitter). Per-port drive = source − 10·log10(ways) − splitter excess
 * − cable loss (common practice). Conversion loss refers to the power reaching the
 * device, all ports together: per-port drive + 10·log10(ways).
 */
export function analyzeDriveSweep(data: DriveSweep, options: DeriveOptions, maxPoints: number): Section {
  const parameters: DerivedParameter[] = [];
  const warnings: string[] = [];
  const sweep = deEmbedDrive(data, options.driveSweep?.splitWays ?? 2);
  const n = sweep.perPortDbm.length;

  // Conditions are written out rather than spread from a base object: object spread was the largest
  // cost of this function in profiles (one per drive step, 52,000 in the 2,000-file benchmark).
  for (let i = 0; i < n; i++) {
    parameters.push(
      makeParameter("conversion-loss", sweep.conversionLossDb[i], {
        inputFrequencyHz: data.inputFrequencyHz,
        sourcePowerDbm: roundCondition(data.inputPowerDbm[i]),
        perPortDriveDbm: roundCondition(sweep.perPortDbm[i]),
      }),
    );
  }
  const markers = n >= 1 ? addOptimum(data, sweep, parameters, warnings) : [];
  addCompression(data, sweep, parameters, warnings, options);
  return { parameters, warnings, curves: driveSweepCurves(data, sweep, markers, { maxPoints }) };
}

/** The sweep referred to the device: drive per port and into the device, and the wanted order's conversion loss. */
interface DeEmbeddedSweep {
  perPortDbm: number[];
  deviceInputDbm: number[];
  wanted: DriveSweep["harmonics"][number];
  conversionLossDb: number[];
}

function deEmbedDrive(data: DriveSweep, splitWays: number): DeEmbeddedSweep {
  const splitDb = 10 * Math.log10(splitWays);
  const perPortDbm = data.inputPowerDbm.map((totalInputPowerDbm) =>
    perPortDrive({
      totalInputPowerDbm,
      splitterExcessLossDb: data.splitterExcessLossDb,
      cableLossDb: data.cableLossDb,
      splitWays,
    }),
  );
  const deviceInputDbm = perPortDbm.map((p) => p + splitDb);
  const wanted = data.harmonics.find((h) => h.order === data.wantedOrder);
  if (!wanted) throw new RangeError(`No trace for the wanted order ${data.wantedOrder}`);
  const conversionLossDb = wanted.outputPowerDbm.map((out, i) => conversionLoss(deviceInputDbm[i], out));
  return { perPortDbm, deviceInputDbm, wanted, conversionLossDb };
}

/**
 * The optimum drive (best conversion) and, at the drive step nearest it, the suppression of every
 * unwanted order relative to the wanted one. Returns the optimum as a chart marker.
 */
function addOptimum(data: DriveSweep, sweep: DeEmbeddedSweep, parameters: DerivedParameter[], warnings: string[]): NonNullable<Curve["markers"]> {
  const { perPortDbm, conversionLossDb, wanted } = sweep;
  const optimum = findOptimumDrive({ inputPowerDbm: perPortDbm, conversionLossDb });
  parameters.push(makeParameter("optimum-drive", optimum.inputPowerDbm, { inputFrequencyHz: data.inputFrequencyHz }));
  parameters.push(makeParameter("conversion-loss", optimum.conversionLossDb, { inputFrequencyHz: data.inputFrequencyHz, drive: "optimum" }));
  if (optimum.atSweepEnd) {
    warnings.push(
      `Best conversion is at the sweep's ${optimum.inputPowerDbm === perPortDbm[0] ? "lowest" : "highest"} drive step: the optimum may lie outside the sweep`,
    );
  }
  let optimumStep = 0;
  for (let i = 1; i < perPortDbm.length; i++) {
    if (Math.abs(perPortDbm[i] - optimum.inputPowerDbm) < Math.abs(perPortDbm[optimumStep] - optimum.inputPowerDbm)) optimumStep = i;
  }
  for (const trace of data.harmonics) {
    if (trace.order === data.wantedOrder) continue;
    parameters.push(
      makeParameter(
        "harmonic-suppression",
        suppression(wanted.outputPowerDbm[optimumStep], trace.outputPowerDbm[optimumStep]),
        { order: trace.order, inputFrequencyHz: data.inputFrequencyHz, drive: "optimum" },
      ),
    );
  }
  return [{ label: "optimum drive", x: optimum.inputPowerDbm, y: optimum.conversionLossDb }];
}

/**
 * For a doubler the "gain" is −CL of the wanted order, against the input reaching the device (all ports);
 * the small-signal reference is read as for any sweep (lib/analysis/compression.ts), but a multiplier is
 * not warned that its sweep starts outside a linear region it never has, nor that it never compresses.
 */
function addCompression(data: DriveSweep, sweep: DeEmbeddedSweep, parameters: DerivedParameter[], warnings: string[], options: DeriveOptions): void {
  addCompressionPoint({
    inputPowerDbm: sweep.deviceInputDbm,
    gainDb: sweep.conversionLossDb.map((cl) => -cl),
    base: { inputFrequencyHz: data.inputFrequencyHz },
    options,
    parameters,
    warnings,
    compressionExpected: data.wantedOrder === 1,
  });
}

/** Conversion loss (with the optimum marked), every order's output and the unwanted orders' suppression, all vs per-port drive. */
function driveSweepCurves(data: DriveSweep, sweep: DeEmbeddedSweep, markers: NonNullable<Curve["markers"]>, decimate: { maxPoints: number }): Curve[] {
  const { perPortDbm, conversionLossDb, wanted } = sweep;
  return [
    {
      id: "conversion-loss-vs-drive",
      title: "Conversion loss vs per-port drive",
      x: { label: "Per-port drive", unit: "dBm", scale: "linear" },
      y: { label: parameterName("conversion-loss"), unit: "dB" },
      series: [makeSeries(`order ${data.wantedOrder}`, perPortDbm, conversionLossDb, decimate)],
      markers,
    },
    {
      id: "output-spectrum-vs-drive",
      title: "Output power of each order vs per-port drive",
      x: { label: "Per-port drive", unit: "dBm", scale: "linear" },
      y: { label: "Output power", unit: "dBm" },
      series: data.harmonics.map((h) => makeSeries(`order ${h.order}`, perPortDbm, h.outputPowerDbm, decimate)),
    },
    {
      id: "harmonic-suppression-vs-drive",
      title: "Suppression of each order vs per-port drive",
      x: { label: "Per-port drive", unit: "dBm", scale: "linear" },
      y: { label: parameterName("harmonic-suppression"), unit: "dBc" },
      series: data.harmonics
        .filter((h) => h.order !== data.wantedOrder)
        .map((h) =>
          makeSeries(
            `order ${h.order}`,
            perPortDbm,
            h.outputPowerDbm.map((p, i) => suppression(wanted.outputPowerDbm[i], p)),
            decimate,
          ),
        ),
    },
  ];
}
