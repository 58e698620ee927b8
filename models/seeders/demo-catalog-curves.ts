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
 *   frequency.
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
  const clMin = model.conversionLossDb + clOffset + 0.9 * edge * edge;
  const pOpt = model.optimumDriveDbm + optOffset + 0.4 * edge;
  const rejection = model.fundamentalRejectionDb + rejOffset - 3 * edge * edge;

  const referredDb = idealSplitDb + splitterExcessLossDb + cableLossDb;
  const first = Math.round(pOpt + referredDb - 12);
  const rows: string[] = [];
  for (let total = first; total <= first + 20; total++) {
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
    "# temperature: 25 C",
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
  loPowerDbm: number;
  ifFrequencyHz: number;
  /** Swept RF band (Hz) and step. */
  sweepHz: { start: number; stop: number; step: number };
  unitSpreadDb: number;
}

/** One unit's conversion loss and isolations against RF frequency at the stated LO drive. */
export function mixerFrequencySweep(model: MixerModel, file: { serial: string; lot: string }, seed: number): string {
  const unit = mulberry32(seed);
  const clOffset = gauss(unit, model.unitSpreadDb);
  const loRfOffset = gauss(unit, 1.5);
  const loIfOffset = gauss(unit, 1.5);
  const ripplePhase = unit() * 2 * Math.PI;
  const noise = mulberry32(seed * 104729);
  const { min, max } = model.balunBandHz;
  const { start, stop, step } = model.sweepHz;
  const rows: string[] = [];
  for (let f = start; f <= stop + step / 2; f += step) {
    // The balun's low-frequency roll-off (its magnetising inductance) and high-end loss.
    const rollOff = 10 * Math.log10(1 + (min / f) ** 2) + 10 * Math.log10(1 + (f / max) ** 4);
    const ripple = 0.12 * Math.sin((2 * Math.PI * f) / (0.35 * (max - min)) + ripplePhase);
    const cl = model.conversionLossDb + clOffset + rollOff + ripple + gauss(noise, 0.03);
    // Coupling through the balun's imbalance grows about 6 dB per octave above the low end.
    const coupling = 10 * Math.log10(1 + (f / (4 * min)) ** 2);
    const loRf = model.loRfIsolationDb + loRfOffset - coupling + gauss(noise, 0.3);
    const loIf = model.loIfIsolationDb + loIfOffset - 0.8 * coupling + gauss(noise, 0.3);
    rows.push([(f / 1e6).toFixed(0), cl.toFixed(2), loRf.toFixed(2), loIf.toFixed(2)].join(","));
  }
  return [
    "# kind: frequency-sweep",
    `# serial: ${file.serial}`,
    `# lot: ${file.lot}`,
    `# lo_power: ${model.loPowerDbm} dBm`,
    `# if_frequency: ${model.ifFrequencyHz / 1e6} MHz`,
    "# temperature: 25 C",
    "frequency [MHz],conversion_loss [dB],isolation_lo_rf [dB],isolation_lo_if [dB]",
    ...rows,
    "",
  ].join("\n");
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
