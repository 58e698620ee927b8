import {
  bandColumn,
  bandKeys,
  composeCautions,
  composeProse,
  defaultHandlingProse,
  esdRating,
  portColumn,
  temperatureColumn,
  temperatureRatings,
  worstVswrRow,
} from "../common";
import { quadratureHybridConditions } from "./conditions";
import type { SheetTemplate, SpecRowTemplate } from "../types";


function bandRow(row: Omit<SpecRowTemplate, "groupBy">): SpecRowTemplate {
  return { ...row, match: { statistic: "worst", ...row.match }, groupBy: [...bandKeys, "temperatureC"] };
}

/**
 * 90° hybrids from 4-port Touchstone files (ports: 1 in, 2 through, 3 coupled, 4 isolated) and
 * in-phase power splitters from 3-port files (1 common, 2 and 3 outputs). Rows are named by
 * port so one table serves both; a row shows only where the file gives its figure (S41 only
 * for a hybrid; S32, between the outputs, for both).
 */
export const quadratureHybridTemplate: SheetTemplate = {
  deviceClass: "quadrature-hybrid",
  conditions: quadratureHybridConditions,
  measurementKinds: ["touchstone"],
  passive: true,
  specifications: {
    conditionColumns: [
      bandColumn,
      portColumn,
      temperatureColumn,
    ],
    rows: [
      bandRow({
        id: "insertion-loss-through",
        parameter: "insertion-loss",
        symbol: "IL",
        unit: "dB",
        decimals: 2,
        match: { path: "S21" },
        defaultBasis: "test",
      }),
      bandRow({
        id: "insertion-loss-coupled",
        parameter: "insertion-loss",
        symbol: "IL",
        unit: "dB",
        decimals: 2,
        match: { path: "S31" },
        defaultBasis: "test",
      }),
      bandRow({
        id: "amplitude-balance",
        parameter: "amplitude-balance",
        symbol: "ΔA",
        unit: "dB",
        decimals: 2,
        defaultBasis: "test",
      }),
      bandRow({
        id: "phase-balance",
        parameter: "phase-balance",
        qualifiers: ["from-nominal"],
        symbol: "Δφ",
        unit: "°",
        decimals: 1,
        defaultBasis: "test",
      }),
      bandRow({
        id: "isolation-input",
        parameter: "isolation",
        symbol: "ISO",
        unit: "dB",
        decimals: 1,
        match: { path: "S41" },
        defaultBasis: "characterization",
      }),
      bandRow({
        id: "isolation-outputs",
        parameter: "isolation",
        symbol: "ISO",
        unit: "dB",
        decimals: 1,
        match: { path: "S32" },
        defaultBasis: "characterization",
      }),
      worstVswrRow("characterization"),
    ],
    notes: [
      "Ports: hybrid 1 input, 2 through, 3 coupled, 4 isolated; splitter 1 common, 2 and 3 outputs.",
      "Insertion loss includes the ideal 3.01 dB split. Balance figures are the largest deviation over the band, sign kept; the nominal phase difference is 90° for a quadrature hybrid and 0° for an in-phase splitter.",
      "Measured with a vector network analyzer, all ports terminated in 50 Ω.",
    ],
  },
  statedBands: [{ deviceKey: "inputFrequencyHz", label: "band", sources: [{ key: "startHz", stopKey: "stopHz" }] }],
  curves: [
    // Insertion loss and isolation are one curve of the engine but two quantities: each on its own axis
    // (a 0–25 dB axis would flatten the insertion loss to a line).
    {
      id: "insertion-loss",
      curveId: "transmission",
      title: "Insertion loss vs frequency",
      caption: "Line style tells the paths apart.",
      selectSeries: (name) => name.startsWith("insertion loss"),
      yParameter: "insertion-loss",
    },
    {
      id: "isolation",
      curveId: "transmission",
      title: "Isolation vs frequency",
      caption: "Line style tells the paths apart.",
      selectSeries: (name) => name.startsWith("isolation"),
      yParameter: "isolation",
    },
    { id: "amplitude-balance", curveId: "amplitude-balance", title: "Amplitude balance vs frequency", caption: "Each line one unit." },
    { id: "phase-balance", curveId: "phase-balance", title: "Phase balance vs frequency", caption: "Deviation from the nominal 90° (hybrid) or 0° (splitter); each line one unit." },
    { id: "return-loss", curveId: "return-loss", title: "Return loss vs frequency", caption: "Line style tells the ports apart." },
  ],
  prose: composeProse({
    description: "A 90° hybrid coupler: power at the input divides equally between the through and coupled ports in quadrature.",
    features: "- Amplitude and phase balance over the full band\n- Insertion loss measured on every unit",
    applications: "- Balanced amplifiers\n- Image-reject and I/Q mixers\n- Power combining",
    handling: defaultHandlingProse,
    testFixture:
      "Four-port S-parameters are measured on the evaluation board with a vector network analyzer calibrated at the " +
      "coaxial connectors; the board's lines are not de-embedded.",
  }),
  cautions: composeCautions("Do not exceed the maximum CW input power stated under absolute maximum ratings."),
  absoluteMaximumRatings: [{ label: "Input power, CW", unit: "W" }, ...temperatureRatings, esdRating],
  // Port numbering of a four-port hybrid (common practice: 1 input, 2 through, 3 coupled, 4 isolated).
  designIn: {
    pins: [
      { pin: "1", name: "IN", function: "Input" },
      { pin: "2", name: "0°", function: "Through output" },
      { pin: "3", name: "−90°", function: "Coupled output" },
      { pin: "4", name: "ISO", function: "Isolated port, terminate in 50 Ω" },
      { pin: "", name: "GND", function: "Ground" },
    ],
    recommendedOperatingConditions: [
      { parameter: "Input power, CW", unit: "W" },
      { parameter: "Ambient temperature", unit: "°C" },
    ],
  },
};
