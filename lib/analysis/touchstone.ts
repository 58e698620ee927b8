import { sParameter } from "../ingest/touchstone";
import { parameterName } from "../domain/parameter-names";
import type { TouchstoneData } from "../ingest/types";
import { type Complex, computeMismatchLossDb, computePhaseBalanceSweepDeg, computeReturnLossDb, computeVswr } from "../rf";
import { errorMessage, makeParameter, makeSeries } from "./curves";
import type { Section } from "./section";
import type { Curve, CurveSeries, DeriveOptions, DerivedParameter, HybridPorts, SplitterPorts } from "./types";

export const DEFAULT_HYBRID_PORTS: HybridPorts = { input: 1, through: 2, coupled: 3, isolated: 4 };
export const DEFAULT_SPLITTER_PORTS: SplitterPorts = { common: 1, outputs: [2, 3] };

/**
 * Port match, transmission, isolation and balance from S-parameters (Pozar,
 * Microwave Engineering §2.3, 4.3: RL = −20·log10|Sii|, VSWR = (1+|Sii|)/(1−|Sii|),
 * IL = −20·log10|Sji|, ML = −10·log10(1 − |Sii|²)). Band-wide figures are the worst case over every
 * frequency in the file; "centre" figures are at the frequency nearest the
 * band's arithmetic centre.
 */
export function analyzeTouchstone(data: TouchstoneData, options: DeriveOptions, maxPoints: number): Section {
  const network = describeNetwork(data, maxPoints);
  addPortMatch(network);
  if (options.touchstone?.portMatchOnly) return { parameters: network.parameters, warnings: network.warnings, curves: network.curves };
  try {
    addTransmissionByRoles(network, options);
  } catch (error) {
    network.warnings.push(`Transmission and balance not derived: ${errorMessage(error)}`);
  }
  const { parameters, warnings, curves, transmissionSeries } = network;
  if (transmissionSeries.length > 0) {
    curves.splice(1, 0, {
      id: "transmission",
      title: "Insertion loss and isolation vs frequency",
      x: network.xAxis,
      y: { label: "Loss", unit: "dB" },
      series: transmissionSeries,
    });
  }
  return { parameters, warnings, curves };
}

/** The network being analysed and what has been derived from it so far. */
interface Network {
  data: TouchstoneData;
  f: Float64Array;
  count: number;
  /** Index of the frequency nearest the band's arithmetic centre. */
  centre: number;
  band: { startHz: number; stopHz: number };
  centreConditions: { frequencyHz: number };
  decimate: { maxPoints: number };
  xAxis: { label: string; unit: string; scale: "linear" };
  parameters: DerivedParameter[];
  warnings: string[];
  curves: Curve[];
  transmissionSeries: CurveSeries[];
  reported: Set<string>;
}

function describeNetwork(data: TouchstoneData, maxPoints: number): Network {
  const f = data.frequencyHz;
  const count = f.length;
  const middleHz = (f[0] + f[count - 1]) / 2;
  let centre = 0;
  for (let k = 1; k < count; k++) if (Math.abs(f[k] - middleHz) < Math.abs(f[centre] - middleHz)) centre = k;
  return {
    data,
    f,
    count,
    centre,
    band: { startHz: f[0], stopHz: f[count - 1] },
    centreConditions: { frequencyHz: f[centre] },
    decimate: { maxPoints },
    xAxis: { label: "Frequency", unit: "Hz", scale: "linear" },
    parameters: [],
    warnings: [],
    curves: [],
    transmissionSeries: [],
    reported: new Set(),
  };
}

