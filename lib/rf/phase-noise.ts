/**
 * Phase noise as L(f), single-sideband, dBc/Hz (IEEE Std 1139-2008: L(f) = ½·Sφ(f)).
 * A trace is a list of offsets (Hz, increasing after sorting) and L values. Between
 * points L is taken as a straight line on log-log axes (a power law): linear
 * interpolation of dBc/Hz in log10(offset).
 */

export interface PhaseNoiseTrace {
  offsetHz: ArrayLike<number>;
  phaseNoiseDbcHz: ArrayLike<number>;
}

export interface TracePoint {
  offsetHz: number;
  phaseNoiseDbcHz: number;
}

/** Ideal frequency multiplication by N raises L(f) by 20·log10(N) dB (common practice). */
export function computeMultiplicationPenaltyDb(multiplicationFactor: number): number {
  if (!(multiplicationFactor > 0)) throw new RangeError(`Multiplication factor must be positive, got ${multiplicationFactor}`);
  return 20 * Math.log10(multiplicationFactor);
}

export interface MultiplierExcessOptions {
  inputPhaseNoiseDbcHz: number;
  outputPhaseNoiseDbcHz: number;
  multiplicationFactor: number;
}

/** Output noise above what an ideal ×N would give: L_out − (L_in + 20·log10 N), dB. Positive = the multiplier adds noise. */
export function computeExcessOverIdealMultiplicationDb(options: MultiplierExcessOptions): number {
  const { inputPhaseNoiseDbcHz, outputPhaseNoiseDbcHz, multiplicationFactor } = options;
  return outputPhaseNoiseDbcHz - inputPhaseNoiseDbcHz - computeMultiplicationPenaltyDb(multiplicationFactor);
}

/** L at one offset, linear in log10(offset) between the neighbouring points; throws outside the trace. */
export function interpolatePhaseNoiseDbcHz(trace: PhaseNoiseTrace, offsetHz: number): number {
  const points = sortTrace(trace);
  return interpolateSorted(points, offsetHz);
}

export interface SpotPhaseNoise {
  offsetHz: number;
  phaseNoiseDbcHz: number;
}

/**
 * Spot L(f) at the requested offsets, by default every decade (1 Hz … 100 MHz)
 * that lies within the trace. Offsets outside the measured span are left out
 * rather than extrapolated.
 */
export function computeSpotPhaseNoise(
  trace: PhaseNoiseTrace,
  offsetsHz: readonly number[] = DECADE_OFFSETS_HZ,
): SpotPhaseNoise[] {
  const points = sortTrace(trace);
  const first = points[0].offsetHz;
  const last = points[points.length - 1].offsetHz;
  return offsetsHz
    .filter((offsetHz) => offsetHz >= first && offsetHz <= last)
    .map((offsetHz) => ({ offsetHz, phaseNoiseDbcHz: interpolateSorted(points, offsetHz) }));
}

export const DECADE_OFFSETS_HZ: readonly number[] = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8];

export interface IntegratePhaseNoiseOptions {
  trace: PhaseNoiseTrace;
  startOffsetHz: number;
  stopOffsetHz: number;
  carrierFrequencyHz: number;
}

export interface IntegratedPhaseNoise {
  /** A = ∫ L(f) df in linear units, expressed in dBc. */
  integratedPhaseNoiseDbc: number;
  /** φrms = √(2A), radians: both sidebands (Sφ = 2L). */
  phaseRmsRad: number;
  phaseRmsDeg: number;
  /** σt = φrms / (2π·f0), seconds. */
  jitterRmsS: number;
}

/**
 * Integrated phase noise between two offsets. Each segment between trace points
 * is a power law L(f) = L1·(f/f1)^b, b = ΔdB/(10·Δlog10 f), and is integrated
 * exactly: L1·f1/(b+1)·[(f2/f1)^(b+1) − 1], or L1·f1·ln(f2/f1) when b = −1
 * (10 dB/decade). φrms = √(2A), σt = φrms/(2π f0) (IEEE Std 1139-2008; the method
 * of MathWorks phaseNoiseToJitter).
 */
