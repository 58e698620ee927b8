/**
 * The demo catalog: invented parts of the two demo vendors and the demo lab, each measured on a few
 * units, given limits from its own data, and released as revision A, so that the public catalog's
 * search, facets and compare have something to work on. The bench files come from the models in
 * demo-catalog-curves.ts with fixed seeds. Played through the app's API by scripts/seed-demo-catalog.ts
 * (after the demo's own story, seed-demo-releases.ts). Every name, serial and lot is made up.
 */
import type { DeviceClass } from "../../lib/domain/device-classes";
import type { LimitBasis, ProseSectionId } from "../../lib/domain/sheets";
import { formatDrive } from "../../lib/sheet/format";
import {
  doublerDriveSweep,
  mixerFrequencySweep,
  mixerPortMatch,
  mixerTwoTone,
  touchstoneFile,
  type DoublerModel,
  type MixerModel,
  type NetworkModel,
} from "./demo-catalog-curves";
import type { DemoInstrument } from "./demo-measurements";

const GHz = 1e9;
const MHz = 1e6;

/** One bench file of a catalog part, uploaded through POST /api/v1/measurements. */
export interface DemoCatalogFile {
  name: string;
  /** Form fields as the upload form sends them (strings). */
  fields: Record<string, string>;
  /** Keys of the organization's instruments (demoCatalogInstruments or demoInstruments). */
  instruments: string[];
  text: string;
}

/**
 * A limit the engineer sets from the approved data: the mean moved outwards by four standard
 * deviations and the stated expanded uncertainty (so Cpk stays at 1.33 or more and the guard band
 * leaves an acceptance zone), rounded outwards to `step`. "symmetric" states ±the larger side.
 */
export interface DemoLimitRule {
  /** The template's specification row id (templates/<class>/index.ts). */
  row: string;
  side: "max" | "min" | "symmetric";
  basis: LimitBasis;
  step: number;
}

export interface DemoCatalogPart {
  org: string;
  partNumber: string;
  deviceClass: DeviceClass;
  title: string;
  description: string;
  keyConditions: { inputFrequencyHz?: { min: number; max: number }; outputFrequencyHz?: { min: number; max: number }; driveLevelDbm?: number; multiplicationFactor?: number };
  files: () => DemoCatalogFile[];
  limits: DemoLimitRule[];
  /**
   * The sheet's words; `{row.side}` in the features is replaced by the limit set from the data
   * (e.g. `{conversion-loss-at-drive.max}`), so the features promise what the table guarantees.
   */
  prose: Partial<Record<ProseSectionId, string>>;
  absoluteMaximumRatings: { label: string; value: string; unit: string }[];
  measurementUncertainty: Record<string, number>;
  submitNote: string;
  releaseNote: string;
  /** Reasons of this part's own, over demoCatalogIssueReasons (a lab's report is not a vendor's production sheet). */
  issueReasons?: Readonly<Record<string, string>>;
}

/**
 * Why each open issue a catalog part is submitted with may stand, by issue code, in the engineers' words
 * (lib/sheet/consistency-checks.ts raises them: the parts are characterized at a few frequencies inside
 * their band, at +25 °C, from one lot of a first build). An issue with no reason here stops the loader.
 */
export const demoCatalogIssueReasons: Readonly<Record<string, string>> = {
  "stated-band-not-specified":
    "The stated band is the design band; production test screens every unit at the frequencies the rows state, and units at the band edges are characterized with the next lot.",
  "uncertainty-below-instruments":
    "The stated U is the bench's budget for its method, which corrects the instruments' level error at every point (the generator levelled " +
    "against the analyzer, the network analyzer calibrated on the board), so the register's uncorrected figures do not enter it.",
  "limit-at-one-temperature":
    "The limits are stated at +25 °C, as the table's T_A column says; the temperature runs are planned for the next revision.",
  "limit-from-one-lot": "All units come from the first production lot; the second lot joins the characterization before the next revision.",
  "limit-from-few-units": "The characterization limits rest on the first build's units; more are added as production tests them.",
};

/**
 * The demo lab's reports: three units of a customer's lot, measured once. Its limits describe the units it measured
 * (basis characterization); it tests no shipped unit, so none of its rows is "tested on every unit", and its reasons
 * speak of the lot the customer sent, not of production.
 */