/** Return loss and VSWR of every port: worst over the band and at its centre, and the return-loss curve. */
function addPortMatch(network: Network): void {
  const { data, f, count, centre, band, centreConditions, parameters } = network;
  const returnLossSeries: CurveSeries[] = [];
  for (let port = 1; port <= data.portCount; port++) {
    const s = sParameter(data, port, port);
    let worst = 0;
    const rl = new Float64Array(count);
    for (let k = 0; k < count; k++) {
      const magnitude = Math.hypot(s.re[k], s.im[k]);
      rl[k] = -20 * Math.log10(magnitude);
      if (rl[k] < rl[worst]) worst = k;
    }
    try {
      const worstMagnitude = Math.hypot(s.re[worst], s.im[worst]);
      const centreMagnitude = Math.hypot(s.re[centre], s.im[centre]);
      parameters.push(makeParameter("return-loss", computeReturnLossDb(worstMagnitude), { port, statistic: "worst", ...band }));
      parameters.push(makeParameter("return-loss", computeReturnLossDb(centreMagnitude), { port, ...centreConditions }));
      parameters.push(makeParameter("vswr", computeVswr(worstMagnitude), { port, statistic: "worst", ...band }));
      parameters.push(makeParameter("vswr", computeVswr(centreMagnitude), { port, ...centreConditions }));
      parameters.push(makeParameter("mismatch-loss", computeMismatchLossDb(worstMagnitude), { port, statistic: "worst", ...band }));
      parameters.push(makeParameter("mismatch-loss", computeMismatchLossDb(centreMagnitude), { port, ...centreConditions }));
    } catch (error) {
      network.warnings.push(`Port ${port} match not derived: ${errorMessage(error)}`);
    }
    returnLossSeries.push(makeSeries(`port ${port}`, f, rl, network.decimate));
  }
  network.curves.push({ id: "return-loss", title: "Return loss vs frequency", x: network.xAxis, y: { label: parameterName("return-loss"), unit: "dB" }, series: returnLossSeries });
}

/** Which paths are transmission, isolation and balance depends on the port count and the stated port roles. */
function addTransmissionByRoles(network: Network, options: DeriveOptions): void {
  const ports = network.data.portCount;
  if (ports === 2) {
    addTransmission(network, "insertion-loss", 2, 1);
    addTransmission(network, "insertion-loss", 1, 2);
  } else if (ports === 3) {
    const roles = options.touchstone?.splitterPorts ?? DEFAULT_SPLITTER_PORTS;
    checkRoles([roles.common, ...roles.outputs], ports);
    const [a, b] = roles.outputs;
    addTransmission(network, "insertion-loss", a, roles.common);
    addTransmission(network, "insertion-loss", b, roles.common);
    addTransmission(network, "isolation", b, a);
    addBalance(network, { a, b, from: roles.common, nominalDeg: 0, quadrature: false });
  } else if (ports === 4) {
    const roles = options.touchstone?.hybridPorts ?? DEFAULT_HYBRID_PORTS;
    checkRoles([roles.input, roles.through, roles.coupled, roles.isolated], ports);
    addTransmission(network, "insertion-loss", roles.through, roles.input);
    addTransmission(network, "insertion-loss", roles.coupled, roles.input);
    addTransmission(network, "isolation", roles.isolated, roles.input);
    addTransmission(network, "isolation", roles.coupled, roles.through);
    addBalance(network, { a: roles.through, b: roles.coupled, from: roles.input, nominalDeg: options.touchstone?.hybridNominalPhaseDeg, quadrature: true });
  } else if (ports > 4) {
    network.warnings.push(`No port roles are defined for a ${ports}-port network: only port match is derived`);
  }
}

