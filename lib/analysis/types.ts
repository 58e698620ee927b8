import type { MeasurementKind } from "../ingest/types";
import type { IntegrationBandHz, SpurBandwidth } from "../domain/analysis-settings";
import type { ResolvedSetting } from "./settings";

/** One derived figure. Stored as-is; the datasheet's statistics group by name + conditions. */
export interface DerivedParameter {
  name: string;
  value: number | null;
  unit: string;
  conditions: Record<string, string | number>;
}

export interface CurveAxis {
  label: string;
  unit: string;
  scale: "linear" | "log";
}

export interface CurveSeries {
  name: string;
  points: [number, number][];
}

export interface CurveMarker {
  label: string;
  x: number;
  y: number;
}

/** A plot-ready chart: plain JSON, at most maxCurvePoints points per series. */
export interface Curve {
  id: string;
  title: string;
  x: CurveAxis;
  y: Omit<CurveAxis, "scale"> & { scale?: "linear" | "log" };
  series: CurveSeries[];
  markers?: CurveMarker[];
}

export interface AnalysisResult {
  kind: MeasurementKind;
  parameters: DerivedParameter[];
  warnings: string[];
  curves: Curve[];
}

/** Port roles of a 4-port quadrature hybrid (1-based port numbers). */
export interface HybridPorts {
  input: number;
  through: number;
  coupled: number;
  isolated: number;
}

/** Port roles of a 3-port in-phase splitter. */
export interface SplitterPorts {
  common: number;
  outputs: [number, number];
}

export interface DeriveOptions {
  /** Points per curve series after decimation; 2,000 by default. */
  maxCurvePoints?: number;
  driveSweep?: {
    /** Ways of the splitter feeding the device ports; 2 (both ports of a mixer used as a doubler) by default. */
    splitWays?: number;
  };
  /** The small-signal reference of compression (drive sweeps and two-tone data). */
  compression?: {
    /** The engineer's reference drive, dBm, on the axis the input P1dB is reported on; by default the agreeing leading points. */
    referenceInputPowerDbm?: ResolvedSetting<number>;
    /** Leading points within this of the first point's gain are small-signal, dB; 0.1 by default. */
    linearToleranceDb?: number;
  };
  twoTone?: {
    /** Fit only points at or below this input per tone; by default the points whose tone gain is within 0.2 dB of the small-signal gain. */
    maxInputPowerDbm?: number;
  };
  phaseNoise?: {
    /** Integration band and where it came from; by default the engine's 10 Hz … 1 MHz, narrowed to the trace. */
    integrationBand?: ResolvedSetting<IntegrationBandHz>;
    /** The bandwidth the trace was normalised with, for spurs in dBc; a file's per-offset column wins. */
    spurBandwidth?: ResolvedSetting<SpurBandwidth>;
    /** L(f) of the signal driving the multiplier, for the excess over ideal ×N; by default the file's `L_input` column. */
    inputReference?: { offsetHz: readonly number[]; lDbcHz: readonly number[] };
    /** Rise above the local median that makes a point a spur, dB; 10 by default. */
    spurThresholdDb?: number;
    /** Temperature of the kT reference; 290 K (IEEE) by default. */
    referenceTemperatureK?: number;
  };
  touchstone?: {
    /** Default ports 1 in, 2 through, 3 coupled, 4 isolated. */
    hybridPorts?: HybridPorts;
    /** Default port 1 common, ports 2 and 3 outputs. */
    splitterPorts?: SplitterPorts;
    /** Designed ∠S_through − ∠S_coupled; by default ±90°, the sign nearest the data at the first frequency. */
    hybridNominalPhaseDeg?: number;
    /**
     * The network is measured for its ports' match only (a mixer's RF, LO and IF ports with the LO off):
     * no insertion loss, isolation or balance by a splitter's or a hybrid's port roles, which would call a
     * mixer's LO-to-RF leakage an "output" and its two leakage paths an "amplitude balance".
     */
    portMatchOnly?: boolean;
  };
}