const labLimits = (rules: DemoLimitRule[]): DemoLimitRule[] => rules.map((rule) => ({ ...rule, basis: "characterization" }));
const labIssueReasons: Readonly<Record<string, string>> = {
  "stated-band-not-specified": "The customer asked for the frequencies the rows state; the band edges were not part of the order.",
  "limit-at-one-temperature": "The customer ordered a +25 °C characterization; the T_A column says so.",
  "limit-from-one-lot": "The customer sent units of one lot; the report describes that lot and says so in its description.",
  "limit-from-few-units": "Three units are what the customer sent; the figures describe those units, not the maker's production.",
};

/** Instruments the loader enters where an organization has none of that kind (through the admin API). */
export const demoCatalogInstruments: Record<string, DemoInstrument[]> = {
  pellacourt: [
    { key: "source", kind: "signal generator", model: "Halvard SG-12", serial: "HSG-2291", calibratedOn: "2026-04-20", calibrationDueOn: "2027-04-20", uncertainty: [{ quantity: "output level", value: 0.6, unit: "dB", coverageFactor: 2 }] },
    { key: "analyzer", kind: "spectrum analyzer", model: "Ostrava SA-13", serial: "OSA-0871", calibratedOn: "2026-05-05", calibrationDueOn: "2027-05-05", uncertainty: [{ quantity: "absolute level", value: 0.4, unit: "dB", coverageFactor: 2 }] },
  ],
  "wrenfield-lab": [
    { key: "vna", kind: "vector network analyzer", model: "Meriden VN-6", serial: "MVN-5120", calibratedOn: "2026-06-22", calibrationDueOn: "2027-06-22", uncertainty: [{ quantity: "transmission magnitude", value: 0.08, unit: "dB", coverageFactor: 2 }, { quantity: "transmission phase", value: 0.8, unit: "°", coverageFactor: 2 }] },
  ],
};

// ─── What each class states ────────────────────────────────────────────────────────────────────────

const esd = (value: string) => ({ label: "ESD sensitivity, human-body model (ANSI/ESDA/JEDEC JS-001)", value, unit: "class" });
const temperatures = (operating: string, storage: string) => [
  { label: "Operating temperature", value: operating, unit: "°C" },
  { label: "Storage temperature", value: storage, unit: "°C" },
];

const doublerLimits: DemoLimitRule[] = [
  { row: "conversion-loss-at-drive", side: "max", basis: "test", step: 0.5 },
  { row: "fundamental-suppression", side: "min", basis: "test", step: 1 },
  { row: "third-harmonic-suppression", side: "min", basis: "characterization", step: 1 },
  { row: "fourth-harmonic-suppression", side: "min", basis: "characterization", step: 1 },
];
const doublerUncertainty = { "conversion-loss": 0.5, "harmonic-suppression": 0.3 };

const mixerLimits: DemoLimitRule[] = [
  { row: "conversion-loss-worst", side: "max", basis: "test", step: 0.5 },
  { row: "isolation-lo-rf", side: "min", basis: "test", step: 1 },
  { row: "isolation-lo-if", side: "min", basis: "characterization", step: 1 },
];
const mixerUncertainty = { "conversion-loss": 0.5, isolation: 1 };

const networkLimits = (isolationRow: "isolation-input" | "isolation-outputs"): DemoLimitRule[] => [
  { row: "insertion-loss-through", side: "max", basis: "test", step: 0.1 },
  { row: "insertion-loss-coupled", side: "max", basis: "test", step: 0.1 },
  { row: "amplitude-balance", side: "symmetric", basis: "test", step: 0.1 },
  { row: "phase-balance", side: "symmetric", basis: "test", step: 0.5 },
  { row: isolationRow, side: "min", basis: "test", step: 1 },
  { row: "vswr", side: "max", basis: "characterization", step: 0.05 },
];
const networkUncertainty = { "insertion-loss": 0.08, "amplitude-balance": 0.08, "phase-balance": 0.8, isolation: 0.3 };

/** A doubler's features at its stated per-port drive (the device's key drive, at which its sheet holds the rows). */
const doublerFeatures = (driveDbm: number) =>
  `- Conversion loss below {conversion-loss-at-drive.max} dB at ${formatDrive(driveDbm)} per port, tested on every unit\n- Fundamental suppression above {fundamental-suppression.min} dBc\n- Passive: no DC supply`;
