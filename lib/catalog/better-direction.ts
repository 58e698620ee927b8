/**
 * Which way a figure is better, per derived parameter (lib/analysis parameterCatalog), for the
 * compare table's mark. One entry per parameter: the type checker finds one left out.
 *
 * Source: common practice of RF component datasheets and selection (a trade fact, no single
 * published source): a loss, a mismatch and noise are better low; a suppression, an isolation, a
 * return loss and a compression or intercept point are better high; a balance is better near zero,
 * whatever its sign. A figure that is a setting or a check, not a merit (the optimum drive, a fitted
 * slope, the ideal ×N penalty), has no better side and is never marked.
 */
import type { ParameterName } from "../analysis/catalog";

export type BetterDirection = "lower" | "higher" | "nearer-zero";

export const betterDirections: Record<ParameterName, BetterDirection | null> = {
  "conversion-loss": "lower",
  // The drive a design must supply: lower is easier to source, but a higher drive often buys linearity; not a merit.
  "optimum-drive": null,
  "harmonic-suppression": "higher",
  "input-p1db": "higher",
  "output-p1db": "higher",
  iip3: "higher",
  oip3: "higher",
  "fundamental-slope": null,
  "im3-slope": null,
  "delta-im": "higher",
  // A predicted product at the stated tone levels: the lower, the more linear (as for a spur).
  "im3-predicted": "lower",
  "mismatch-loss": "lower",
  // dBc/Hz: the more negative, the quieter.
  "spot-phase-noise": "lower",
  "integrated-phase-noise": "lower",
  "rms-phase-error": "lower",
  "rms-jitter": "lower",
  "excess-over-ideal-multiplication": "lower",
  "ideal-multiplication-penalty": null,
  "noise-floor": "lower",
  "noise-floor-above-kt": "lower",
  spur: "lower",
  "discrete-spur": "lower",
  "worst-discrete-spur": "lower",
  "return-loss": "higher",
  vswr: "lower",
  "insertion-loss": "lower",
  isolation: "higher",
  "amplitude-balance": "nearer-zero",
  "phase-balance": "nearer-zero",
};

export const betterDirectionWords: Record<BetterDirection, string> = {
  lower: "lower is better",
  higher: "higher is better",
  "nearer-zero": "nearer zero is better",
};

/** The direction of a parameter by its name as a sheet row carries it; null for a name it does not know. */
export function betterDirectionOf(parameter: string): BetterDirection | null {
  return Object.hasOwn(betterDirections, parameter) ? betterDirections[parameter as ParameterName] : null;
}
