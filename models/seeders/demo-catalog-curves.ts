/**
 * Bench files for the demo catalog's invented parts, generated from simple physical models with a
 * fixed seed: each unit draws its own offsets (the unit-to-unit spread), each reading a little
 * measurement noise. The files are in the formats of fixtures/FORMATS.md and go through the same
 * bench upload as a real bench's files.
 *
 * - Doublers: a balanced diode doubler's output at twice the input, square law (2 dB per dB) below
 *   the optimum drive and flattening above it; the fundamental and the odd orders leak through
 *   the balance, the fourth order follows the wanted one.
 * - Mixers: conversion loss rising at both ends of the balun's band, LO isolation falling with
 *   frequency; a two-tone sweep from a fixed intercept with a soft compression; the three ports'
 *   match as a three-port Touchstone file.
 * - Over temperature (a file's temperatureC, 25 °C when absent, where the models above are
 *   unchanged): the coefficients below, each with its basis.
 * - Quadrature hybrids and in-phase splitters: the branch-line coupler and the Wilkinson divider
 *   as networks of lossy transmission lines (and the Wilkinson's resistor), solved exactly at each
 *   frequency (nodal admittance matrix, then S = (I − z0·Y)(I + z0·Y)⁻¹). Each unit's line
 *   impedances and lengths are off by a fraction of a percent, which is what gives a real part
 *   its finite isolation and its imbalance.
 */
import { mulberry32 } from "../../lib/stats/seeded-random";

type Random = () => number;

/** A uniform draw in [−half, +half]. */
const spread = (rand: Random, half: number) => (rand() * 2 - 1) * half;
/** A roughly normal draw (Irwin–Hall sum of four uniforms), standard deviation `sigma`. */
const gauss = (rand: Random, sigma: number) => ((rand() + rand() + rand() + rand() - 2) / Math.sqrt(4 / 12)) * sigma;

// ─── Temperature ───────────────────────────────────────────────────────────────────────────────────
// Values from memory of the usual handbook and datasheet figures, not from one published table.

/**
 * A Schottky diode's forward voltage at constant current falls by about 1 to 2 mV/°C (the usual
 * handbook figure for silicon Schottky barriers); the middle of that range is used.
 */
export const SCHOTTKY_FORWARD_VOLTAGE_MV_PER_C = -1.5;
/**
 * Rise of a diode ring's conversion loss with temperature at its optimum drive (series resistance
 * and the diodes' saturation current grow): about 0.5 dB from −40 to +85 °C on passive diode mixer and
 * doubler datasheets, common practice.
 */
export const DIODE_CONVERSION_LOSS_DB_PER_C = 0.006;
/** Isolation falls slightly as the ring's diodes drift apart when hot: a few tenths of a dB over the range, common practice. */
export const ISOLATION_DB_PER_C = -0.008;

/**
 * How far a diode ring's optimum drive moves at `temperatureC`: two diodes conduct in series in each
 * half-cycle, so the peak voltage that turns the ring fully on moves by 2·dVf/dT·ΔT against the peak
 * voltage of the optimum drive into 50 Ω; in dB.
 */
export function optimumDriveShiftDb(optimumDriveDbm: number, temperatureC: number): number {
  const peakVolts = Math.sqrt(2 * 50 * 10 ** ((optimumDriveDbm - 30) / 10));
  const turnOnShiftVolts = (2 * SCHOTTKY_FORWARD_VOLTAGE_MV_PER_C * (temperatureC - 25)) / 1000;
  return 20 * Math.log10(1 + turnOnShiftVolts / peakVolts);
}

const temperatureLine = (temperatureC: number | undefined) => `# temperature: ${temperatureC ?? 25} C`;

// ─── Doublers ──────────────────────────────────────────────────────────────────────────────────────

