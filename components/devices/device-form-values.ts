import { deviceBodySchema, type DeviceBody } from "@/lib/schemas/measurements";
import type { DeviceSummary } from "@/lib/domain/devices";
import { deviceClasses, type DeviceClass } from "@/lib/domain/device-classes";
import { rangeScale } from "@/lib/format";
import { parseDecimalText } from "@/lib/ingest/number";
import type { FormCheck } from "@/components/use-json-form";
import type { FrequencyRangeValue } from "./frequency-range-field";
import { toHz, type FrequencyUnit } from "./frequency-units";

/** What the device form holds, as typed. */
export type DeviceFormValues = {
  partNumber: string;
  deviceClass: DeviceClass;
  title: string;
  description: string;
  input: FrequencyRangeValue;
  output: FrequencyRangeValue;
  drive: string;
  factor: string;
};

const emptyRange: FrequencyRangeValue = { min: "", max: "", unit: "GHz" };

/** The form's starting values: the device's own when editing, else empty (a multiplier defaults to ×2). */
export function initialDeviceFormValues(device: DeviceSummary | undefined): DeviceFormValues {
  return {
    partNumber: device?.partNumber ?? "",
    deviceClass: device?.deviceClass ?? deviceClasses[0],
    title: device?.title ?? "",
    description: device?.description ?? "",
    input: rangeValue(device?.keyConditions.inputFrequencyHz),
    output: rangeValue(device?.keyConditions.outputFrequencyHz),
    drive: device?.keyConditions.driveLevelDbm !== undefined ? String(device.keyConditions.driveLevelDbm) : "",
    factor: String(device?.keyConditions.multiplicationFactor ?? 2),
  };
}

/** A stored range (Hz) offered for editing in the unit the pages print it in ("0.2–2 GHz", lib/format). */
export function rangeValue(range: { min: number; max: number } | undefined): FrequencyRangeValue {
  if (!range) return emptyRange;
  const { unit, factor } = rangeScale(range.min, range.max, "Hz");
  // Twelve significant figures: the stored hertz back exactly, without float noise (2.4000000000000004).
  const text = (hz: number) => String(Number((hz * factor).toPrecision(12)));
  return { min: text(range.min), max: text(range.max), unit: unit as FrequencyUnit };
}

/** Reads a range field: both ends or neither; in Hz; an error in words otherwise. */
export function readRange(value: FrequencyRangeValue, what: string): { range?: { min: number; max: number }; error?: string } {
  const min = toHz(value.min, value.unit);
  const max = toHz(value.max, value.unit);
  if (min === undefined && max === undefined) return {};
  if (min === undefined || max === undefined) return { error: `Give both ends of the ${what}, or neither.` };
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { error: `The ${what} must be numbers.` };
  if (min <= 0 || max <= 0) return { error: `The ${what} must be above 0 ${value.unit}.` };
  if (max < min) return { error: `The ${what} must run from the lower to the higher frequency.` };
  return { range: { min, max } };
}

/**
 * The request body, or an error per field: the form's own checks (ranges, drive level) first,
 * then the shared schema's. The multiplication factor is sent for a frequency multiplier only.
 */
export function checkDeviceForm(values: DeviceFormValues): FormCheck<DeviceBody> {
  const { partNumber, deviceClass, title, description, input, output, drive, factor } = values;
  const found: Record<string, string> = {};
  const inputRange = readRange(input, "input range");
  const outputRange = readRange(output, "output range");
  if (inputRange.error) found.inputFrequencyHz = inputRange.error;
  if (outputRange.error) found.outputFrequencyHz = outputRange.error;
  const driveDbm = parseDecimalText(drive);
  if (driveDbm !== undefined && !Number.isFinite(driveDbm)) found.driveLevelDbm = "The drive level must be a number in dBm.";
  const multiplicationFactor = deviceClass === "frequency-multiplier" && factor.trim() !== "" ? parseDecimalText(factor) : undefined;
  const parsed = deviceBodySchema.safeParse({
    partNumber,
    deviceClass,
    title,
    description,
    keyConditions: {
      ...(inputRange.range ? { inputFrequencyHz: inputRange.range } : {}),
      ...(outputRange.range ? { outputFrequencyHz: outputRange.range } : {}),
      ...(driveDbm !== undefined && Number.isFinite(driveDbm) ? { driveLevelDbm: driveDbm } : {}),
      ...(multiplicationFactor !== undefined ? { multiplicationFactor } : {}),
    },
  });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = issue.path[0] === "keyConditions" ? String(issue.path[1] ?? "keyConditions") : String(issue.path[0] ?? "");
      if (key && !found[key]) found[key] = issue.message;
    }
  }
  return parsed.success && Object.keys(found).length === 0 ? { body: parsed.data } : { errors: found };
}