const doublerFixture =
  "Units are soldered to a 0.508 mm laminate fixture with SMA launches. Both device ports are fed from one signal generator through a two-way in-phase splitter; its 0.4 dB excess loss and the 0.6 dB cable loss are taken out of the stated drive. Output orders 1 to 4 are read on a spectrum analyzer. Reference impedance 50 Ω.";
/** The lab's words for the same rows: what the units it measured showed, no test of every unit. */
const labDoublerFeatures = (driveDbm: number) =>
  `- Conversion loss of the units measured below {conversion-loss-at-drive.max} dB at ${formatDrive(driveDbm)} per port\n- Fundamental suppression above {fundamental-suppression.min} dBc`;
const mixerFeatures = "- Conversion loss below {conversion-loss-worst.max} dB across the band\n- LO-to-RF isolation above {isolation-lo-rf.min} dB";
const mixerFixture = (lo: number, ifMHz: number) =>
  `Units are measured on a 50 Ω evaluation board. The RF port is swept at −10 dBm against a +${lo} dBm LO, the IF held at ${ifMHz} MHz; conversion loss and LO leakage at the RF and IF ports are read on a spectrum analyzer, corrected for fixture and cable loss.`;
const hybridFeatures =
  "- Amplitude balance within ±{amplitude-balance.max} dB\n- Phase balance within ±{phase-balance.max}° of 90°\n- Isolation above {isolation-input.min} dB";
const splitterFeatures =
  "- In-phase (0°) two-way split\n- Amplitude balance within ±{amplitude-balance.max} dB\n- Output-to-output isolation above {isolation-outputs.min} dB";

// ─── Files ─────────────────────────────────────────────────────────────────────────────────────────

/** Drive sweeps of `serials` at each input frequency; seeds from the part's base seed, the unit and the frequency. */
function doublerFiles(model: DoublerModel, opts: { serials: string[]; lot: string; inputFrequenciesHz: number[]; measuredOn: string[]; seed: number }): () => DemoCatalogFile[] {
  return () =>
    opts.serials.flatMap((serial, u) =>
      opts.inputFrequenciesHz.map((inputFrequencyHz) => ({
        name: `drive-sweep-${serial.toLowerCase()}-${inputFrequencyHz / MHz}mhz.csv`,
        fields: { measuredOn: opts.measuredOn[u % opts.measuredOn.length] },
        instruments: ["source", "analyzer"],
        // The unit's offsets come from its own seed (the same at every frequency).
        text: doublerDriveSweep(model, { serial, lot: opts.lot, inputFrequencyHz }, opts.seed + u),
      })),
    );
}

/**
 * Each unit's frequency sweep (conversion loss, isolation), two-tone run (IIP3, P1dB) and three-port port match
 * (VSWR): every row the mixer class defines. The two-tone run is at mid-band against the same LO, its IF the
 * sweep's; a diode ring's intercept and compression follow its LO drive, IIP3 ≈ LO + 9 dB and P1dB ≈ LO − 6 dB
 * (common practice for level-7 to level-13 rings, from memory; the KM-7H's are +15.9 and +1 dBm at +7 dBm LO).
 */
