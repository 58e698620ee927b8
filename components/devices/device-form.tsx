"use client";

import { keyConditionField } from "@/lib/domain/measurement-conditions";
import { classConditions } from "@/templates/upload-conditions";
import { useRouter } from "next/navigation";
import { useState } from "react";
import type { DeviceBody } from "@/lib/schemas/measurements";
import type { DeviceSummary } from "@/lib/domain/devices";
import { buttonClass } from "@/components/ui/button";
import { Field, selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useJsonForm } from "@/components/use-json-form";
import { deviceClasses, deviceClassLabels, type DeviceClass } from "@/lib/domain/device-classes";
import { checkDeviceForm, initialDeviceFormValues, type DeviceFormValues } from "./device-form-values";
import { FrequencyRangeField } from "./frequency-range-field";

/** Creates a device, or edits `device` when given (same fields, same checks, PATCH instead of POST). */
export function DeviceForm({ device }: { device?: DeviceSummary }) {
  const router = useRouter();
  const editing = Boolean(device);
  const [values, setValues] = useState<DeviceFormValues>(() => initialDeviceFormValues(device));
  const set = <K extends keyof DeviceFormValues>(key: K) => (value: DeviceFormValues[K]) => setValues((v) => ({ ...v, [key]: value }));
  const { partNumber, deviceClass, title, input, output } = values;

  const { errors, formError, pending, submit } = useJsonForm<DeviceBody, { device: { id: number } }>({
    url: editing ? `/api/devices/${device!.id}` : "/api/devices",
    method: editing ? "PATCH" : "POST",
    check: () => checkDeviceForm(values),
    onSuccess: (result) => {
      if (editing) router.refresh();
      else router.push(`/devices/${result.device.id}`);
    },
    keepPendingOnSuccess: !editing,
  });

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid={editing ? "edit-device-form" : "new-device-form"}>
      <div className="grid gap-5 sm:grid-cols-2">
        <Field label="Part number" name="partNumber" value={partNumber} onChange={set("partNumber")} error={errors.partNumber} hint="Letters, digits and . _ - /" required />
        <DeviceClassSelect value={deviceClass} onChange={set("deviceClass")} />
      </div>
      <Field label="Title" name="title" value={title} onChange={set("title")} error={errors.title} hint="As it heads the datasheet, e.g. “Frequency doubler, 1–3 GHz output”" required />
      <DescriptionField value={values.description} onChange={set("description")} />
      <div className="grid gap-5 sm:grid-cols-2">
        <FrequencyRangeField legend="Input frequency range" value={input} onChange={set("input")} error={errors.inputFrequencyHz} testId="input-range" />
        <FrequencyRangeField legend="Output frequency range" value={output} onChange={set("output")} error={errors.outputFrequencyHz} testId="output-range" />
      </div>
      <div className="grid gap-5 sm:grid-cols-2">
        <DriveLevelField label={keyConditionField(classConditions[deviceClass], "drive").label} value={values.drive} onChange={set("drive")} error={errors.driveLevelDbm} />
        {deviceClass === "frequency-multiplier" ? <MultiplicationFactorField value={values.factor} onChange={set("factor")} error={errors.multiplicationFactor} /> : null}
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

function DeviceClassSelect({ value, onChange }: { value: DeviceClass; onChange: (value: DeviceClass) => void }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor="new-device-class" className="block text-[0.9375rem] font-semibold">
        Class
      </label>
      <select id="new-device-class" value={value} onChange={(e) => onChange(e.target.value as DeviceClass)} className={selectClass}>
        {deviceClasses.map((option) => (
          <option key={option} value={option}>
            {deviceClassLabels[option]}
          </option>
        ))}
      </select>
    </div>
  );
}

function DescriptionField({ value, onChange }: { value: string; onChange: (value: string) => void }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor="new-device-description" className="block text-[0.9375rem] font-semibold">
        Description <span className="font-normal text-ink-muted">(optional)</span>
      </label>
      <textarea
        id="new-device-description"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        rows={3}
        className={`${selectClass} placeholder:text-ink-muted`}
      />
    </div>
  );
}

/** The device's drive, named as its class names it ("Drive level, per port", "LO drive"). */
function DriveLevelField({ label, value, onChange, error }: { label: string; value: string; onChange: (value: string) => void; error?: string }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor="new-device-drive" className="block text-[0.9375rem] font-semibold">
        {label} <span className="font-normal text-ink-muted">(optional)</span>
      </label>
      <div className="flex items-center gap-2">
        <input
          id="new-device-drive"
          inputMode="decimal"
          value={value}
          onChange={(e) => onChange(e.target.value)}
          className={`${selectClass} figure !w-28`}
          aria-invalid={error ? true : undefined}
        />
        <span className="unit">dBm</span>
      </div>
      {error ? <p className="text-sm text-signal-deep">{error}</p> : null}
    </div>
  );
}

function MultiplicationFactorField({ value, onChange, error }: { value: string; onChange: (value: string) => void; error?: string }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor="new-device-factor" className="block text-[0.9375rem] font-semibold">
        Multiplication factor
      </label>
      <div className="flex items-center gap-2">
        <span className="unit">×</span>
        <input
          id="new-device-factor"
          inputMode="numeric"
          value={value}
          onChange={(e) => onChange(e.target.value)}
          className={`${selectClass} figure !w-20`}
          aria-invalid={error ? true : undefined}
        />
      </div>
      {error ? <p className="text-sm text-signal-deep">{error}</p> : null}
    </div>
  );
}
