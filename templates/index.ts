import type { DeviceClass } from "../lib/domain/device-classes";
import { isDeviceClass } from "../lib/domain/device-classes";
import { combGeneratorTemplate } from "./comb-generator-test-only";
import { doubleBalancedMixerTemplate } from "./double-balanced-mixer";
import { frequencyMultiplierTemplate } from "./frequency-multiplier";
import { quadratureHybridTemplate } from "./quadrature-hybrid";
import type { SheetTemplate } from "./types";

export type * from "./types";

/**
 * The template of each class of lib/domain/device-classes.ts. The type asks for one entry per
 * class there, so a class added to the list and not here fails the type check.
 */
const sheetTemplates: Readonly<Record<DeviceClass, SheetTemplate>> = {
  "frequency-multiplier": frequencyMultiplierTemplate,
  "double-balanced-mixer": doubleBalancedMixerTemplate,
  "quadrature-hybrid": quadratureHybridTemplate,
  "comb-generator-test-only": combGeneratorTemplate,
};

/** The template of a class this build offers (a test-only class only in the test build). */
export function findSheetTemplate(deviceClass: string): SheetTemplate | undefined {
  return isDeviceClass(deviceClass) ? sheetTemplates[deviceClass] : undefined;
}

export { combGeneratorTemplate, doubleBalancedMixerTemplate, frequencyMultiplierTemplate, quadratureHybridTemplate };