function mixerFiles(model: MixerModel, opts: { serials: string[]; lot: string; measuredOn: string[]; seed: number }): () => DemoCatalogFile[] {
  const { start, stop, step } = model.sweepHz;
  const twoTone = {
    conversionGainDb: -(model.conversionLossDb + 0.4),
    iip3Dbm: model.loPowerDbm + 9,
    inputP1dbDbm: model.loPowerDbm - 6,
    loPowerDbm: model.loPowerDbm,
    tone1Hz: start + Math.round((stop - start) / 2 / step) * step,
    toneSpacingHz: 1 * MHz,
    sweepDbm: { start: -20, stop: model.loPowerDbm - 1, step: 2 },
  };
  const portMatch = {
    returnLossDb: { rf: 17, lo: 15, if: 19 },
    balunBandHz: model.balunBandHz,
    isolationDb: { loRf: model.loRfIsolationDb, loIf: model.loIfIsolationDb, rfIf: model.rfIfIsolationDb ?? model.loIfIsolationDb - 7 },
    sweepHz: { start, stop, step: step / 2 },
  };
  return () =>
    opts.serials.flatMap((serial, u): DemoCatalogFile[] => {
      const measuredOn = opts.measuredOn[u % opts.measuredOn.length];
      const name = serial.toLowerCase();
      return [
        { name: `frequency-sweep-${name}.csv`, fields: { measuredOn }, instruments: ["source", "analyzer"], text: mixerFrequencySweep(model, { serial, lot: opts.lot }, opts.seed + u) },
        {
          name: `two-tone-${name}.tsv`,
          fields: { measuredOn, ifFrequencyHz: String(model.ifFrequencyHz) },
          instruments: ["source", "analyzer"],
          text: mixerTwoTone(twoTone, { serial, lot: opts.lot }, opts.seed + 500 + u),
        },
        {
          name: `port-match-${name}.s3p`,
          fields: { serial, lot: opts.lot, temperatureC: "25", measuredOn },
          instruments: ["vna"],
          text: mixerPortMatch(portMatch, { serial }, opts.seed + 900 + u),
        },
      ];
    });
}

function networkFiles(model: NetworkModel, opts: { serials: string[]; lot: string; measuredOn: string[]; seed: number; description: string }): () => DemoCatalogFile[] {
  const extension = model.topology === "branch-line" ? "s4p" : "s3p";
  return () =>
    opts.serials.map((serial, u) => ({
      name: `${model.topology === "branch-line" ? "hybrid" : "splitter"}-${serial.toLowerCase()}.${extension}`,
      fields: { serial, lot: opts.lot, temperatureC: "25", measuredOn: opts.measuredOn[u % opts.measuredOn.length] },
      instruments: ["vna"],
      text: touchstoneFile(model, { serial, description: opts.description }, opts.seed + u),
    }));
}

const serials = (prefix: string, first: number, count: number, digits = 4) =>
  Array.from({ length: count }, (_, i) => `${prefix}${String(first + i).padStart(digits, "0")}`);

// ─── The parts ─────────────────────────────────────────────────────────────────────────────────────

