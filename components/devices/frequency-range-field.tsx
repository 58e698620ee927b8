"use client";

import { useId } from "react";
import { selectClass } from "@/components/ui/field";
import { frequencyUnitNames, type FrequencyUnit } from "./frequency-units";

export type FrequencyRangeValue = { min: string; max: string; unit: FrequencyUnit };

/** Two numbers and one unit: "0.5 – 1.5 GHz". */
export function FrequencyRangeField({
  legend,
  value,
  onChange,
  error,
  testId,
}: {
  legend: string;
  value: FrequencyRangeValue;
  onChange: (value: FrequencyRangeValue) => void;
  error?: string;
  testId?: string;
}) {
  const id = useId();
  return (
    <fieldset className="space-y-1.5" data-testid={testId}>
      <legend className="text-[0.9375rem] font-semibold">{legend}</legend>
      <div className="flex items-center gap-2">
        <label htmlFor={`${id}-min`} className="sr-only">
          {legend}, from
        </label>
        <input
          id={`${id}-min`}
          inputMode="decimal"
          value={value.min}
          onChange={(e) => onChange({ ...value, min: e.target.value })}
          className={`${selectClass} figure !w-28`}
          placeholder="from"
          aria-invalid={error ? true : undefined}
        />
        <span aria-hidden="true" className="text-ink-muted">
          –
        </span>
        <label htmlFor={`${id}-max`} className="sr-only">
          {legend}, to
        </label>
        <input
          id={`${id}-max`}
          inputMode="decimal"
          value={value.max}
          onChange={(e) => onChange({ ...value, max: e.target.value })}
          className={`${selectClass} figure !w-28`}
          placeholder="to"
          aria-invalid={error ? true : undefined}
        />
        <label htmlFor={`${id}-unit`} className="sr-only">
          {legend}, unit
        </label>
        <select id={`${id}-unit`} value={value.unit} onChange={(e) => onChange({ ...value, unit: e.target.value as FrequencyUnit })} className={`${selectClass} !w-24`}>
          {frequencyUnitNames.map((u) => (
            <option key={u} value={u}>
              {u}
            </option>
          ))}
        </select>
      </div>
      {error ? <p className="text-sm text-signal-deep">{error}</p> : null}
    </fieldset>
  );
}