export interface DoublerModel {
  /** Conversion loss at the optimum drive, at the band centre (dB). */
  conversionLossDb: number;
  /** Optimum drive per port (dBm). */
  optimumDriveDbm: number;
  /** Fundamental leak below the per-port drive (dB): the balance of the ring and the balun. */
  fundamentalRejectionDb: number;
  /** Suppression of the 3rd and 4th order relative to the wanted 2nd at the optimum drive (dBc). */
  thirdSuppressionDbc: number;
  fourthSuppressionDbc: number;
  /** Input band (Hz): the loss rises towards its ends. */
  inputBandHz: { min: number; max: number };
  /** Unit-to-unit standard deviation of the conversion loss (dB). */
  unitSpreadDb: number;
}

export interface DriveSweepFile {
  serial: string;
  lot: string;
  inputFrequencyHz: number;
  /** Ambient temperature of the measurement (°C); 25 when absent. */
  temperatureC?: number;
  /** Total source power swept (dBm, 1 dB steps); 12 dB below to 8 dB above the optimum's when absent. */
  sourceSweepDbm?: { start: number; stop: number };
}

const splitterExcessLossDb = 0.4;
const cableLossDb = 0.6;
/** The ideal two-way split, 10·log10(2) dB. */
const idealSplitDb = 10 * Math.log10(2);

/**
 * The loss's shape against drive, `b` dB below the knee: square law below it (the loss falls 1 dB
 * per dB of drive, the output rises 2), a soft knee, and a slow rise above it as the diodes saturate.
 */
const doublerLossShape = (b: number) => 10 * Math.log10(1 + 10 ** (b / 10)) + 0.05 * Math.max(0, -b) ** 2;

/** Where the shape has its minimum (found once on a 0.01 dB grid), so that the optimum drive and its loss are the model's. */
const knee = (() => {
  let best = { atDb: 0, lossDb: doublerLossShape(0) };
  for (let b = -10; b <= 10; b += 0.01) if (doublerLossShape(b) < best.lossDb) best = { atDb: b, lossDb: doublerLossShape(b) };
  return best;
})();

/**
 * One unit's drive sweep at one input frequency: total source power in 1 dB steps from 12 dB
 * below to 8 dB above the drive that puts the optimum on each port.
 */
export function doublerDriveSweep(model: DoublerModel, file: DriveSweepFile, seed: number): string {
  const unit = mulberry32(seed);
  const clOffset = gauss(unit, model.unitSpreadDb);
  const optOffset = gauss(unit, 0.3);
  const rejOffset = gauss(unit, 1.2);
  const h3Offset = gauss(unit, 0.8);
  const h4Offset = gauss(unit, 0.8);
  const noise = mulberry32(seed * 7919 + Math.round(file.inputFrequencyHz / 1e6));

  const { min, max } = model.inputBandHz;
  const centre = (min + max) / 2;
  const edge = (file.inputFrequencyHz - centre) / ((max - min) / 2); // −1 … +1 across the band
  const dT = (file.temperatureC ?? 25) - 25;
  const clMin = model.conversionLossDb + clOffset + 0.9 * edge * edge + DIODE_CONVERSION_LOSS_DB_PER_C * dT;
  const pOpt = model.optimumDriveDbm + optOffset + 0.4 * edge + optimumDriveShiftDb(model.optimumDriveDbm, file.temperatureC ?? 25);
  const rejection = model.fundamentalRejectionDb + rejOffset - 3 * edge * edge;

  const referredDb = idealSplitDb + splitterExcessLossDb + cableLossDb;
  const first = file.sourceSweepDbm?.start ?? Math.round(pOpt + referredDb - 12);
  const last = file.sourceSweepDbm?.stop ?? first + 20;
  const rows: string[] = [];
  for (let total = first; total <= last; total++) {
    const perPort = total - referredDb;
    const below = pOpt - perPort;
    const cl = clMin + doublerLossShape(below + knee.atDb) - knee.lossDb;
    const p2 = perPort + idealSplitDb - cl + gauss(noise, 0.04);
    const p1 = perPort - rejection + gauss(noise, 0.25);
    const p3 = p2 - (model.thirdSuppressionDbc + h3Offset + 0.6 * Math.max(0, below)) + gauss(noise, 0.3);
    const p4 = p2 - (model.fourthSuppressionDbc + h4Offset + 0.3 * Math.max(0, below)) + gauss(noise, 0.3);
    rows.push([total, p1, p2, p3, p4].map((v) => v.toFixed(2)).join(","));
  }
  return [
    "# kind: drive-sweep",
    `# serial: ${file.serial}`,
    `# lot: ${file.lot}`,
    `# input_frequency: ${file.inputFrequencyHz / 1e9} GHz`,
    "# wanted_order: 2",
    `# splitter_excess_loss: ${splitterExcessLossDb} dB`,
    `# cable_loss: ${cableLossDb} dB`,
    temperatureLine(file.temperatureC),
    "input_power [dBm],p1_out [dBm],p2_out [dBm],p3_out [dBm],p4_out [dBm]",
    ...rows,
    "",
  ].join("\n");
}

