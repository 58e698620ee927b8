import { composeCautions, composeProse, defaultHandlingProse, esdRating, temperatureColumn, temperatureRatings } from "../common";
import { frequencyMultiplierConditions } from "./conditions";
import type { SheetTemplate, SpecRowTemplate } from "../types";
import { parameterName } from "../../lib/domain/parameter-names";
import { formatDrive } from "../../lib/sheet/format";

const frequencyColumn = {
  id: "frequency",
  label: "Frequency",
  sources: [
    { key: "inputFrequencyHz", format: "frequency" as const, suffix: "in" },
    { key: "carrierFrequencyHz", format: "frequency" as const, suffix: "out" },
  ],
};

/**
 * The per-port drive at which a multiplier's conversion-loss and suppression rows are stated when its
 * device states none (dBm). A device's own drive (its key condition "Drive level, per port") is the
 * stated drive of its sheet: a reader can set it on the bench, where each unit's optimum differs (the
 * optimum is its own row). +10 dBm sits near the demo doubler's typical optimum (+10.1 dBm,
 * models/seeders/demo-characterization.ts).
 */
export const MULTIPLIER_DEFAULT_STATED_DRIVE_DBM = 10;

/**
 * The multiplier template with its drive-held rows, trends, titles and features at `statedDriveDbm` per
 * port. Built on each call (a few object literals): a cache keyed by every tenant's drive would grow
 * without bound.
 */
