"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { deviceBodySchema, type DeviceBody } from "@/lib/schemas/measurements";
import type { DeviceSummary } from "@/lib/domain/devices";
import { buttonClass } from "@/components/ui/button";
import { Field, selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useJsonForm, type FormCheck } from "@/components/use-json-form";
import { deviceClasses, deviceClassLabels, type DeviceClass } from "@/lib/domain/device-classes";
import { FrequencyRangeField, type FrequencyRangeValue } from "./frequency-range-field";
import { rangeScale } from "@/lib/format";
import { parseDecimalText } from "@/lib/ingest/number";
import { toHz, type FrequencyUnit } from "./frequency-units";

const emptyRange: FrequencyRangeValue = { min: "", max: "", unit: "GHz" };

/** A stored range (Hz) offered for editing in the unit the pages print it in ("0.2–2 GHz", lib/format). */
function rangeValue(range: { min: number; max: number } | undefined): FrequencyRangeValue {
  if (!range) return emptyRange;
  const { unit, factor } = rangeScale(range.min, range.max, "Hz");
  // Twelve significant figures: the stored hertz back exactly, without float noise (2.4000000000000004).
  const text = (hz: number) => String(Number((hz * factor).toPrecision(12)));
  return { min: text(range.min), max: text(range.max), unit: unit as FrequencyUnit };
}

/** Reads a range field: both ends or neither; in Hz; an error in words otherwise. */
function readRange(value: FrequencyRangeValue, what: string): { range?: { min: number; max: number }; error?: string } {
  const min = toHz(value.min, value.unit);
  const max = toHz(value.max, value.unit);
  if (min === undefined && max === undefined) return {};
  if (min === undefined || max === undefined) return { error: `Give both ends of the ${what}, or neither.` };
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { error: `The ${what} must be numbers.` };
  if (min <= 0 || max <= 0) return { error: `The ${what} must be above 0 ${value.unit}.` };
  if (max < min) return { error: `The ${what} must run from the lower to the higher frequency.` };
  return { range: { min, max } };
}

/** Creates a device, or edits `device` when given (same fields, same checks, PATCH instead of POST). */
export function DeviceForm({ device }: { device?: DeviceSummary }) {
  const router = useRouter();
  const editing = Boolean(device);
  const [partNumber, setPartNumber] = useState(device?.partNumber ?? "");
  const [deviceClass, setDeviceClass] = useState<DeviceClass>(device?.deviceClass ?? deviceClasses[0]);
  const [title, setTitle] = useState(device?.title ?? "");
  const [description, setDescription] = useState(device?.description ?? "");
  const [input, setInput] = useState<FrequencyRangeValue>(rangeValue(device?.keyConditions.inputFrequencyHz));
  const [output, setOutput] = useState<FrequencyRangeValue>(rangeValue(device?.keyConditions.outputFrequencyHz));
  const [drive, setDrive] = useState(device?.keyConditions.driveLevelDbm !== undefined ? String(device.keyConditions.driveLevelDbm) : "");
  const [factor, setFactor] = useState(String(device?.keyConditions.multiplicationFactor ?? 2));

  function check(): FormCheck<DeviceBody> {
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

  const { errors, formError, pending, submit } = useJsonForm<DeviceBody, { device: { id: number } }>({
    url: editing ? `/api/devices/${device!.id}` : "/api/devices",
    method: editing ? "PATCH" : "POST",
    check,
    onSuccess: (result) => {
      if (editing) router.refresh();
      else router.push(`/devices/${result.device.id}`);
    },
    keepPendingOnSuccess: !editing,
  });

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid={editing ? "edit-device-form" : "new-device-form"}>
      <div className="grid gap-5 sm:grid-cols-2">
        <Field label="Part number" name="partNumber" value={partNumber} onChange={setPartNumber} error={errors.partNumber} hint="Letters, digits and . _ - /" required />
        <div className="space-y-1.5">
          <label htmlFor="new-device-class" className="block text-[0.9375rem] font-semibold">
            Class
          </label>
          <select id="new-device-class" value={deviceClass} onChange={(e) => setDeviceClass(e.target.value as DeviceClass)} className={selectClass}>
            {deviceClasses.map((value) => (
              <option key={value} value={value}>
                {deviceClassLabels[value]}
              </option>
            ))}
          </select>
        </div>
      </div>
      <Field label="Title" name="title" value={title} onChange={setTitle} error={errors.title} hint="As it heads the datasheet, e.g. “Frequency doubler, 1–3 GHz output”" required />
      <div className="space-y-1.5">
        <label htmlFor="new-device-description" className="block text-[0.9375rem] font-semibold">
          Description <span className="font-normal text-ink-muted">(optional)</span>
        </label>
        <textarea
          id="new-device-description"
          value={description}
          onChange={(e) => setDescription(e.target.value)}
          rows={3}
          className={`${selectClass} placeholder:text-ink-muted`}
        />
      </div>
      <div className="grid gap-5 sm:grid-cols-2">
        <FrequencyRangeField legend="Input frequency range" value={input} onChange={setInput} error={errors.inputFrequencyHz} testId="input-range" />
        <FrequencyRangeField legend="Output frequency range" value={output} onChange={setOutput} error={errors.outputFrequencyHz} testId="output-range" />
      </div>
      <div className="grid gap-5 sm:grid-cols-2">
        <div className="space-y-1.5">
          <label htmlFor="new-device-drive" className="block text-[0.9375rem] font-semibold">
            Drive level <span className="font-normal text-ink-muted">(optional)</span>
          </label>
          <div className="flex items-center gap-2">
            <input
              id="new-device-drive"
              inputMode="decimal"
              value={drive}
              onChange={(e) => setDrive(e.target.value)}
              className={`${selectClass} figure !w-28`}
              aria-invalid={errors.driveLevelDbm ? true : undefined}
            />
            <span className="unit">dBm</span>
          </div>
          {errors.driveLevelDbm ? <p className="text-sm text-signal-deep">{errors.driveLevelDbm}</p> : null}
        </div>
        {deviceClass === "frequency-multiplier" ? (
          <div className="space-y-1.5">
            <label htmlFor="new-device-factor" className="block text-[0.9375rem] font-semibold">
              Multiplication factor
            </label>
            <div className="flex items-center gap-2">
              <span className="unit">×</span>
              <input
                id="new-device-factor"
                inputMode="numeric"
                value={factor}
                onChange={(e) => setFactor(e.target.value)}
                className={`${selectClass} figure !w-20`}
                aria-invalid={errors.multiplicationFactor ? true : undefined}
              />
            </div>
            {errors.multiplicationFactor ? <p className="text-sm text-signal-deep">{errors.multiplicationFactor}</p> : null}
          </div>
        ) : null}
      </div>
      <div aria-live="polite" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {editing ? (pending ? "Saving…" : "Save device") : pending ? "Creating…" : "Create device"}
      </button>
    </form>
  );
}
