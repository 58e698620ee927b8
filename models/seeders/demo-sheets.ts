/**
 * What the demo engineers have written on their sheets: spec limits, prose, absolute maximum
 * ratings and stated measurement uncertainty, per part number. Invented, like the rest of the
 * demo scenario; saved through the app's API by scripts/seed-demo-measurements.ts. The limits'
 * condition keys are those of the sheet's statistics groups for the demo measurements.
 */
import type { LimitBasis, ProseSectionId } from "../../lib/domain/sheets";

export interface DemoSheetContent {
  limits: { parameter: string; conditionsKey: string; min?: number; typ?: number; max?: number; unit: string; basis: LimitBasis; footnote?: string }[];
  prose: Partial<Record<ProseSectionId, string>>;
  absoluteMaximumRatings: { label: string; value: string; unit: string }[];
  measurementUncertainty: Record<string, number>;
}

const esd = (value: string) => ({ label: "ESD sensitivity, human-body model (ANSI/ESDA/JEDEC JS-001)", value, unit: "class" });
const temperatures = (operating: string, storage: string) => [
  { label: "Operating temperature", value: operating, unit: "°C" },
  { label: "Storage temperature", value: storage, unit: "°C" },
];

const doubler1GHz = "drive=10;inputFrequencyHz=1000000000;temperatureC=25";
const mixerBand = "ifFrequencyHz=70000000;loPowerDbm=7;startHz=500000000;stopHz=3000000000;temperatureC=25";
// KQH-2G is a 1.7–2.3 GHz part measured 1.5–2.5 GHz: its upload states the band (demo-measurements.ts).
const hybridBand = "startHz=1700000000;stopHz=2300000000;temperatureC=25";
/** The rated operating range, as the rows over temperature state it (the span of the sets' temperatures). */
const ratedRange = "temperatureMaxC=85;temperatureMinC=-40";

/** Sheets of devices that have no approved measurements yet: words and ratings only. */
const shell = (description: string, features: string, ratings: DemoSheetContent["absoluteMaximumRatings"]): DemoSheetContent => ({
  limits: [],
  prose: { description, features },
  absoluteMaximumRatings: ratings,
  measurementUncertainty: {},
});

