import {
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
import { doubleBalancedMixerConditions } from "./conditions";
import type { SheetTemplate, SpecRowTemplate } from "../types";


/** What every mixer figure is stated at besides its RF: LO frequency, IF frequency and LO drive (templates/double-balanced-mixer/conditions.ts). */
const mixerKeys = ["loFrequencyHz", "ifFrequencyHz", "loPowerDbm"];

function isolationRow(path: "LO-RF" | "LO-IF" | "RF-IF", basis: SpecRowTemplate["defaultBasis"]): SpecRowTemplate {
  return {
    id: `isolation-${path.toLowerCase()}`,
    parameter: "isolation",
    symbol: `ISO ${path}`,
    unit: "dB",
    decimals: 1,
    match: { path, statistic: "min" },
    groupBy: [...bandKeys, ...mixerKeys, "temperatureC"],
    defaultBasis: basis,
  };
}

/** Passive double-balanced diode mixers. */
export const doubleBalancedMixerTemplate: SheetTemplate = {
  deviceClass: "double-balanced-mixer",
  conditions: doubleBalancedMixerConditions,
  measurementKinds: ["frequency-sweep", "two-tone", "touchstone"],
  passive: true,
  specifications: {
    conditionColumns: [
      {
        id: "rf",
        label: "RF",
        sources: [
          // A port's VSWR band is the band its port was swept over, not an RF band: it has its own column.
          { key: "startHz", stopKey: "stopHz", format: "frequency-range", exceptRows: ["vswr"] },
          { key: "rfFrequencyHz", format: "frequency" },
        ],
      },
      {
        id: "lo-frequency",
        label: "LO",
        sources: [{ key: "loFrequencyHz", format: "frequency" }],
      },
      {
        id: "if",
        label: "IF",
        sources: [{ key: "ifFrequencyHz", format: "frequency" }],
      },
      {
        id: "lo",
        label: "LO drive",
        sources: [{ key: "loPowerDbm", format: "power-dbm" }],
      },
      portColumn,
      { id: "port-band", label: "Band", sources: [{ key: "startHz", stopKey: "stopHz", format: "frequency-range", rows: ["vswr"] }] },
      temperatureColumn,
    ],
    rows: [
      {
        id: "conversion-loss-worst",
        parameter: "conversion-loss",
        qualifiers: ["highest-in-band"],
        symbol: "CL",
        unit: "dB",
        decimals: 2,
        match: { statistic: "max" },
        groupBy: [...bandKeys, ...mixerKeys, "temperatureC"],
        defaultBasis: "test",
      },
      {
        id: "conversion-loss-typical",
        parameter: "conversion-loss",
        qualifiers: ["median-over-band"],
        symbol: "CL",
        unit: "dB",
        decimals: 2,
        match: { statistic: "typ" },
        groupBy: [...bandKeys, ...mixerKeys, "temperatureC"],
        defaultBasis: "characterization",
      },
      {
        id: "conversion-loss-worst-over-temperature",
        parameter: "conversion-loss",
        qualifiers: ["highest-in-band"],
        symbol: "CL",
        unit: "dB",
        decimals: 2,
        match: { statistic: "max" },
        groupBy: [...bandKeys, ...mixerKeys, "temperatureC"],
        defaultBasis: "characterization",
        overTemperature: "max",
      },
      isolationRow("LO-RF", "test"),
      isolationRow("LO-IF", "characterization"),
      isolationRow("RF-IF", "characterization"),
      {
        id: "iip3",
        parameter: "iip3",
        symbol: "IIP3",
        unit: "dBm",
        decimals: 1,
        match: { method: "slope-fit" },
        groupBy: ["rfFrequencyHz", ...mixerKeys, "temperatureC"],
        defaultBasis: "characterization",
      },
      {
        id: "input-p1db",
        parameter: "input-p1db",
        symbol: "P1dB",
        unit: "dBm",
        decimals: 1,
        match: { method: "two-tone, per tone" },
        groupBy: ["rfFrequencyHz", ...mixerKeys, "temperatureC"],
        defaultBasis: "characterization",
      },
      worstVswrRow("characterization"),
    ],
    notes: [
      { text: "Conversion loss is P_RF − P_IF (positive for a lossy mixer).", rows: ["conversion-loss-worst", "conversion-loss-typical", "conversion-loss-worst-over-temperature"] },
      { text: "Intercepts are per tone, from slope-1 and slope-3 fits over the small-signal points.", rows: ["iip3"] },
      "System impedance 50 Ω; LO drive is the available power at the LO port. Where a row states an IF and no LO, the RF was swept at that fixed IF with the LO following it.",
      { text: "Port match (VSWR, return loss) is measured as a three-port network: port 1 RF, port 2 LO, port 3 IF, with the LO off.", rows: ["vswr"] },
    ],
  },
  // The device states its RF band; the conversion-loss and isolation rows are figures over an RF band.
  // (A port's VSWR band may be the LO port's, so it is not compared with the RF band.)
  statedBands: [
    {
      deviceKey: "inputFrequencyHz",
      label: "RF band",
      sources: [{ key: "startHz", stopKey: "stopHz" }],
      rowIds: ["conversion-loss-worst", "conversion-loss-typical", "conversion-loss-worst-over-temperature", "isolation-lo-rf", "isolation-lo-if", "isolation-rf-if"],
    },
  ],
  trends: [
    {
      id: "conversion-loss-vs-temperature",
      parameter: "conversion-loss",
      match: { statistic: "max" },
      groupBy: [...bandKeys, ...mixerKeys],
      x: { key: "temperatureC", label: "Ambient temperature", unit: "°C" },
      y: { unit: "dB", qualifiers: ["highest-in-band"] },
      title: "Highest conversion loss in band vs temperature",
      caption: "Each line one unit, through the temperatures it was measured at.",
    },
  ],
  curves: [
    {
      id: "conversion-loss-vs-frequency",
      curveId: "conversion-loss-vs-frequency",
      title: "Conversion loss vs RF frequency",
      caption: "At the stated LO drive; each line one unit.",
    },
    {
      id: "isolation-vs-frequency",
      curveId: "isolation-vs-frequency",
      title: "Isolation vs RF frequency",
      caption: "Line style tells the paths apart.",
    },
    {
      id: "two-tone-transfer",
      curveId: "two-tone-transfer",
      title: "Tone and IM3 output vs input per tone",
      caption: "Line style tells the tone from the third-order product.",
    },
    {
      id: "return-loss",
      curveId: "return-loss",
      title: "Return loss vs frequency",
      caption: "Line style tells the ports apart.",
    },
  ],
  prose: composeProse({
    description: "A passive double-balanced diode mixer with balun-coupled LO and RF ports and a DC-coupled IF port.",
    features: "- Conversion loss measured on every unit across the RF band\n- LO–RF isolation measured on every unit\n- Two-tone intercept at the rated LO drive",
    applications: "- Up- and down-conversion\n- Phase detection\n- Frequency doubling with both ports driven",
    handling: defaultHandlingProse,
    testFixture:
      "RF and LO are applied through calibrated cables to the device on its evaluation board; board and cable losses " +
      "are de-embedded. The IF port is terminated in 50 Ω through a diplexer.",
  }),
  cautions: composeCautions(
    "Do not exceed the maximum RF and LO input powers or the IF current stated under absolute maximum ratings.",
  ),
  // Its Touchstone file is the three ports' match with the LO off (port 1 RF, 2 LO, 3 IF), not a splitter.
  deriveOptions: { touchstone: { portMatchOnly: true } },
  absoluteMaximumRatings: [
    { label: "RF input power", unit: "dBm" },
    { label: "LO input power", unit: "dBm" },
    { label: "IF current", unit: "mA" },
    ...temperatureRatings,
    esdRating,
  ],
  // The usual pins of a packaged double-balanced mixer (common practice).
  designIn: {
    pins: [
      { pin: "", name: "LO", function: "Local-oscillator input" },
      { pin: "", name: "RF", function: "RF input" },
      { pin: "", name: "IF", function: "IF output, DC-coupled" },
      { pin: "", name: "GND", function: "Ground" },
    ],
    recommendedOperatingConditions: [
      { parameter: "LO drive", unit: "dBm" },
      { parameter: "RF input power", unit: "dBm" },
      { parameter: "Ambient temperature", unit: "°C" },
    ],
  },
};