// ─── Mixers ────────────────────────────────────────────────────────────────────────────────────────

export interface MixerModel {
  /** Mid-band conversion loss (dB). */
  conversionLossDb: number;
  /** The balun's band (Hz): the loss rises towards and beyond its ends. */
  balunBandHz: { min: number; max: number };
  /** LO-to-RF and LO-to-IF isolation at the low end of the sweep (dB). */
  loRfIsolationDb: number;
  loIfIsolationDb: number;
  /** RF-to-IF isolation at the low end of the sweep (dB); no RF–IF column when absent. */
  rfIfIsolationDb?: number;
  loPowerDbm: number;
  ifFrequencyHz: number;
  /** Swept RF band (Hz) and step. */
  sweepHz: { start: number; stop: number; step: number };
  unitSpreadDb: number;
}

/** One unit's conversion loss and isolations against RF frequency at the stated LO drive. */
export function mixerFrequencySweep(model: MixerModel, file: { serial: string; lot: string; temperatureC?: number }, seed: number): string {
  const unit = mulberry32(seed);
  const clOffset = gauss(unit, model.unitSpreadDb);
  const loRfOffset = gauss(unit, 1.5);
  const loIfOffset = gauss(unit, 1.5);
  const ripplePhase = unit() * 2 * Math.PI;
  // Drawn after the others, so that a model without RF–IF isolation writes what it always wrote.
  const rfIfOffset = model.rfIfIsolationDb === undefined ? 0 : gauss(unit, 1.5);
  const dT = (file.temperatureC ?? 25) - 25;
  const noise = mulberry32(seed * 104729 + (file.temperatureC === undefined ? 0 : Math.round(file.temperatureC) + 1000));
  const { min, max } = model.balunBandHz;
  const { start, stop, step } = model.sweepHz;
  const rows: string[] = [];
  for (let f = start; f <= stop + step / 2; f += step) {
    // The balun's low-frequency roll-off (its magnetising inductance) and high-end loss.
    const rollOff = 10 * Math.log10(1 + (min / f) ** 2) + 10 * Math.log10(1 + (f / max) ** 4);
    const ripple = 0.12 * Math.sin((2 * Math.PI * f) / (0.35 * (max - min)) + ripplePhase);
    const cl = model.conversionLossDb + clOffset + rollOff + ripple + gauss(noise, 0.03) + DIODE_CONVERSION_LOSS_DB_PER_C * dT;
    // Coupling through the balun's imbalance grows about 6 dB per octave above the low end.
    const coupling = 10 * Math.log10(1 + (f / (4 * min)) ** 2);
    const isolationDrift = ISOLATION_DB_PER_C * dT;
    const loRf = model.loRfIsolationDb + loRfOffset - coupling + gauss(noise, 0.3) + isolationDrift;
    const loIf = model.loIfIsolationDb + loIfOffset - 0.8 * coupling + gauss(noise, 0.3) + isolationDrift;
    const row = [(f / 1e6).toFixed(0), cl.toFixed(2), loRf.toFixed(2), loIf.toFixed(2)];
    if (model.rfIfIsolationDb !== undefined) row.push((model.rfIfIsolationDb + rfIfOffset - 0.6 * coupling + gauss(noise, 0.3) + isolationDrift).toFixed(2));
    rows.push(row.join(","));
  }
  return [
    "# kind: frequency-sweep",
    `# serial: ${file.serial}`,
    `# lot: ${file.lot}`,
    `# lo_power: ${model.loPowerDbm} dBm`,
    `# if_frequency: ${model.ifFrequencyHz / 1e6} MHz`,
    temperatureLine(file.temperatureC),
    `frequency [MHz],conversion_loss [dB],isolation_lo_rf [dB],isolation_lo_if [dB]${model.rfIfIsolationDb === undefined ? "" : ",isolation_rf_if [dB]"}`,
    ...rows,
    "",
  ].join("\n");
}