/** −20·log10|S(to, from)| over the band: worst and centre values and a curve; each path once. */
function addTransmission(network: Network, name: "insertion-loss" | "isolation", to: number, from: number): void {
  const key = `${name}:${to}:${from}`;
  if (network.reported.has(key)) return;
  network.reported.add(key);
  const { data, f, count, centre, band, centreConditions } = network;
  const s = sParameter(data, to, from);
  const loss = new Float64Array(count);
  for (let k = 0; k < count; k++) loss[k] = -20 * Math.log10(Math.hypot(s.re[k], s.im[k]));
  let worst = 0;
  for (let k = 1; k < count; k++) {
    if (name === "insertion-loss" ? loss[k] > loss[worst] : loss[k] < loss[worst]) worst = k;
  }
  const path = `S${to}${from}`;
  network.parameters.push(makeParameter(name, loss[worst], { path, statistic: "worst", ...band }));
  network.parameters.push(makeParameter(name, loss[centre], { path, ...centreConditions }));
  network.transmissionSeries.push(makeSeries(`${name === "isolation" ? "isolation" : "insertion loss"} ${path}`, f, loss, network.decimate));
}

/**
 * Amplitude and phase balance between outputs a and b driven from one port. A quadrature
 * hybrid with no stated nominal takes ±90° from the sign of the first point's difference.
 */
function addBalance(network: Network, pairing: { a: number; b: number; from: number; nominalDeg: number | undefined; quadrature: boolean }): void {
  const { a, b, from, quadrature } = pairing;
  const { data, f, count, centre, band, centreConditions, decimate, xAxis } = network;
  const sa = sParameter(data, a, from);
  const sb = sParameter(data, b, from);
  const amplitude = new Float64Array(count);
  const outputA: Complex[] = [];
  const outputB: Complex[] = [];
  for (let k = 0; k < count; k++) {
    amplitude[k] = 20 * Math.log10(Math.hypot(sa.re[k], sa.im[k]) / Math.hypot(sb.re[k], sb.im[k]));
    outputA.push({ re: sa.re[k], im: sa.im[k] });
    outputB.push({ re: sb.re[k], im: sb.im[k] });
  }
  let nominalDeg = pairing.nominalDeg ?? 0;
  if (pairing.nominalDeg === undefined && quadrature) {
    const raw = computePhaseBalanceSweepDeg({ outputA: outputA.slice(0, 1), outputB: outputB.slice(0, 1), nominalPhaseDifferenceDeg: 0 })[0];
    nominalDeg = raw >= 0 ? 90 : -90;
  }
  const phase = computePhaseBalanceSweepDeg({ outputA, outputB, nominalPhaseDifferenceDeg: nominalDeg });
  const pair = `S${a}${from}/S${b}${from}`;
  network.parameters.push(makeParameter("amplitude-balance", amplitude[worstAbsolute(amplitude)], { pair, statistic: "worst", ...band }));
  network.parameters.push(makeParameter("amplitude-balance", amplitude[centre], { pair, ...centreConditions }));
  network.parameters.push(makeParameter("phase-balance", phase[worstAbsolute(phase)], { pair, nominalDeg, statistic: "worst", ...band }));
  network.parameters.push(makeParameter("phase-balance", phase[centre], { pair, nominalDeg, ...centreConditions }));
  network.curves.push({
    id: "amplitude-balance",
    title: `Amplitude balance ${pair}`,
    x: xAxis,
    y: { label: parameterName("amplitude-balance"), unit: "dB" },
    series: [makeSeries(pair, f, amplitude, decimate)],
  });
  network.curves.push({
    id: "phase-balance",
    title: `Phase balance ${pair} vs ${nominalDeg}°`,
    x: xAxis,
    y: { label: parameterName("phase-balance"), unit: "deg" },
    series: [makeSeries(pair, f, phase, decimate)],
  });
}

function worstAbsolute(values: ArrayLike<number>): number {
  let worst = 0;
  for (let k = 1; k < values.length; k++) if (Math.abs(values[k]) > Math.abs(values[worst])) worst = k;
  return worst;
}

function checkRoles(roles: number[], ports: number): void {
  const distinct = new Set(roles);
  if (distinct.size !== roles.length || roles.some((p) => !Number.isInteger(p) || p < 1 || p > ports)) {
    throw new RangeError(`Port roles ${roles.join(", ")} are not distinct ports of a ${ports}-port network`);
  }
}