export function frequencyMultiplierTemplateAt(statedDriveDbm: number): SheetTemplate {
  if (!Number.isFinite(statedDriveDbm)) throw new RangeError(`A stated drive must be a finite number of dBm, got ${statedDriveDbm}`);
  const atDrive = { drive: statedDriveDbm };
  const statedDriveWords = `${formatDrive(statedDriveDbm)} per port`;
  /** Suppression of one unwanted order relative to the wanted output, at the stated drive. */
  const suppressionRow = (id: string, symbol: string, order: number, defaultBasis: SpecRowTemplate["defaultBasis"]): SpecRowTemplate => ({
    id,
    parameter: "harmonic-suppression",
    symbol,
    unit: "dBc",
    decimals: 1,
    match: { order, ...atDrive },
    atStatedDrive: { curveId: "harmonic-suppression-vs-drive", series: `order ${order}` },
    groupBy: ["inputFrequencyHz", "temperatureC"],
    defaultBasis,
  });

  const rows: SpecRowTemplate[] = [
    {
      id: "conversion-loss-at-drive",
      parameter: "conversion-loss",
      symbol: "CL",
      unit: "dB",
      decimals: 2,
      match: atDrive,
      atStatedDrive: { curveId: "conversion-loss-vs-drive" },
      groupBy: ["inputFrequencyHz", "temperatureC"],
      defaultBasis: "test",
    },
    {
      id: "conversion-loss-over-temperature",
      parameter: "conversion-loss",
      symbol: "CL",
      unit: "dB",
      decimals: 2,
      match: atDrive,
      atStatedDrive: { curveId: "conversion-loss-vs-drive" },
      groupBy: ["inputFrequencyHz", "temperatureC"],
      defaultBasis: "characterization",
      overTemperature: "max",
    },
    {
      id: "optimum-drive",
      parameter: "optimum-drive",
      qualifiers: ["per-port"],
      symbol: "P_opt",
      unit: "dBm",
      decimals: 1,
      groupBy: ["inputFrequencyHz", "temperatureC"],
      defaultBasis: "characterization",
    },
    suppressionRow("fundamental-suppression", "HS1", 1, "test"),
    suppressionRow("third-harmonic-suppression", "HS3", 3, "characterization"),
    suppressionRow("fourth-harmonic-suppression", "HS4", 4, "characterization"),
    {
      id: "input-p1db",
      parameter: "input-p1db",
      symbol: "P1dB",
      unit: "dBm",
      decimals: 1,
      groupBy: ["inputFrequencyHz", "temperatureC"],
      defaultBasis: "characterization",
    },
    {
      id: "residual-phase-noise",
      parameter: "spot-phase-noise",
      symbol: "L(f)",
      unit: "dBc/Hz",
      decimals: 1,
      groupBy: ["carrierFrequencyHz", "offsetHz", "temperatureC"],
      defaultBasis: "characterization",
    },
    {
      id: "rms-jitter",
      parameter: "rms-jitter",
      symbol: "σ_t",
      unit: "fs",
      decimals: 1,
      groupBy: ["carrierFrequencyHz", "startHz", "stopHz", "temperatureC"],
      defaultBasis: "characterization",
    },
    {
      id: "rms-phase-error",
      parameter: "rms-phase-error",
      symbol: "φ_rms",
      unit: "°",
      decimals: 4,
      groupBy: ["carrierFrequencyHz", "startHz", "stopHz", "temperatureC"],
      defaultBasis: "characterization",
    },
    {
      id: "excess-over-ideal",
      parameter: "excess-over-ideal-multiplication",
      symbol: "ΔL",
      unit: "dB",
      decimals: 1,
      groupBy: ["carrierFrequencyHz", "offsetHz", "temperatureC"],
      defaultBasis: "design",
    },
    {
      id: "noise-floor-above-kt",
      parameter: "noise-floor-above-kt",
      symbol: "NF_kT",
      unit: "dB",
      decimals: 1,
      groupBy: ["carrierFrequencyHz", "temperatureC"],
      defaultBasis: "characterization",
    },
    {
      id: "worst-discrete-spur",
      parameter: "worst-discrete-spur",
      symbol: "P_spur",
      unit: "dBc",
      decimals: 1,
      // The offsets searched are the trace's span, printed in the Offset column as a band.
      groupBy: ["carrierFrequencyHz", "startHz", "stopHz", "temperatureC"],
      defaultBasis: "characterization",
    },
  ];
  // The rows held at the stated drive, which the conversion-loss and suppression notes explain.
  const heldRowIds = rows.filter((row) => row.atStatedDrive).map((row) => row.id);

  // Frequency multipliers, including a double-balanced mixer driven on both ports as a doubler.
  return {
    deviceClass: "frequency-multiplier",
    statedDriveDbm,
    conditions: frequencyMultiplierConditions,
    measurementKinds: ["drive-sweep", "phase-noise"],
    passive: true,
    specifications: {
      conditionColumns: [
        frequencyColumn,
        {
          id: "drive",
          label: "Drive",
          sources: [{ key: "drive", format: "power-dbm", suffix: "per port" }],
        },
        {
          id: "offset",
          label: "Offset",
          // A spot figure's offset, or the integration band of rms phase and jitter.
          sources: [
            { key: "offsetHz", format: "frequency" },
            { key: "startHz", stopKey: "stopHz", format: "frequency-band" },
          ],
        },
        temperatureColumn,
      ],
      rows,
      notes: [
        {
          text: "Conversion loss is P_in − P_out of the wanted 2nd-order output; suppression is P_wanted − P_order (positive below the wanted output).",
          rows: [...heldRowIds],
        },
        "Per-port drive is the source power less the 3.01 dB split, splitter excess loss and cable loss. System impedance 50 Ω.",
        {
          text:
            "Conversion loss and suppression hold at the per-port drive in the Drive column: each unit's figure is read off its measured " +
            "sweep by linear interpolation between the two drive steps around it. Each unit's optimum drive is its own row.",
          rows: [...heldRowIds],
        },
        {
          text:
            "Phase noise is single-sideband L(f) per IEEE Std 1139-2008 at the output, as the bench file measured it: residual (the source's " +
            "noise cancelled in the test set) or absolute (the source's included). An ideal ×N adds 20·log10 N, 6.02 dB for ×2.",
          rows: ["residual-phase-noise", "rms-jitter", "rms-phase-error", "excess-over-ideal"],
        },
        {
          text: "RMS jitter and phase integrate L(f) over the offset band printed beside them: φ_rms = √(2∫L(f)df), σ_t = φ_rms/(2π f_0).",
          rows: ["rms-jitter", "rms-phase-error"],
        },
        {
          text: "Excess over ideal ×N is L_out − (L_in + 20·log10 N) at each offset, L_in the source's own L(f) measured on the same offsets.",
          rows: ["excess-over-ideal"],
        },
        {
          text:
            "Discrete spurs are in dBc: the plotted peak plus 10·log10 of the analyzer's noise bandwidth at the spur's offset (a stated 3 dB " +
            "resolution bandwidth × 1.0645, a Gaussian filter's). The row gives each unit's highest spur over the offsets searched; a unit with no spur adds no value.",
          rows: ["worst-discrete-spur"],
        },
      ],
    },
  // The input band holds the drive sweeps' input frequency; the output band the phase-noise carrier.
    statedBands: [
      { deviceKey: "inputFrequencyHz", label: "input band", sources: [{ key: "inputFrequencyHz" }] },
      { deviceKey: "outputFrequencyHz", label: "output band", sources: [{ key: "carrierFrequencyHz" }] },
    ],
    curves: [
      {
        id: "conversion-loss-vs-drive",
        curveId: "conversion-loss-vs-drive",
        title: "Conversion loss vs per-port drive",
        caption: "Wanted output order; each line one unit.",
      },
      {
        id: "output-spectrum-vs-drive",
        curveId: "output-spectrum-vs-drive",
        title: "Output power of each order vs per-port drive",
        caption: "Line style tells the orders apart.",
      },
      {
        id: "harmonic-suppression-vs-drive",
        curveId: "harmonic-suppression-vs-drive",
        title: "Suppression of the unwanted orders vs per-port drive",
        caption: "Relative to the wanted output; line style tells the orders apart.",
      },
      {
        id: "phase-noise",
        curveId: "phase-noise",
        title: "Phase noise L(f)",
        caption: "Single-sideband, at the output frequency; each line one unit.",
      },
    ],
    trends: [
      {
        id: "conversion-loss-vs-input-frequency",
        parameter: "conversion-loss",
        match: atDrive,
        atStatedDrive: { curveId: "conversion-loss-vs-drive" },
        x: { key: "inputFrequencyHz", label: "Input frequency", unit: "Hz" },
        y: { unit: "dB" },
        title: `${parameterName("conversion-loss")} at ${statedDriveWords} vs input frequency`,
        caption: "Each line one unit, through its measured frequencies.",
      },
      {
        id: "fundamental-suppression-vs-input-frequency",
        parameter: "harmonic-suppression",
        match: { order: 1, ...atDrive },
        atStatedDrive: { curveId: "harmonic-suppression-vs-drive", series: "order 1" },
        x: { key: "inputFrequencyHz", label: "Input frequency", unit: "Hz" },
        y: { unit: "dBc" },
        title: `Fundamental suppression at ${statedDriveWords} vs input frequency`,
        caption: "Each line one unit, through its measured frequencies.",
      },
      {
        id: "conversion-loss-vs-temperature",
        parameter: "conversion-loss",
        match: atDrive,
        atStatedDrive: { curveId: "conversion-loss-vs-drive" },
        groupBy: ["inputFrequencyHz"],
        x: { key: "temperatureC", label: "Ambient temperature", unit: "°C" },
        y: { unit: "dB" },
        title: `${parameterName("conversion-loss")} at ${statedDriveWords} vs temperature`,
        caption: "Each line one unit, through the temperatures it was measured at.",
      },
    ],
    prose: composeProse({
      description:
        "A passive frequency doubler: the input drives both ports of a diode ring through a splitter, and the wanted " +
        "output is the second harmonic.",
      features: `- Conversion loss at ${statedDriveWords}, measured on every unit\n- Fundamental and harmonic suppression at ${statedDriveWords}\n- Phase noise at decade offsets`,
      applications: "- Local-oscillator chains\n- Frequency synthesis\n- Test equipment",
      handling: defaultHandlingProse,
      testFixture:
        "Both device ports are fed from one source through a two-way splitter; its excess loss and the cable loss are " +
        "de-embedded from the stated drive. Output power of each order is read on a spectrum analyzer.",
    }),
    cautions: composeCautions(
      "Do not exceed the maximum RF input power stated under absolute maximum ratings. Driving far above the rated drive " +
        "raises near-carrier noise and stresses the diodes.",
    ),
    absoluteMaximumRatings: [{ label: "RF input power, per port", unit: "dBm" }, ...temperatureRatings, esdRating],
    // A multiplier's residual noise matters close in: 10 Hz–1 MHz unless the file or the upload states another band.
    analysisDefaults: { integrationBandHz: { startHz: 10, stopHz: 1e6 } },
    // The usual pins of a packaged doubler (common practice).
    designIn: {
      pins: [
        { pin: "", name: "IN", function: "Input (fundamental)" },
        { pin: "", name: "OUT", function: "Output (multiplied)" },
        { pin: "", name: "GND", function: "Ground" },
      ],
      recommendedOperatingConditions: [
        { parameter: "Input drive", unit: "dBm" },
        { parameter: "Ambient temperature", unit: "°C" },
      ],
    },
  };
}

/** The multiplier template at the default stated drive, for a device that states none. */
export const frequencyMultiplierTemplate = frequencyMultiplierTemplateAt(MULTIPLIER_DEFAULT_STATED_DRIVE_DBM);
