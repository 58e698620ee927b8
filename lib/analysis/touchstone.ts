import { sParameter } from "../ingest/touchstone";
import type { TouchstoneData } from "../ingest/types";
import { type Complex, computePhaseBalanceSweepDeg, computeReturnLossDb, computeVswr } from "../rf";
import { errorMessage, makeParameter, makeSeries } from "./curves";
import type { Section } from "./section";
import type { Curve, CurveSeries, DeriveOptions, DerivedParameter, HybridPorts, SplitterPorts } from "./types";

export const DEFAULT_HYBRID_PORTS: HybridPorts = { input: 1, through: 2, coupled: 3, isolated: 4 };
export const DEFAULT_SPLITTER_PORTS: SplitterPorts = { common: 1, outputs: [2, 3] };

/**
 * Port match, transmission, isolation and balance from S-parameters (Pozar,
 * Microwave Engineering §2.3, 4.3: RL = −20·log10|Sii|, VSWR = (1+|Sii|)/(1−|Sii|),
 * IL = −20·log10|Sji|). Band-wide figures are the worst case over every
 * frequency in the file; "centre" figures are at the frequency nearest the
 * band's arithmetic centre.
 */
export function analyzeTouchstone(data: TouchstoneData, options: DeriveOptions, maxPoints: number): Section {
  const parameters: DerivedParameter[] = [];
  const warnings: string[] = [];
  const f = data.frequencyHz;
  const count = f.length;
  const ports = data.portCount;
  const band = { startHz: f[0], stopHz: f[count - 1] };
  const middleHz = (f[0] + f[count - 1]) / 2;
  let centre = 0;
  for (let k = 1; k < count; k++) if (Math.abs(f[k] - middleHz) < Math.abs(f[centre] - middleHz)) centre = k;
  const centreConditions = { frequencyHz: f[centre] };
  const decimate = { maxPoints };
  const xAxis = { label: "Frequency", unit: "Hz", scale: "linear" as const };
  const reported = new Set<string>();

  const magnitudeDb = (to: number, from: number): Float64Array => {
    const s = sParameter(data, to, from);
    const out = new Float64Array(count);
    for (let k = 0; k < count; k++) out[k] = 20 * Math.log10(Math.hypot(s.re[k], s.im[k]));
    return out;
  };

  const returnLossSeries: CurveSeries[] = [];
  for (let port = 1; port <= ports; port++) {
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
    } catch (error) {
      warnings.push(`Port ${port} match not derived: ${errorMessage(error)}`);
    }
    returnLossSeries.push(makeSeries(`port ${port}`, f, rl, decimate));
  }
  const curves: Curve[] = [
    { id: "return-loss", title: "Return loss vs frequency", x: xAxis, y: { label: "Return loss", unit: "dB" }, series: returnLossSeries },
  ];

  const transmissionSeries: CurveSeries[] = [];
  const addTransmission = (name: "insertion-loss" | "isolation", to: number, from: number) => {
    const key = `${name}:${to}:${from}`;
    if (reported.has(key)) return;
    reported.add(key);
    const loss = magnitudeDb(to, from).map((db) => -db);
    let worst = 0;
    for (let k = 1; k < count; k++) {
      if (name === "insertion-loss" ? loss[k] > loss[worst] : loss[k] < loss[worst]) worst = k;
    }
    const path = `S${to}${from}`;
    parameters.push(makeParameter(name, loss[worst], { path, statistic: "worst", ...band }));
    parameters.push(makeParameter(name, loss[centre], { path, ...centreConditions }));
    transmissionSeries.push(makeSeries(`${name === "isolation" ? "isolation" : "insertion loss"} ${path}`, f, loss, decimate));
  };

  const addBalance = (a: number, b: number, from: number, nominalOption: number | undefined, quadrature: boolean) => {
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
    let nominalDeg = nominalOption ?? 0;
    if (nominalOption === undefined && quadrature) {
      const raw = computePhaseBalanceSweepDeg({ outputA: outputA.slice(0, 1), outputB: outputB.slice(0, 1), nominalPhaseDifferenceDeg: 0 })[0];
      nominalDeg = raw >= 0 ? 90 : -90;
    }
    const phase = computePhaseBalanceSweepDeg({ outputA, outputB, nominalPhaseDifferenceDeg: nominalDeg });
    const pair = `S${a}${from}/S${b}${from}`;
    const worstAbs = (values: ArrayLike<number>) => {
      let worst = 0;
      for (let k = 1; k < values.length; k++) if (Math.abs(values[k]) > Math.abs(values[worst])) worst = k;
      return worst;
    };
    parameters.push(makeParameter("amplitude-balance", amplitude[worstAbs(amplitude)], { pair, statistic: "worst", ...band }));
    parameters.push(makeParameter("amplitude-balance", amplitude[centre], { pair, ...centreConditions }));
    parameters.push(makeParameter("phase-balance", phase[worstAbs(phase)], { pair, nominalDeg, statistic: "worst", ...band }));
    parameters.push(makeParameter("phase-balance", phase[centre], { pair, nominalDeg, ...centreConditions }));
    curves.push({
      id: "amplitude-balance",
      title: `Amplitude balance ${pair}`,
      x: xAxis,
      y: { label: "Amplitude balance", unit: "dB" },
      series: [makeSeries(pair, f, amplitude, decimate)],
    });
    curves.push({
      id: "phase-balance",
      title: `Phase balance ${pair} vs ${nominalDeg}°`,
      x: xAxis,
      y: { label: "Phase balance", unit: "deg" },
      series: [makeSeries(pair, f, phase, decimate)],
    });
  };

  try {
    if (ports === 2) {
      addTransmission("insertion-loss", 2, 1);
      addTransmission("insertion-loss", 1, 2);
    } else if (ports === 3) {
      const roles = options.touchstone?.splitterPorts ?? DEFAULT_SPLITTER_PORTS;
      checkRoles([roles.common, ...roles.outputs], ports);
      const [a, b] = roles.outputs;
      addTransmission("insertion-loss", a, roles.common);
      addTransmission("insertion-loss", b, roles.common);
      addTransmission("isolation", b, a);
      addBalance(a, b, roles.common, 0, false);
    } else if (ports === 4) {
      const roles = options.touchstone?.hybridPorts ?? DEFAULT_HYBRID_PORTS;
      checkRoles([roles.input, roles.through, roles.coupled, roles.isolated], ports);
      addTransmission("insertion-loss", roles.through, roles.input);
      addTransmission("insertion-loss", roles.coupled, roles.input);
      addTransmission("isolation", roles.isolated, roles.input);
      addTransmission("isolation", roles.coupled, roles.through);
      addBalance(roles.through, roles.coupled, roles.input, options.touchstone?.hybridNominalPhaseDeg, true);
    } else if (ports > 4) {
      warnings.push(`No port roles are defined for a ${ports}-port network: only port match is derived`);
    }
  } catch (error) {
    warnings.push(`Transmission and balance not derived: ${errorMessage(error)}`);
  }
  if (transmissionSeries.length > 0) {
    curves.splice(1, 0, {
      id: "transmission",
      title: "Insertion loss and isolation vs frequency",
      x: xAxis,
      y: { label: "Loss", unit: "dB" },
      series: transmissionSeries,
    });
  }
  return { parameters, warnings, curves };
}

function checkRoles(roles: number[], ports: number): void {
  const distinct = new Set(roles);
  if (distinct.size !== roles.length || roles.some((p) => !Number.isInteger(p) || p < 1 || p > ports)) {
    throw new RangeError(`Port roles ${roles.join(", ")} are not distinct ports of a ${ports}-port network`);
  }
}