export const demoCatalogParts: DemoCatalogPart[] = [
  {
    org: "kestrine",
    partNumber: "KDX-4G8",
    deviceClass: "frequency-multiplier",
    title: "Passive ×2 frequency multiplier, 2.4–4.8 GHz output",
    description: "Schottky-diode ring doubler for S- and C-band local oscillators.",
    keyConditions: { inputFrequencyHz: { min: 1.2 * GHz, max: 2.4 * GHz }, outputFrequencyHz: { min: 2.4 * GHz, max: 4.8 * GHz }, driveLevelDbm: 10, multiplicationFactor: 2 },
    files: doublerFiles(
      { conversionLossDb: 10.4, optimumDriveDbm: 10, fundamentalRejectionDb: 33, thirdSuppressionDbc: 27, fourthSuppressionDbc: 19, inputBandHz: { min: 1.2 * GHz, max: 2.4 * GHz }, unitSpreadDb: 0.22 },
      { serials: serials("BFD-", 201, 4), lot: "L2609", inputFrequenciesHz: [1.4 * GHz, 1.8 * GHz, 2.2 * GHz], measuredOn: ["2026-09-14", "2026-09-15"], seed: 4801 },
    ),
    limits: doublerLimits,
    prose: {
      description:
        "The **KDX-4G8** doubles a 1.2–2.4 GHz input to 2.4–4.8 GHz. Like the KDX-2G4 it drives a Schottky ring on both ports from one source, so the fundamental and odd orders cancel at the output.\n\nBest conversion is near +10 dBm per port.",
      features: doublerFeatures(10),
      applications: "- Local-oscillator multiplier chains up to 4.8 GHz\n- Frequency extension of synthesizers",
      "test-fixture": doublerFixture,
    },
    absoluteMaximumRatings: [{ label: "RF input power, per port", value: "+20", unit: "dBm" }, ...temperatures("−40 to +85", "−55 to +125"), esd("1A")],
    measurementUncertainty: doublerUncertainty,
    submitNote: "Four units of lot L2609 at 1.4, 1.8 and 2.2 GHz input. Limits from the four-unit spread with the stated uncertainty as guard band.",
    releaseNote: "First release: four units of lot L2609 across the input band.",
  },
  {
    org: "kestrine",
    partNumber: "KDX-1G",
    deviceClass: "frequency-multiplier",
    title: "Passive ×2 frequency multiplier, 0.5–1.2 GHz output",
    description: "Low-drive Schottky-diode ring doubler for UHF clock and LO chains.",
    keyConditions: { inputFrequencyHz: { min: 0.25 * GHz, max: 0.6 * GHz }, outputFrequencyHz: { min: 0.5 * GHz, max: 1.2 * GHz }, driveLevelDbm: 7, multiplicationFactor: 2 },
    files: doublerFiles(
      { conversionLossDb: 9.0, optimumDriveDbm: 7.4, fundamentalRejectionDb: 36, thirdSuppressionDbc: 29, fourthSuppressionDbc: 21, inputBandHz: { min: 0.25 * GHz, max: 0.6 * GHz }, unitSpreadDb: 0.18 },
      { serials: serials("BFD-", 221, 4), lot: "L2608", inputFrequenciesHz: [0.3 * GHz, 0.45 * GHz], measuredOn: ["2026-08-25", "2026-08-26"], seed: 1201 },
    ),
    limits: doublerLimits,
    prose: {
      description: "The **KDX-1G** doubles a 250–600 MHz input to 0.5–1.2 GHz with about +7 dBm per port. No bias supply is needed.",
      features: doublerFeatures(7),
      applications: "- Clock doubling\n- UHF local oscillators",
      "test-fixture": doublerFixture,
    },
    absoluteMaximumRatings: [{ label: "RF input power, per port", value: "+17", unit: "dBm" }, ...temperatures("−40 to +85", "−55 to +125"), esd("1A")],
    measurementUncertainty: doublerUncertainty,
    submitNote: "Four units of lot L2608 at 300 and 450 MHz input.",
    releaseNote: "First release: four units of lot L2608.",
  },
  {
    org: "kestrine",
    partNumber: "KM-10W",
    deviceClass: "double-balanced-mixer",
    title: "Double-balanced mixer, +10 dBm LO, 800–4000 MHz",
    description: "Level 10 passive mixer with wideband transmission-line baluns.",
    keyConditions: { inputFrequencyHz: { min: 0.8 * GHz, max: 4 * GHz }, driveLevelDbm: 10 },
    files: mixerFiles(
      { conversionLossDb: 6.3, balunBandHz: { min: 600 * MHz, max: 4.5 * GHz }, loRfIsolationDb: 44, loIfIsolationDb: 38, rfIfIsolationDb: 30, loPowerDbm: 10, ifFrequencyHz: 140 * MHz, sweepHz: { start: 800 * MHz, stop: 4000 * MHz, step: 100 * MHz }, unitSpreadDb: 0.15 },
      { serials: serials("BFD-", 131, 4), lot: "L2611", measuredOn: ["2026-11-09", "2026-11-10"], seed: 1001 },
    ),
    limits: mixerLimits,
    prose: {
      description: "The **KM-10W** is a level-10 double-balanced mixer for 800–4000 MHz with an IF from DC to 1.5 GHz.",
      features: mixerFeatures,
      applications: "- Microwave up- and down-conversion\n- Phase detection",
      "test-fixture": mixerFixture(10, 140),
    },
    absoluteMaximumRatings: [
      { label: "RF input power", value: "+20", unit: "dBm" },
      { label: "LO input power", value: "+23", unit: "dBm" },
      { label: "IF current", value: "40", unit: "mA" },
      ...temperatures("−40 to +85", "−55 to +100"),
      esd("1A"),
    ],
    measurementUncertainty: mixerUncertainty,
    submitNote: "Four units of lot L2611 across 800–4000 MHz at +10 dBm LO.",
    releaseNote: "First release: four units of lot L2611.",
  },
  {
    org: "kestrine",
    partNumber: "KQH-3G5",
    deviceClass: "quadrature-hybrid",
    title: "90° hybrid coupler, 3.4–3.7 GHz",
    description: "Branch-line quadrature hybrid on low-loss laminate.",
    keyConditions: { inputFrequencyHz: { min: 3.4 * GHz, max: 3.7 * GHz } },
    files: networkFiles(
      { topology: "branch-line", centreHz: 3.55 * GHz, lineLossDb: 0.12, tolerance: { impedanceFraction: 0.008, lengthFraction: 0.005 }, sweepHz: { start: 3.4 * GHz, stop: 3.7 * GHz, step: 15 * MHz } },
      { serials: serials("BFD-", 411, 3), lot: "L2611", measuredOn: ["2026-11-16"], seed: 3501, description: "90-degree branch-line hybrid" },
    ),
    limits: networkLimits("isolation-input"),
    prose: {
      description: "The **KQH-3G5** splits a signal into two outputs of equal amplitude 90° apart over 3.4–3.7 GHz; the fourth port is isolated.",
      features: hybridFeatures,
      applications: "- Balanced amplifiers\n- Image-reject mixers",
      "test-fixture": "Four-port S-parameters from 3.4 to 3.7 GHz on a 50 Ω test board, its lines de-embedded. Port 1 input, 2 through, 3 coupled, 4 isolated.",
    },
    absoluteMaximumRatings: [{ label: "Input power, CW", value: "10", unit: "W" }, ...temperatures("−55 to +85", "−55 to +125"), esd("3B")],
    measurementUncertainty: networkUncertainty,
    submitNote: "Three units of lot L2611, four-port, de-embedded.",
    releaseNote: "First release: three units of lot L2611.",
  },
  {
    org: "pellacourt",
    partNumber: "PX-80",
    deviceClass: "frequency-multiplier",
    title: "×2 multiplier, 4–8 GHz output, +14 dBm per port",
    description: "High-drive diode doubler for C-band local oscillators.",
    keyConditions: { inputFrequencyHz: { min: 2 * GHz, max: 4 * GHz }, outputFrequencyHz: { min: 4 * GHz, max: 8 * GHz }, driveLevelDbm: 14, multiplicationFactor: 2 },
    files: doublerFiles(
      { conversionLossDb: 11.6, optimumDriveDbm: 14, fundamentalRejectionDb: 29, thirdSuppressionDbc: 24, fourthSuppressionDbc: 17, inputBandHz: { min: 2 * GHz, max: 4 * GHz }, unitSpreadDb: 0.3 },
      { serials: serials("PX-", 1101, 3), lot: "P-26A", inputFrequenciesHz: [2.5 * GHz, 3 * GHz, 3.5 * GHz], measuredOn: ["2026-10-19", "2026-10-20"], seed: 8001 },
    ),
    limits: doublerLimits,
    prose: {
      description: "The **PX-80** doubles 2–4 GHz to 4–8 GHz. A high-barrier diode ring takes +14 dBm per port for its best conversion.",
      features: doublerFeatures(14),
      applications: "- C-band local oscillators\n- Test-equipment frequency extension",
      "test-fixture": doublerFixture,
    },
    absoluteMaximumRatings: [{ label: "RF input power, per port", value: "+24", unit: "dBm" }, ...temperatures("−40 to +85", "−55 to +125"), esd("1A")],
    measurementUncertainty: doublerUncertainty,
    submitNote: "Three units of lot P-26A at 2.5, 3 and 3.5 GHz input.",
    releaseNote: "First release: three units of lot P-26A.",
  },
  {
    org: "pellacourt",
    partNumber: "PM-7L",
    deviceClass: "double-balanced-mixer",
    title: "Double-balanced mixer, +7 dBm LO, 50–1500 MHz",
    description: "Level 7 mixer with ferrite transformers for VHF and UHF.",
    keyConditions: { inputFrequencyHz: { min: 50 * MHz, max: 1.5 * GHz }, driveLevelDbm: 7 },
    files: mixerFiles(
      { conversionLossDb: 5.6, balunBandHz: { min: 15 * MHz, max: 1.9 * GHz }, loRfIsolationDb: 64, loIfIsolationDb: 55, rfIfIsolationDb: 45, loPowerDbm: 7, ifFrequencyHz: 10.7 * MHz, sweepHz: { start: 50 * MHz, stop: 1500 * MHz, step: 50 * MHz }, unitSpreadDb: 0.12 },
      { serials: serials("PM-", 2201, 4), lot: "P-26B", measuredOn: ["2026-10-26"], seed: 7001 },
    ),
    limits: mixerLimits,
    prose: {
      description: "The **PM-7L** is a level-7 double-balanced mixer for 50–1500 MHz with ferrite-cored transformers and a matched diode quad.",
      features: mixerFeatures,
      applications: "- VHF and UHF receivers\n- Low-frequency phase detection",
      "test-fixture": mixerFixture(7, 10.7),
    },
    absoluteMaximumRatings: [
      { label: "RF input power", value: "+17", unit: "dBm" },
      { label: "LO input power", value: "+20", unit: "dBm" },
      { label: "IF current", value: "40", unit: "mA" },
      ...temperatures("−40 to +85", "−55 to +100"),
      esd("1B"),
    ],
    measurementUncertainty: mixerUncertainty,
    submitNote: "Four units of lot P-26B across 50–1500 MHz.",
    releaseNote: "First release: four units of lot P-26B.",
  },
  {
    org: "pellacourt",
    partNumber: "PS-900",
    deviceClass: "quadrature-hybrid",
    title: "Two-way 0° Wilkinson splitter, 800–1000 MHz",
    description: "In-phase quarter-wave splitter with an isolation resistor.",
    keyConditions: { inputFrequencyHz: { min: 0.8 * GHz, max: 1 * GHz } },
    files: networkFiles(
      { topology: "wilkinson", centreHz: 0.9 * GHz, lineLossDb: 0.1, tolerance: { impedanceFraction: 0.012, lengthFraction: 0.008 }, sweepHz: { start: 0.8 * GHz, stop: 1 * GHz, step: 10 * MHz } },
      { serials: serials("PS-", 301, 4), lot: "P-26C", measuredOn: ["2026-11-02"], seed: 9001, description: "two-way Wilkinson splitter" },
    ),
    limits: networkLimits("isolation-outputs"),
    prose: {
      description: "The **PS-900** splits a signal into two in-phase outputs of equal amplitude over 800–1000 MHz; its resistor isolates the outputs from each other.",
      features: splitterFeatures,
      applications: "- Local-oscillator distribution\n- Feeding both ports of a mixer used as a doubler",
      "test-fixture": "Three-port S-parameters from 0.8 to 1.0 GHz on a 50 Ω test board, its lines de-embedded. Port 1 common, ports 2 and 3 outputs.",
    },
    absoluteMaximumRatings: [{ label: "Input power, CW", value: "2", unit: "W" }, ...temperatures("−55 to +85", "−55 to +125"), esd("2")],
    measurementUncertainty: networkUncertainty,
    submitNote: "Four units of lot P-26C, three-port, de-embedded.",
    releaseNote: "First release: four units of lot P-26C.",
  },
  {
    org: "wrenfield-lab",
    partNumber: "WL-C2620-X2",
    deviceClass: "frequency-multiplier",
    title: "Independent characterization: ×2 multiplier, 3–6 GHz output, lot 2620",
    description: "Third-party characterization of a customer's diode doubler, lot 2620.",
    keyConditions: { inputFrequencyHz: { min: 1.5 * GHz, max: 3 * GHz }, outputFrequencyHz: { min: 3 * GHz, max: 6 * GHz }, driveLevelDbm: 12, multiplicationFactor: 2 },
    files: doublerFiles(
      { conversionLossDb: 10.9, optimumDriveDbm: 12, fundamentalRejectionDb: 31, thirdSuppressionDbc: 26, fourthSuppressionDbc: 18, inputBandHz: { min: 1.5 * GHz, max: 3 * GHz }, unitSpreadDb: 0.25 },
      { serials: serials("WL-2620-", 1, 3, 2), lot: "2620", inputFrequenciesHz: [2 * GHz, 2.5 * GHz], measuredOn: ["2026-11-18", "2026-11-19"], seed: 2620 },
    ),
    limits: labLimits(doublerLimits),
    prose: {
      description:
        "An independent characterization by Wrenfield RF Test Laboratory of three units of a customer's diode doubler, lot 2620, at 2.0 and 2.5 GHz input.\n\nThe figures describe the units tested. They are not the maker's guarantees.",
      features: labDoublerFeatures(12),
      "test-fixture": doublerFixture,
    },
    absoluteMaximumRatings: [{ label: "RF input power, per port", value: "+20", unit: "dBm" }, ...temperatures("−40 to +85", "−55 to +125"), esd("1A")],
    measurementUncertainty: { "conversion-loss": 0.4, "harmonic-suppression": 0.3 },
    submitNote: "Three units of lot 2620 at two input frequencies.",
    releaseNote: "First release: three units of lot 2620.",
    issueReasons: labIssueReasons,
  },
  {
    org: "wrenfield-lab",
    partNumber: "WL-C2622-M7",
    deviceClass: "double-balanced-mixer",
    title: "Independent characterization: +7 dBm LO mixer, 1–2.5 GHz, lot 2622",
    description: "Third-party characterization of a customer's level-7 mixer, lot 2622.",
    keyConditions: { inputFrequencyHz: { min: 1 * GHz, max: 2.5 * GHz }, driveLevelDbm: 7 },
    files: mixerFiles(
      { conversionLossDb: 6.8, balunBandHz: { min: 700 * MHz, max: 2.8 * GHz }, loRfIsolationDb: 40, loIfIsolationDb: 35, rfIfIsolationDb: 28, loPowerDbm: 7, ifFrequencyHz: 70 * MHz, sweepHz: { start: 1000 * MHz, stop: 2500 * MHz, step: 100 * MHz }, unitSpreadDb: 0.2 },
      { serials: serials("WL-2622-", 1, 3, 2), lot: "2622", measuredOn: ["2026-11-20"], seed: 2622 },
    ),
    limits: labLimits(mixerLimits),
    prose: {
      description:
        "An independent characterization by Wrenfield RF Test Laboratory of three units of a customer's level-7 mixer, lot 2622.\n\nThe figures describe the units tested. They are not the maker's guarantees.",
      features: mixerFeatures,
      "test-fixture": mixerFixture(7, 70),
    },
    absoluteMaximumRatings: [
      { label: "RF input power", value: "+17", unit: "dBm" },
      { label: "LO input power", value: "+20", unit: "dBm" },
      { label: "IF current", value: "40", unit: "mA" },
      ...temperatures("−40 to +85", "−55 to +100"),
      esd("1A"),
    ],
    measurementUncertainty: { "conversion-loss": 0.4, isolation: 1 },
    submitNote: "Three units of lot 2622 across 1.0–2.5 GHz.",
    releaseNote: "First release: three units of lot 2622.",
    issueReasons: labIssueReasons,
  },
  {
    org: "wrenfield-lab",
    partNumber: "WL-C2625-QH",
    deviceClass: "quadrature-hybrid",
    title: "Independent characterization: 90° hybrid, 1.2–1.4 GHz, lot 2625",
    description: "Third-party characterization of a customer's branch-line hybrid, lot 2625.",
    keyConditions: { inputFrequencyHz: { min: 1.2 * GHz, max: 1.4 * GHz } },
    files: networkFiles(
      { topology: "branch-line", centreHz: 1.3 * GHz, lineLossDb: 0.08, tolerance: { impedanceFraction: 0.01, lengthFraction: 0.006 }, sweepHz: { start: 1.2 * GHz, stop: 1.4 * GHz, step: 10 * MHz } },
      { serials: serials("WL-2625-", 1, 3, 2), lot: "2625", measuredOn: ["2026-11-24"], seed: 2625, description: "90-degree branch-line hybrid" },
    ),
    limits: labLimits(networkLimits("isolation-input")),
    prose: {
      description:
        "An independent characterization by Wrenfield RF Test Laboratory of three units of a customer's branch-line hybrid, lot 2625, over 1.2–1.4 GHz.\n\nThe figures describe the units tested. They are not the maker's guarantees.",
      features: hybridFeatures,
      "test-fixture": "Four-port S-parameters from 1.2 to 1.4 GHz on the customer's 50 Ω board, its lines de-embedded. Port 1 input, 2 through, 3 coupled, 4 isolated.",
    },
    absoluteMaximumRatings: [{ label: "Input power, CW", value: "5", unit: "W" }, ...temperatures("−55 to +85", "−55 to +125"), esd("3A")],
    measurementUncertainty: networkUncertainty,
    submitNote: "Three units of lot 2625, four-port.",
    releaseNote: "First release: three units of lot 2625.",
    issueReasons: labIssueReasons,
  },
];
