import type { Curve, DerivedParameter } from "./types";

/** What each kind's analysis returns before the kind is attached. */
export interface Section {
  parameters: DerivedParameter[];
  warnings: string[];
  curves: Curve[];
}