export interface MixerTwoToneModel {
  /** Conversion gain at the tone frequency (dB, negative for a lossy mixer). */
  conversionGainDb: number;
  /** Input third-order intercept per tone (dBm). */
  iip3Dbm: number;
  /** Input 1 dB compression per tone (dBm). */
  inputP1dbDbm: number;
  loPowerDbm: number;
  tone1Hz: number;
  toneSpacingHz: number;
  /** Input per tone (dBm): start, stop, step. */
  sweepDbm: { start: number; stop: number; step: number };
}

/**
 * One unit's two-tone sweep: the tone output follows the conversion gain and compresses softly (the
 * gain falls by 1 dB at the unit's P1dB, quadratically from 7.07 dB below it), the third-order product
 * rises 3 dB per dB from the intercept: P_IM3 = 3·P_out − 2·OIP3 (the standard intercept relation).
 */
export function mixerTwoTone(model: MixerTwoToneModel, file: { serial: string; lot: string }, seed: number): string {
  const unit = mulberry32(seed);
  const iip3 = model.iip3Dbm + gauss(unit, 0.5);
  const p1db = model.inputP1dbDbm + gauss(unit, 0.3);
  const gain = model.conversionGainDb + gauss(unit, 0.15);
  const noise = mulberry32(seed * 6151);
  const knee = p1db - Math.sqrt(50);
  const oip3 = iip3 + gain;
  const rows: string[] = [];
  const { start, stop, step } = model.sweepDbm;
  for (let p = start; p <= stop + step / 2; p += step) {
    const tone = p + gain - 0.02 * Math.max(0, p - knee) ** 2 + gauss(noise, 0.02);
    const im3 = 3 * tone - 2 * oip3 + gauss(noise, 0.1);
    rows.push([p, tone, im3].map((v) => v.toFixed(2)).join("\t"));
  }
  return [
    "# kind: two-tone",
    `# serial: ${file.serial}`,
    `# lot: ${file.lot}`,
    `# tone1_frequency: ${model.tone1Hz / 1e6} MHz`,
    `# tone2_frequency: ${(model.tone1Hz + model.toneSpacingHz) / 1e6} MHz`,
    `# lo_power: ${model.loPowerDbm} dBm`,
    "# temperature: 25 C",
    "input_power [dBm]\tfund_out [dBm]\tim3_out [dBm]",
    ...rows,
    "",
  ].join("\n");
}

export interface MixerPortMatchModel {
  /** Best return loss of the RF, LO and IF ports in their band (dB, positive). */
  returnLossDb: { rf: number; lo: number; if: number };
  /** The balun's band (Hz): RF and LO match worsens towards and beyond its ends; the IF port is matched at low frequencies. */
  balunBandHz: { min: number; max: number };
  /** LO–RF, LO–IF and RF–IF leakage at the low end (dB, positive), as in the frequency sweep. */
  isolationDb: { loRf: number; loIf: number; rfIf: number };
  sweepHz: { start: number; stop: number; step: number };
}

