import type { DeviceClass } from "../lib/domain/device-classes";
import type { ConditionFieldId } from "../lib/domain/measurement-conditions";
import { combGeneratorConditions } from "./comb-generator-test-only/conditions";
import { doubleBalancedMixerConditions } from "./double-balanced-mixer/conditions";
import { frequencyMultiplierConditions } from "./frequency-multiplier/conditions";
import { quadratureHybridConditions } from "./quadrature-hybrid/conditions";
import type { ClassConditions } from "./types";

/**
 * Each class's conditions, apart from the rest of its template so the upload form (a client
 * component) can read them without the template's rows and prose. The templates carry the same
 * objects (SheetTemplate.conditions).
 */
export const classConditions: Readonly<Record<DeviceClass, ClassConditions>> = {
  "frequency-multiplier": frequencyMultiplierConditions,
  "double-balanced-mixer": doubleBalancedMixerConditions,
  "quadrature-hybrid": quadratureHybridConditions,
  "comb-generator-test-only": combGeneratorConditions,
};

/** The condition fields an upload for a device of this class may state, in the form's order. */
export function uploadConditionFields(deviceClass: DeviceClass): readonly ConditionFieldId[] {
  return classConditions[deviceClass].uploadFields;
}
