import { doubleBalancedMixerTemplate } from "./double-balanced-mixer";
import { frequencyMultiplierTemplate } from "./frequency-multiplier";
import { quadratureHybridTemplate } from "./quadrature-hybrid";
import type { SheetTemplate } from "./types";

export type * from "./types";

/** Every device class Benchfold ships; a new class is a new folder plus one line here. */
export const sheetTemplates: Readonly<Record<string, SheetTemplate>> = {
  [frequencyMultiplierTemplate.deviceClass]: frequencyMultiplierTemplate,
  [doubleBalancedMixerTemplate.deviceClass]: doubleBalancedMixerTemplate,
  [quadratureHybridTemplate.deviceClass]: quadratureHybridTemplate,
};

export function findSheetTemplate(deviceClass: string): SheetTemplate | undefined {
  return Object.hasOwn(sheetTemplates, deviceClass) ? sheetTemplates[deviceClass] : undefined;
}

export { doubleBalancedMixerTemplate, frequencyMultiplierTemplate, quadratureHybridTemplate };