/**
 * One unit's port match as a three-port Touchstone file (dB/angle), port 1 RF, 2 LO, 3 IF, each port
 * measured with the others terminated in 50 Ω (the LO off). Reflection: the best return loss of the port,
 * worsening 3 dB per factor of two outside the balun's band (RF, LO) or above its top end (IF). The
 * off-diagonal terms are the leakage paths, small and reciprocal.
 */
export function mixerPortMatch(model: MixerPortMatchModel, file: { serial: string }, seed: number): string {
  const unit = mulberry32(seed);
  const offsets = [gauss(unit, 1), gauss(unit, 1), gauss(unit, 1)];
  const noise = mulberry32(seed * 7727);
  const { min, max } = model.balunBandHz;
  const lines = [
    `! Benchfold demo: double-balanced mixer port match, serial ${file.serial} (invented data)`,
    "! ports: 1 RF, 2 LO, 3 IF; LO off, the other ports terminated in 50 ohm",
    "# GHz S DB R 50",
  ];
  const { start, stop, step } = model.sweepHz;
  for (let f = start; f <= stop + step / 2; f += step) {
    const outside = 10 * Math.log10(1 + (min / f) ** 2) + 10 * Math.log10(1 + (f / max) ** 2);
    const rf = -(model.returnLossDb.rf + offsets[0] - outside);
    const lo = -(model.returnLossDb.lo + offsets[1] - outside);
    const ifPort = -(model.returnLossDb.if + offsets[2] - 10 * Math.log10(1 + (f / max) ** 2));
    const coupling = 10 * Math.log10(1 + (f / (4 * min)) ** 2);
    const loRf = -(model.isolationDb.loRf - coupling);
    const loIf = -(model.isolationDb.loIf - 0.8 * coupling);
    const rfIf = -(model.isolationDb.rfIf - 0.6 * coupling);
    const angle = (k: number) => (((-57 * (f / 1e9) * (k + 1) + 180) % 360) + 360) % 360 - 180;
    const cell = (db: number, k: number) => `${(db + gauss(noise, 0.05)).toFixed(3)} ${angle(k).toFixed(2)}`;
    const rows = [
      [cell(rf, 0), cell(loRf, 3), cell(rfIf, 4)],
      [cell(loRf, 3), cell(lo, 1), cell(loIf, 5)],
      [cell(rfIf, 4), cell(loIf, 5), cell(ifPort, 2)],
    ];
    rows.forEach((row, i) => lines.push(i === 0 ? `${(f / 1e9).toFixed(3)} ${row.join(" ")}` : `      ${row.join(" ")}`));
  }
  return `${lines.join("\n")}\n`;
}

// ─── Hybrids and splitters: transmission-line networks ─────────────────────────────────────────────

export type Complex = { re: number; im: number };
const c = (re: number, im = 0): Complex => ({ re, im });
const add = (a: Complex, b: Complex): Complex => c(a.re + b.re, a.im + b.im);
const sub = (a: Complex, b: Complex): Complex => c(a.re - b.re, a.im - b.im);
const mul = (a: Complex, b: Complex): Complex => c(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re);
const div = (a: Complex, b: Complex): Complex => {
  const d = b.re * b.re + b.im * b.im;
  return c((a.re * b.re + a.im * b.im) / d, (a.im * b.re - a.re * b.im) / d);
};
const cexp = (a: Complex): Complex => c(Math.exp(a.re) * Math.cos(a.im), Math.exp(a.re) * Math.sin(a.im));

/** A line between two nodes: characteristic impedance (Ω), electrical length at fRef (degrees), loss at fRef (dB). */
export interface Line {
  from: number;
  to: number;
  impedanceOhm: number;
  lengthDegAtRef: number;
  lossDbAtRef: number;
}
export interface Network {
  ports: number;
  referenceHz: number;
  lines: Line[];
  resistors: { from: number; to: number; ohms: number }[];
}