export function integratePhaseNoise(options: IntegratePhaseNoiseOptions): IntegratedPhaseNoise {
  const { startOffsetHz, stopOffsetHz, carrierFrequencyHz } = options;
  if (!(stopOffsetHz > startOffsetHz && startOffsetHz > 0)) {
    throw new RangeError(`Integration needs 0 < start < stop offset, got ${startOffsetHz} Hz to ${stopOffsetHz} Hz`);
  }
  if (!(carrierFrequencyHz > 0)) throw new RangeError(`Carrier frequency must be positive, got ${carrierFrequencyHz} Hz`);
  const points = sortTrace(options.trace);
  const span: TracePoint[] = [{ offsetHz: startOffsetHz, phaseNoiseDbcHz: interpolateSorted(points, startOffsetHz) }];
  for (const point of points) {
    if (point.offsetHz > startOffsetHz && point.offsetHz < stopOffsetHz) span.push(point);
  }
  span.push({ offsetHz: stopOffsetHz, phaseNoiseDbcHz: interpolateSorted(points, stopOffsetHz) });

  let integrated = 0;
  for (let i = 1; i < span.length; i++) integrated += integratePowerLawSegment(span[i - 1], span[i]);
  const phaseRmsRad = Math.sqrt(2 * integrated);
  return {
    integratedPhaseNoiseDbc: 10 * Math.log10(integrated),
    phaseRmsRad,
    phaseRmsDeg: (phaseRmsRad * 180) / Math.PI,
    jitterRmsS: phaseRmsRad / (2 * Math.PI * carrierFrequencyHz),
  };
}

function integratePowerLawSegment(from: TracePoint, to: TracePoint): number {
  const ratio = to.offsetHz / from.offsetHz;
  const startLinear = 10 ** (from.phaseNoiseDbcHz / 10);
  const exponent = (to.phaseNoiseDbcHz - from.phaseNoiseDbcHz) / (10 * Math.log10(ratio));
  const exponentPlusOne = exponent + 1;
  if (Math.abs(exponentPlusOne) < 1e-9) return startLinear * from.offsetHz * Math.log(ratio);
  return ((startLinear * from.offsetHz) / exponentPlusOne) * (ratio ** exponentPlusOne - 1);
}

function interpolateSorted(points: readonly TracePoint[], offsetHz: number): number {
  const first = points[0];
  const last = points[points.length - 1];
  if (!(offsetHz >= first.offsetHz && offsetHz <= last.offsetHz)) {
    throw new RangeError(`Offset ${offsetHz} Hz lies outside the trace (${first.offsetHz} Hz to ${last.offsetHz} Hz)`);
  }
  let high = 1;
  while (high < points.length - 1 && points[high].offsetHz < offsetHz) high++;
  if (points.length === 1) return first.phaseNoiseDbcHz;
  const a = points[high - 1];
  const b = points[high];
  const fraction = Math.log10(offsetHz / a.offsetHz) / Math.log10(b.offsetHz / a.offsetHz);
  return a.phaseNoiseDbcHz + fraction * (b.phaseNoiseDbcHz - a.phaseNoiseDbcHz);
}

export function sortTrace(trace: PhaseNoiseTrace): TracePoint[] {
  const { offsetHz, phaseNoiseDbcHz } = trace;
  if (offsetHz.length !== phaseNoiseDbcHz.length) {
    throw new RangeError(`Trace arrays differ in length: ${offsetHz.length} offsets, ${phaseNoiseDbcHz.length} levels`);
  }
  const points: TracePoint[] = [];
  for (let i = 0; i < offsetHz.length; i++) {
    if (!(offsetHz[i] > 0) || !Number.isFinite(offsetHz[i]) || !Number.isFinite(phaseNoiseDbcHz[i])) {
      throw new RangeError(`Trace point ${i} is not a positive offset with a finite level`);
    }
    points.push({ offsetHz: offsetHz[i], phaseNoiseDbcHz: phaseNoiseDbcHz[i] });
  }
  if (points.length === 0) throw new RangeError("A phase-noise trace needs at least one point");
  points.sort((a, b) => a.offsetHz - b.offsetHz);
  for (let i = 1; i < points.length; i++) {
    if (points[i].offsetHz === points[i - 1].offsetHz) throw new RangeError(`Duplicate offset ${points[i].offsetHz} Hz`);
  }
  return points;
}
