/**
 * Measurement uncertainty per the GUM (JCGM 100:2008). Each component is given as
 * a bound and the distribution it is believed to follow; its standard uncertainty is
 *   normal: U/k (the stated coverage factor; k = 1 for a standard uncertainty),
 *   rectangular: a/√3, triangular: a/√6, U-shaped (e.g. mismatch): a/√2
 * (JCGM 100:2008 §4.3.7, §4.3.9; EA-4/02 for the U-shaped case).
 */

export type UncertaintyDistribution = "normal" | "rectangular" | "triangular" | "u-shaped";

export interface UncertaintyComponent {
  name: string;
  /** Half-width a of the bound, or the expanded uncertainty U for a normal component; in the measurand's unit. */
  bound: number;
  distribution: UncertaintyDistribution;
  /** For a normal component: the coverage factor the bound was stated with (default 1). */
  coverageFactor?: number;
  /** ∂f/∂x_i, default 1. */
  sensitivity?: number;
}

export function computeStandardUncertainty(component: UncertaintyComponent): number {
  const { bound, distribution, coverageFactor = 1 } = component;
  if (!(bound >= 0)) throw new RangeError(`Bound of "${component.name}" must be non-negative, got ${bound}`);
  switch (distribution) {
    case "normal":
      if (!(coverageFactor > 0)) throw new RangeError(`Coverage factor of "${component.name}" must be positive`);
      return bound / coverageFactor;
    case "rectangular":
      return bound / Math.sqrt(3);
    case "triangular":
      return bound / Math.sqrt(6);
    case "u-shaped":
      return bound / Math.SQRT2;
  }
}

export interface UncertaintyContribution {
  name: string;
  standardUncertainty: number;
  sensitivity: number;
  /** |c_i|·u(x_i). */
  contribution: number;
}

export interface UncertaintyBudget {
  contributions: UncertaintyContribution[];
  /** u_c = √Σ (c_i·u(x_i))², GUM eq. 10 (uncorrelated inputs). */
  combinedStandardUncertainty: number;
  coverageFactor: number;
  /** U = k·u_c. */
  expandedUncertainty: number;
}

/** Combined and expanded uncertainty; k = 2 by default for about 95 % coverage (JCGM 100:2008 §6.2–6.3). */
export function combineUncertainty(
  components: readonly UncertaintyComponent[],
  coverageFactor = 2,
): UncertaintyBudget {
  if (!(coverageFactor > 0)) throw new RangeError(`Coverage factor must be positive, got ${coverageFactor}`);
  const contributions = components.map((component) => {
    const standardUncertainty = computeStandardUncertainty(component);
    const sensitivity = component.sensitivity ?? 1;
    return { name: component.name, standardUncertainty, sensitivity, contribution: Math.abs(sensitivity) * standardUncertainty };
  });
  const combinedStandardUncertainty = Math.sqrt(contributions.reduce((sum, c) => sum + c.contribution ** 2, 0));
  return {
    contributions,
    combinedStandardUncertainty,
    coverageFactor,
    expandedUncertainty: coverageFactor * combinedStandardUncertainty,
  };
}