/** Solves A·X = B (complex, n × n, B n × m) by Gaussian elimination with partial pivoting. */
function solve(a: Complex[][], b: Complex[][]): Complex[][] {
  const n = a.length;
  const m = b[0].length;
  const A = a.map((row) => [...row]);
  const B = b.map((row) => [...row]);
  for (let k = 0; k < n; k++) {
    let pivot = k;
    for (let i = k + 1; i < n; i++) if (Math.hypot(A[i][k].re, A[i][k].im) > Math.hypot(A[pivot][k].re, A[pivot][k].im)) pivot = i;
    [A[k], A[pivot]] = [A[pivot], A[k]];
    [B[k], B[pivot]] = [B[pivot], B[k]];
    for (let i = k + 1; i < n; i++) {
      const factor = div(A[i][k], A[k][k]);
      for (let j = k; j < n; j++) A[i][j] = sub(A[i][j], mul(factor, A[k][j]));
      for (let j = 0; j < m; j++) B[i][j] = sub(B[i][j], mul(factor, B[k][j]));
    }
  }
  const X: Complex[][] = Array.from({ length: n }, () => Array.from({ length: m }, () => c(0)));
  for (let i = n - 1; i >= 0; i--) {
    for (let j = 0; j < m; j++) {
      let sum = B[i][j];
      for (let k = i + 1; k < n; k++) sum = sub(sum, mul(A[i][k], X[k][j]));
      X[i][j] = div(sum, A[i][i]);
    }
  }
  return X;
}

/**
 * The S-matrix of the network at one frequency, every port referred to z0. A line of propagation
 * constant γℓ = αℓ + jβℓ adds Y11 = Y22 = Yc·coth(γℓ), Y12 = Y21 = −Yc·csch(γℓ) (the two-port
 * admittance matrix of a transmission line, Pozar, Microwave Engineering, 4th ed., Table 4.2 with
 * the lossy line's γ); the loss scales as √f (conductor loss) and βℓ as f.
 */
export function networkSParameters(network: Network, frequencyHz: number, z0 = 50): Complex[][] {
  const n = network.ports;
  const Y: Complex[][] = Array.from({ length: n }, () => Array.from({ length: n }, () => c(0)));
  const ratio = frequencyHz / network.referenceHz;
  for (const line of network.lines) {
    const alpha = (line.lossDbAtRef / (20 * Math.log10(Math.E))) * Math.sqrt(ratio);
    const beta = ((line.lengthDegAtRef * Math.PI) / 180) * ratio;
    const e2 = cexp(c(-2 * alpha, -2 * beta)); // e^(−2γℓ)
    const e1 = cexp(c(-alpha, -beta)); // e^(−γℓ)
    const one = c(1);
    const coth = div(add(one, e2), sub(one, e2));
    const csch = div(mul(c(2), e1), sub(one, e2));
    const yc = 1 / line.impedanceOhm;
    const self = mul(c(yc), coth);
    const mutual = mul(c(-yc), csch);
    Y[line.from][line.from] = add(Y[line.from][line.from], self);
    Y[line.to][line.to] = add(Y[line.to][line.to], self);
    Y[line.from][line.to] = add(Y[line.from][line.to], mutual);
    Y[line.to][line.from] = add(Y[line.to][line.from], mutual);
  }
  for (const r of network.resistors) {
    const g = c(1 / r.ohms);
    Y[r.from][r.from] = add(Y[r.from][r.from], g);
    Y[r.to][r.to] = add(Y[r.to][r.to], g);
    Y[r.from][r.to] = sub(Y[r.from][r.to], g);
    Y[r.to][r.from] = sub(Y[r.to][r.from], g);
  }
  // S = (I + z0·Y)⁻¹ (I − z0·Y) for equal real reference impedances (Pozar §4.3).
  const identity = (i: number, j: number) => c(i === j ? 1 : 0);
  const plus = Y.map((row, i) => row.map((y, j) => add(identity(i, j), mul(c(z0), y))));
  const minus = Y.map((row, i) => row.map((y, j) => sub(identity(i, j), mul(c(z0), y))));
  return solve(plus, minus);
}

