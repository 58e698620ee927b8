/**
 * What the UI and the datasheet show for each machine name of a derived parameter. `label` is the
 * parameter's one name, in the trade's words: every surface takes it through lib/domain/parameter-names.ts
 * (which composes a row's order, path and qualifiers onto it); nothing else spells it.
 */
export interface ParameterDescription {
  label: string;
  unit: string;
  description: string;
}

export const parameterCatalog = {
  "conversion-loss": {
    label: "Conversion loss",
    unit: "dB",
    description:
      "P_in − P_out of the wanted output, positive for a lossy device (Wentworth, Applied Electromagnetics, eq. 10.87). " +
      "Drive sweeps refer P_in to the power reaching the device ports together (source power less splitter excess and cable loss); " +
      "at drive \"optimum\" it is the parabolic minimum between sweep steps. Frequency sweeps give min, typ (median) and max over the band.",
  },
  "optimum-drive": {
    label: "Optimum drive",
    unit: "dBm",
    description:
      "Per-port drive of lowest conversion loss: vertex of the parabola through the best step and its neighbours. " +
      "Per-port drive = source power − 10·log10(ways) − splitter excess loss − cable loss (common practice).",
  },
  "harmonic-suppression": {
    label: "Harmonic suppression",
    unit: "dBc",
    description:
      "P_wanted − P_order at the measured step nearest the optimum drive; positive means the order lies below the wanted output.",
  },
  "input-p1db": {
    label: "Input P1dB",
    unit: "dBm",
    description:
      "Input where gain (−conversion loss for a converter) is 1 dB below its small-signal value, interpolated between the straddling steps " +
      "(Kundert, The Designer's Guide). The small-signal gain is the mean of the leading steps within 0.1 dB of the first (\"reference points\"), " +
      "or the gain at the reference drive the engineer stated; a sweep whose second step already differs by more is warned about. " +
      "Empty when the sweep does not reach it.",
  },
  "output-p1db": {
    label: "Output P1dB",
    unit: "dBm",
    description: "Output at the input 1 dB compression point: input + small-signal gain − 1 dB.",
  },
  iip3: {
    label: "Input IP3",
    unit: "dBm",
    description:
      "Per-tone input intercept (Kundert): \"slope-fit\" meets least-squares lines of slope 1 and 3 over the small-signal points; " +
      "\"single-point\" is P_in + ΔIM/2 at the lowest drive, as a cross-check.",
  },
  oip3: {
    label: "Output IP3",
    unit: "dBm",
    description: "Per-tone output intercept: OIP3 = P_out + ΔIM/2 (Kundert); for a mixer IIP3 = OIP3 + CL.",
  },
  "fundamental-slope": {
    label: "Tone output slope",
    unit: "dB/dB",
    description: "Free least-squares slope of the tone output over the fitted points; 1 in the small-signal region.",
  },
  "im3-slope": {
    label: "IM3 slope",
    unit: "dB/dB",
    description: "Free least-squares slope of the third-order product over the fitted points; 3 in the small-signal region.",
  },
  "delta-im": {
    label: "Intermodulation ratio ΔIM",
    unit: "dB",
    description: "P_out,tone − P_IM3 at one input level per tone.",
  },
  "im3-predicted": {
    label: "Third-order product, predicted",
    unit: "dBm",
    description:
      "From OIP3 and the two tone levels: P(2f1−f2) = 2·P1 + P2 − 2·OIP3 and P(2f2−f1) = P1 + 2·P2 − 2·OIP3 " +
      "(the cubic model; Razavi, RF Microelectronics, §2.2). Given when the file states tone 2's level relative to tone 1.",
  },
  "mismatch-loss": {
    label: "Mismatch loss",
    unit: "dB",
    description: "−10·log10(1 − |Sii|²), the power a port reflects (Pozar §2.3); \"worst\" is the highest over the band.",
  },
  "spot-phase-noise": {
    label: "Phase noise",
    unit: "dBc/Hz",
    description:
      "Single-sideband L(f) = ½·Sφ(f) (IEEE Std 1139-2008) at a decade offset, log-log interpolated between trace points.",
  },
  "integrated-phase-noise": {
    label: "Integrated phase noise",
    unit: "dBc",
    description:
      "∫ L(f) df between the stated offsets, each segment a power law (IEEE Std 1139-2008; the method of MathWorks phaseNoiseToJitter). Spurs are included.",
  },
  "rms-phase-error": {
    label: "RMS phase error",
    unit: "deg",
    description: "φrms = √(2·∫L(f)df), both sidebands, in degrees, over the integration band printed beside it.",
  },
  "rms-jitter": {
    label: "RMS jitter",
    unit: "fs",
    description: "σt = φrms / (2π·f0) over the integration band printed beside it, in femtoseconds.",
  },
  "excess-over-ideal-multiplication": {
    label: "Excess over ideal ×N",
    unit: "dB",
    description: "L_out − (L_in + 20·log10 N) at an offset: what the multiplier adds beyond an ideal ×N. Needs an input reference trace.",
  },
  "ideal-multiplication-penalty": {
    label: "Ideal multiplication penalty",
    unit: "dB",
    description: "20·log10 N, the rise of L(f) through an ideal ×N; information only when no input reference is given.",
  },
  "noise-floor": {
    label: "Far-out noise floor",
    unit: "dBc/Hz",
    description: "Median L(f) over the trace's last decade of offset (the last fifth of its log-offset span when that is shorter).",
  },
  "noise-floor-above-kt": {
    label: "Far-out noise floor above kT",
    unit: "dB",
    description:
      "Far-out floor minus the thermal phase-noise floor kT − 3.01 dB − P_carrier, with kT = 10·log10(k·T/1 mW) " +
      "(−173.975 dBm/Hz at 290 K, the trade's −174 dBm/Hz) and half of additive thermal noise taken as PM (L = Sφ/2).",
  },
  spur: {
    label: "Spur as plotted",
    unit: "dBc/Hz",
    description:
      "Discrete spur: trace peak as plotted, more than the threshold above the running median of its neighbours (±0.15 decade). " +
      "Given only when no bandwidth is stated: its power in dBc depends on the bandwidth the analyzer normalised the trace with.",
  },
  "discrete-spur": {
    label: "Discrete spur",
    unit: "dBc",
    description:
      "A discrete spur's power relative to the carrier: the plotted peak plus 10·log10(B), B the analyzer's equivalent noise bandwidth at its offset " +
      "(a stated 3 dB resolution bandwidth × 1.0645, an ideal Gaussian filter's ratio; Keysight AN 150). Found as for \"Spur as plotted\".",
  },
  "worst-discrete-spur": {
    label: "Worst discrete spur",
    unit: "dBc",
    description: "The highest discrete spur in dBc over the offsets searched (the trace's span); a trace with no spur above the threshold gives none.",
  },
  "return-loss": {
    label: "Return loss",
    unit: "dB",
    description: "−20·log10|Sii| (Pozar, Microwave Engineering §2.3); \"worst\" is the lowest over the band.",
  },
  vswr: {
    label: "VSWR",
    unit: ":1",
    description: "(1+|Sii|)/(1−|Sii|) (Pozar §2.3); \"worst\" is the highest over the band.",
  },
  "insertion-loss": {
    label: "Insertion loss",
    unit: "dB",
    description: "−20·log10|Sji| of a transmission path, including the ideal split; \"worst\" is the highest over the band.",
  },
  isolation: {
    label: "Isolation",
    unit: "dB",
    description:
      "−20·log10|Sji| between ports meant to be isolated (Touchstone), or the measured isolation path of a mixer; the lowest over the band.",
  },
  "amplitude-balance": {
    label: "Amplitude balance",
    unit: "dB",
    description: "20·log10|S_A1| − 20·log10|S_B1| between the two outputs; \"worst\" is the largest magnitude over the band, sign kept.",
  },
  "phase-balance": {
    label: "Phase balance",
    unit: "deg",
    description:
      "(∠S_A1 − ∠S_B1) − nominal (90° for a quadrature hybrid, 0° for a splitter), unwrapped along frequency; \"worst\" is the largest magnitude, sign kept.",
  },
} as const satisfies Record<string, ParameterDescription>;

export type ParameterName = keyof typeof parameterCatalog;