export const demoSheets: Record<string, DemoSheetContent> = {
  "KDX-2G4": {
    limits: [
      { parameter: "conversion-loss", conditionsKey: doubler1GHz, typ: 9.5, max: 11, unit: "dB", basis: "test" },
      {
        parameter: "conversion-loss",
        conditionsKey: `drive=10;inputFrequencyHz=1000000000;${ratedRange}`,
        max: 11.5,
        unit: "dB",
        basis: "characterization",
        footnote: "Each unit's highest value over −40, +25 and +85 °C, from the four units of the runs over temperature (two lots); tested at 25 °C only.",
      },
      { parameter: "harmonic-suppression", conditionsKey: "drive=10;inputFrequencyHz=1000000000;order=1;temperatureC=25", min: 22, typ: 26, unit: "dBc", basis: "test" },
      { parameter: "harmonic-suppression", conditionsKey: "drive=10;inputFrequencyHz=1000000000;order=3;temperatureC=25", min: 25, unit: "dBc", basis: "characterization" },
      { parameter: "harmonic-suppression", conditionsKey: "drive=10;inputFrequencyHz=1000000000;order=4;temperatureC=25", min: 20, unit: "dBc", basis: "characterization" },
      { parameter: "optimum-drive", conditionsKey: "inputFrequencyHz=1000000000;temperatureC=25", typ: 10.8, unit: "dBm", basis: "characterization" },
      {
        parameter: "spot-phase-noise",
        conditionsKey: "carrierFrequencyHz=2000000000;offsetHz=10000;temperatureC=25",
        typ: -152,
        unit: "dBc/Hz",
        basis: "characterization",
        footnote: "Residual noise of one unit, measured with its reference cancelled; typical only.",
      },
    ],
    prose: {
      description:
        "The **KDX-2G4** doubles a 0.5–1.2 GHz input to 1.0–2.4 GHz. A Schottky diode ring is driven on both ports from one source through an in-phase splitter, so the second harmonic adds at the output while the fundamental and the odd orders cancel.\n\nNo bias supply is needed. Best conversion is near +10.8 dBm per port.",
      features:
        "- Conversion loss below 11 dB at +10 dBm per port, tested on every unit at 25 °C; below 11.5 dB from −40 to +85 °C\n- Fundamental suppression above 22 dBc\n- Phase noise typically −152 dBc/Hz at 10 kHz offset\n- Passive: no DC supply",
      applications: "- Local-oscillator multiplier chains\n- Clock doubling in frequency synthesizers\n- Laboratory frequency extension",
      "test-fixture":
        "Units are soldered to a 0.508 mm laminate fixture with SMA launches. Both device ports are fed from one signal generator through a two-way in-phase splitter; its 0.4 dB excess loss and the 0.6 dB cable loss are taken out of the stated drive. Output orders 1 to 4 are read on a spectrum analyzer. Reference impedance 50 Ω.\n\nThe runs over temperature put the fixture in a chamber at −40, +25 and +85 °C, soaked 20 minutes at each; the temperature of each run is the one its bench file states.",
    },
    absoluteMaximumRatings: [{ label: "RF input power, per port", value: "+20", unit: "dBm" }, ...temperatures("−40 to +85", "−55 to +125"), esd("1A")],
    measurementUncertainty: { "conversion-loss": 0.5, "harmonic-suppression": 0.3, "spot-phase-noise": 2 },
  },
  "KM-7H": {
    limits: [
      { parameter: "conversion-loss", conditionsKey: `${mixerBand.replace("stopHz", "statistic=max;stopHz")}`, max: 8.5, unit: "dB", basis: "test" },
      { parameter: "conversion-loss", conditionsKey: `${mixerBand.replace("stopHz", "statistic=typ;stopHz")}`, typ: 6.6, unit: "dB", basis: "characterization" },
      {
        parameter: "conversion-loss",
        conditionsKey: `${mixerBand.replace("stopHz", "statistic=max;stopHz").replace("temperatureC=25", ratedRange)}`,
        max: 9,
        unit: "dB",
        basis: "characterization",
        footnote: "Each unit's highest value in band over −40, +25 and +85 °C, from the four units of the runs over temperature (two lots); tested at 25 °C only.",
      },
      { parameter: "isolation", conditionsKey: `ifFrequencyHz=70000000;loPowerDbm=7;path=LO-RF;startHz=500000000;statistic=min;stopHz=3000000000;temperatureC=25`, min: 22, unit: "dB", basis: "test" },
    ],
    prose: {
      description:
        "The **KM-7H** is a level-7 double-balanced mixer: a quad of Schottky diodes between two wideband baluns. With +7 dBm of LO it converts 500–3000 MHz to an IF from DC to 1 GHz with about 6.6 dB of loss.",
      features:
        "- Conversion loss below 8.5 dB across 500–3000 MHz at 25 °C, below 9 dB from −40 to +85 °C\n- LO-to-RF isolation above 22 dB, LO-to-IF typically 23 dB\n- Input IP3 typically +16 dBm, input P1dB typically +0.8 dBm\n- +7 dBm LO drive",
      applications: "- Up- and down-conversion in receivers and transmitters\n- Phase detection\n- Frequency doubling with both ports driven",
      "test-fixture":
        "Units are measured on a 50 Ω evaluation board. The RF port is swept from 500 to 3000 MHz at −10 dBm against a +7 dBm LO, the IF held at 70 MHz with the LO 70 MHz above the RF; conversion loss and LO-to-RF leakage are read on a spectrum analyzer, corrected for fixture and cable loss. LO-to-IF and RF-to-IF leakage are read the same way with the IF port to the analyzer.\n\nThe two-tone runs put 1000 and 1001 MHz on the RF port, −20 to +6 dBm per tone, against the same +7 dBm LO at 1070 MHz (IF 70 MHz); the intercept comes from the slope-fitted small-signal points, the compression point from the tone output. Port match is a three-port network-analyzer measurement with the LO off: port 1 RF, port 2 LO, port 3 IF.\n\nThe runs over temperature put the board in a chamber at −40, +25 and +85 °C; the temperature of each run is the one its bench file states.",
    },
    absoluteMaximumRatings: [
      { label: "RF input power", value: "+17", unit: "dBm" },
      { label: "LO input power", value: "+20", unit: "dBm" },
      { label: "IF current", value: "40", unit: "mA" },
      ...temperatures("−40 to +85", "−55 to +100"),
      esd("1A"),
    ],
    measurementUncertainty: { "conversion-loss": 0.5, isolation: 1, iip3: 1, "input-p1db": 0.5 },
  },
  "KQH-2G": {
    limits: [
      { parameter: "insertion-loss", conditionsKey: `path=S21;${hybridBand.replace("stopHz", "statistic=worst;stopHz")}`, max: 3.6, unit: "dB", basis: "test" },
      { parameter: "insertion-loss", conditionsKey: `path=S31;${hybridBand.replace("stopHz", "statistic=worst;stopHz")}`, max: 3.7, unit: "dB", basis: "test" },
      // Balance is signed (the largest deviation, sign kept), so "within 0.5 dB" is a limit on both sides.
      { parameter: "amplitude-balance", conditionsKey: hybridBand.replace("stopHz", "statistic=worst;stopHz"), min: -0.5, max: 0.5, unit: "dB", basis: "test" },
      { parameter: "phase-balance", conditionsKey: hybridBand.replace("stopHz", "statistic=worst;stopHz"), min: -3, max: 3, unit: "°", basis: "test" },
      { parameter: "isolation", conditionsKey: `path=S41;${hybridBand.replace("stopHz", "statistic=worst;stopHz")}`, min: 20, unit: "dB", basis: "test" },
      { parameter: "vswr", conditionsKey: `port=1;${hybridBand.replace("stopHz", "statistic=worst;stopHz")}`, max: 1.3, unit: ":1", basis: "characterization" },
    ],
    prose: {
      description:
        "The **KQH-2G** splits a signal into two outputs of equal amplitude in quadrature (90° apart) over 1.7–2.3 GHz. The fourth port is isolated and takes the reflected power of mismatched loads into its 50 Ω termination.",
      features: "- Amplitude balance within ±0.5 dB\n- Phase balance within ±3° of 90°\n- Isolation above 20 dB\n- Surface mount, no DC path between ports",
      applications: "- Balanced amplifiers\n- Image-reject and I/Q mixers\n- Quadrature LO generation",
      "test-fixture":
        "Four-port S-parameters from 1.5 to 2.5 GHz on a 50 Ω test board, the board's lines de-embedded with a thru-reflect-line calibration. Port 1 input, 2 through, 3 coupled, 4 isolated.",
    },
    absoluteMaximumRatings: [{ label: "Input power, CW", value: "20", unit: "W" }, ...temperatures("−55 to +85", "−55 to +125"), esd("3B")],
    measurementUncertainty: { "insertion-loss": 0.1, "amplitude-balance": 0.1, "phase-balance": 1, isolation: 0.3 },
  },
  "WL-C2611-KDX": {
    limits: [
      { parameter: "conversion-loss", conditionsKey: doubler1GHz, typ: 9.5, unit: "dB", basis: "characterization", footnote: "One unit of lot 2611; typical only." },
      { parameter: "harmonic-suppression", conditionsKey: "drive=10;inputFrequencyHz=1000000000;order=1;temperatureC=25", typ: 26, unit: "dBc", basis: "characterization" },
    ],
    prose: {
      description:
        "An independent characterization by Wrenfield RF Test Laboratory of a double-balanced mixer from lot 2611 used as a frequency doubler: both ports driven from one source through an in-phase splitter, output taken at twice the input frequency.\n\nThe figures describe the unit tested. They are not the maker's guarantees.",
      features: "- Conversion loss against per-port drive, with the optimum marked\n- Suppression of orders 1, 3 and 4 relative to the wanted output",
      "test-fixture":
        "The customer's evaluation board, 50 Ω, at 25 °C. Splitter excess loss (0.4 dB) and cable loss (0.6 dB) are taken out of the stated drive.",
    },
    absoluteMaximumRatings: [
      { label: "RF input power, per port", value: "+20", unit: "dBm" },
      ...temperatures("−40 to +85", "−55 to +125"),
      esd("1A"),
    ],
    measurementUncertainty: { "conversion-loss": 0.4, "harmonic-suppression": 0.3 },
  },
  "WL-C2614-PM13": shell(
    "An independent characterization of a +13 dBm LO double-balanced mixer across three lots. **Measurements are planned; no data have been approved yet.**",
    "- Conversion loss, isolation and intercept, per lot",
    [{ label: "RF input power", value: "+20", unit: "dBm" }, { label: "LO input power", value: "+23", unit: "dBm" }, { label: "IF current", value: "40", unit: "mA" }, ...temperatures("−40 to +85", "−55 to +100"), esd("1A")],
  ),
  "PX-40": shell(
    "The **PX-40** doubles 1–2 GHz to 2–4 GHz with +14 dBm per port. Characterization has not started.",
    "- High-drive diode ring for low near-carrier noise\n- Passive: no DC supply",
    [{ label: "RF input power, per port", value: "+24", unit: "dBm" }, ...temperatures("−40 to +85", "−55 to +125"), esd("1A")],
  ),
  "PM-13": shell(
    "The **PM-13** is a level-13 double-balanced mixer for 10–3000 MHz with a higher intercept than level-7 parts. Characterization has not started.",
    "- +13 dBm LO drive\n- 10–3000 MHz RF and LO",
    [{ label: "RF input power", value: "+20", unit: "dBm" }, { label: "LO input power", value: "+23", unit: "dBm" }, { label: "IF current", value: "50", unit: "mA" }, ...temperatures("−40 to +85", "−55 to +100"), esd("1A")],
  ),
  "PS-2W": {
    // One unit: typical values only; a limit on one unit could not be supported (Cpk needs two).
    limits: [],
    prose: {
      description:
        "The **PS-2W** splits a signal into two in-phase outputs of equal amplitude. This sheet gives the typical values of one characterized unit, PS-0007, between 0.5 and 2.5 GHz; guaranteed limits and the band up to 3 GHz follow with the first production lot.",
      features: "- In-phase (0°) two-way split\n- Resistive-reactive design for wide bandwidth",
      applications: "- Local-oscillator distribution\n- Feeding both ports of a mixer used as a doubler\n- Power combining",
      "test-fixture": "Three-port S-parameters from 0.5 to 2.5 GHz on a 50 Ω test board, its lines de-embedded. Port 1 common, ports 2 and 3 outputs.",
    },
    absoluteMaximumRatings: [{ label: "Input power, CW", value: "1", unit: "W" }, ...temperatures("−55 to +85", "−55 to +125"), esd("2")],
    measurementUncertainty: { "insertion-loss": 0.08, "amplitude-balance": 0.08, isolation: 0.3 },
  },
};
