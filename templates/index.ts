import type { DeviceClass } from "../lib/domain/device-classes";
import { isDeviceClass } from "../lib/domain/device-classes";
import { combGeneratorTemplate } from "./comb-generator-test-only";
import { doubleBalancedMixerTemplate } from "./double-balanced-mixer";
import { frequencyMultiplierTemplate, frequencyMultiplierTemplateAt } from "./frequency-multiplier";
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

/** The classes whose rows are held at a stated drive: their template at a device's own drive (per port for a multiplier). */
const sheetTemplatesAtDrive: Readonly<Partial<Record<DeviceClass, (driveDbm: number) => SheetTemplate>>> = {
  "frequency-multiplier": frequencyMultiplierTemplateAt,
};

/**
 * The template of a class this build offers (a test-only class only in the test build). Given the
 * device's stated drive (its key condition `driveLevelDbm`, per port for a multiplier), a class whose
 * rows are held at a stated drive holds them at the device's; without one, at the class's default.
 */
export function findSheetTemplate(deviceClass: string, stated: { driveLevelDbm?: number } = {}): SheetTemplate | undefined {
  if (!isDeviceClass(deviceClass)) return undefined;
  const drive = stated.driveLevelDbm;
  const atDrive = sheetTemplatesAtDrive[deviceClass];
  return atDrive && typeof drive === "number" && Number.isFinite(drive) ? atDrive(drive) : sheetTemplates[deviceClass];
}

/**
 * The engine's parse options for a device of this class: a passive class's files are checked for
 * values no passive part can produce, an active class's are not. A file read without a device
 * (no class) is checked as a passive part's, as every shipped class is.
 */
export function ingestOptionsFor(template: Pick<SheetTemplate, "passive"> | undefined): { passive: boolean } {
  return { passive: template?.passive ?? true };
}

export { combGeneratorTemplate, doubleBalancedMixerTemplate, frequencyMultiplierTemplate, quadratureHybridTemplate };
