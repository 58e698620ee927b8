import { combGeneratorConditions } from "./conditions";
import type { SheetTemplate } from "../types";

/**
 * A class the product does not ship: a step-recovery comb generator, added by the recipe in
 * DEVELOPERS.md ("Adding a device class") to prove it. Its line in lib/domain/device-classes.ts
 * is marked testOnly, so only the build `npm test` makes offers it; the unit tests render it
 * through both renderers, tests/integration/new-device-class.test.ts takes it through the app.
 */
export const combGeneratorTemplate: SheetTemplate = {
  deviceClass: "comb-generator-test-only",
  conditions: combGeneratorConditions,
  measurementKinds: ["drive-sweep"],
  passive: true,
  specifications: {
    conditionColumns: [{ id: "frequency", label: "f_IN", sources: [{ key: "inputFrequencyHz", format: "frequency" }] }],
    rows: [
      {
        id: "conversion-loss",
        parameter: "conversion-loss",
        symbol: "CL",
        unit: "dB",
        decimals: 1,
        match: { drive: "optimum" },
        groupBy: ["inputFrequencyHz"],
        defaultBasis: "design",
      },
    ],
    notes: ["Comb lines measured one at a time. System impedance 50 Ω."],
  },
  curves: [{ id: "cl", curveId: "conversion-loss-vs-drive", title: "Loss vs drive", caption: "Each line one unit." }],
  prose: [{ id: "description", title: "Description", markdown: "A test-only comb generator with a ±1 dB flat comb." }],
  cautions: ["Test-only caution: limits apply only under the stated conditions."],
  absoluteMaximumRatings: [{ label: "Input power", unit: "dBm" }],
};