/** Per-unit tolerances of a printed network: impedance and length of each line. */
export interface NetworkTolerance {
  impedanceFraction: number;
  lengthFraction: number;
}

/**
 * A branch-line (90°) hybrid centred on `centreHz`: series arms Z0/√2 between ports 1–2 and 4–3,
 * shunt arms Z0 between ports 1–4 and 2–3, all a quarter wave long at the centre (Pozar §7.5).
 * Ports (0-based nodes): 1 input, 2 through, 3 coupled, 4 isolated.
 */
export function branchLineHybrid(centreHz: number, lossDb: number, rand: Random, tolerance: NetworkTolerance): Network {
  const z0 = 50;
  const line = (from: number, to: number, impedanceOhm: number): Line => ({
    from,
    to,
    impedanceOhm: impedanceOhm * (1 + spread(rand, tolerance.impedanceFraction)),
    lengthDegAtRef: 90 * (1 + spread(rand, tolerance.lengthFraction)),
    lossDbAtRef: lossDb,
  });
  return {
    ports: 4,
    referenceHz: centreHz,
    lines: [line(0, 1, z0 / Math.SQRT2), line(3, 2, z0 / Math.SQRT2), line(0, 3, z0), line(1, 2, z0)],
    resistors: [],
  };
}

/**
 * A two-way Wilkinson divider centred on `centreHz`: two quarter-wave arms of √2·Z0 from the
 * common port, a 2·Z0 resistor between the outputs (Pozar §7.3). Ports: 1 common, 2 and 3 outputs.
 */
export function wilkinsonSplitter(centreHz: number, lossDb: number, rand: Random, tolerance: NetworkTolerance): Network {
  const z0 = 50;
  const arm = (to: number): Line => ({
    from: 0,
    to,
    impedanceOhm: Math.SQRT2 * z0 * (1 + spread(rand, tolerance.impedanceFraction)),
    lengthDegAtRef: 90 * (1 + spread(rand, tolerance.lengthFraction)),
    lossDbAtRef: lossDb,
  });
  return { ports: 3, referenceHz: centreHz, lines: [arm(1), arm(2)], resistors: [{ from: 1, to: 2, ohms: 2 * z0 * (1 + spread(rand, 0.01)) }] };
}

export interface NetworkModel {
  topology: "branch-line" | "wilkinson";
  centreHz: number;
  /** Loss of each line at the centre (dB), beyond the ideal split. */
  lineLossDb: number;
  tolerance: NetworkTolerance;
  sweepHz: { start: number; stop: number; step: number };
}

/** One unit's Touchstone file (version 1, real/imaginary) of the network over the sweep, with a little VNA noise. */
export function touchstoneFile(model: NetworkModel, file: { serial: string; description: string }, seed: number): string {
  const unit = mulberry32(seed);
  const network =
    model.topology === "branch-line"
      ? branchLineHybrid(model.centreHz, model.lineLossDb, unit, model.tolerance)
      : wilkinsonSplitter(model.centreHz, model.lineLossDb, unit, model.tolerance);
  const noise = mulberry32(seed * 15485863);
  const ports = network.ports;
  const roles = ports === 4 ? "! ports: 1 input, 2 through, 3 coupled, 4 isolated" : "! port 1 common, ports 2 and 3 outputs";
  const lines = [`! Benchfold demo: ${file.description}, serial ${file.serial} (invented data)`, roles, "# GHz S RI R 50"];
  const { start, stop, step } = model.sweepHz;
  for (let f = start; f <= stop + step / 2; f += step) {
    const s = networkSParameters(network, f);
    for (let i = 0; i < ports; i++) {
      const values = s[i].flatMap((v) => [v.re + gauss(noise, 0.0004), v.im + gauss(noise, 0.0004)].map((x) => x.toFixed(6)));
      lines.push(i === 0 ? `${(f / 1e9).toFixed(3)} ${values.join(" ")}` : `      ${values.join(" ")}`);
    }
  }
  return `${lines.join("\n")}\n`;
}
