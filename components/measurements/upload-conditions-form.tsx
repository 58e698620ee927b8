"use client";

import { useId } from "react";
import type { InstrumentSummary } from "@/lib/domain/instruments";
import { formatDate } from "@/lib/format";
import { frequencyUnitNames, type FrequencyUnit } from "@/components/devices/frequency-units";
import { selectClass } from "@/components/ui/field";
import { kindLabel, measurementKindLabels } from "@/lib/domain/measurements";
import { namedIntegrationBands, spurBandwidthKinds, type SpurBandwidthKind } from "@/lib/domain/analysis-settings";
import { conditionFields, type ConditionFieldId } from "@/lib/domain/measurement-conditions";
import { fieldOf, unitOf, type SupersedableSet, type UploadConditions } from "./upload-form-data";

type UploadConditionsFormProps = {
  conditions: UploadConditions;
  /** The device class's name, for the sentence saying which conditions it is stated at. */
  classLabel: string;
  onChange: <K extends keyof UploadConditions>(key: K, value: UploadConditions[K]) => void;
  disabled: boolean;
  instruments: InstrumentSummary[];
  supersedable: SupersedableSet[];
};

/** The conditions that apply to every file of a batch: unit, environment, set-up, instruments, notes. */
export function UploadConditionsForm({ conditions, classLabel, onChange: set, disabled, instruments, supersedable }: UploadConditionsFormProps) {
  const id = useId();
  return (
    <fieldset className="space-y-4" disabled={disabled} data-testid="upload-conditions">
      <legend className="running-head mb-3">Conditions for this batch</legend>
      <p className="text-sm text-ink-muted" data-testid="upload-class-conditions">
        A {classLabel.toLowerCase()} is stated at: {conditions.classFields.map((f) => fieldOf(conditions, f).label.replace(/^(?!RF|LO|IF)./, (c) => c.toLowerCase())).join(", ")}, besides the unit and temperature.
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextInput label="Serial" value={conditions.serial} onChange={(v) => set("serial", v)} hint="Used when the file has no # serial: line" mono />
        <TextInput label="Lot" value={conditions.lot} onChange={(v) => set("lot", v)} mono />
        <UnitInput label="Temperature" unit="°C" value={conditions.temperatureC} onChange={(v) => set("temperatureC", v)} />
        {conditions.classFields.map((fieldId) => (
          <ClassConditionInput key={fieldId} fieldId={fieldId} conditions={conditions} onChange={set} />
        ))}
        <div className="space-y-1.5">
          <label htmlFor={`${id}-date`} className="block text-[0.9375rem] font-semibold">
            Measured on
          </label>
          <input id={`${id}-date`} type="date" value={conditions.measuredOn} onChange={(e) => set("measuredOn", e.target.value)} className={`${selectClass} figure`} />
        </div>
        <div className="space-y-1.5">
          <label htmlFor={`${id}-kind`} className="block text-[0.9375rem] font-semibold">
            Kind
          </label>
          <select id={`${id}-kind`} value={conditions.kind} onChange={(e) => set("kind", e.target.value)} className={selectClass}>
            <option value="">Detect from the file</option>
            {Object.entries(measurementKindLabels).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </div>
        <div className="space-y-1.5">
          <label htmlFor={`${id}-supersedes`} className="block text-[0.9375rem] font-semibold">
            Supersedes set
          </label>
          <select id={`${id}-supersedes`} value={conditions.supersedesId} onChange={(e) => set("supersedesId", e.target.value)} className={selectClass}>
            <option value="">None — a new set</option>
            {supersedable.map((s) => (
              <option key={s.id} value={String(s.id)}>
                #{s.id} · {kindLabel(s.kind)} · {s.serial ?? "no serial"} · {s.fileName}
              </option>
            ))}
          </select>
          <p className="text-sm text-ink-muted">For a correction: the older set stays on record, marked superseded.</p>
        </div>
      </div>

      <MeasurementSettings conditions={conditions} onChange={set} />

      <InstrumentChoice instruments={instruments} chosen={conditions.instrumentIds} onChange={(ids) => set("instrumentIds", ids)} />

      <div className="space-y-1.5">
        <label htmlFor={`${id}-notes`} className="block text-[0.9375rem] font-semibold">
          Notes
        </label>
        <textarea id={`${id}-notes`} value={conditions.notes} onChange={(e) => set("notes", e.target.value)} rows={2} className={selectClass} />
      </div>
    </fieldset>
  );
}

/**
 * The settings the engine uses for this batch: the phase-noise integration band (a named band, or two
 * ends), the compression reference drive, the impedance of power readings and the phase-noise trace's
 * analyzer bandwidth (its 3 dB RBW or its noise bandwidth, for spurs in dBc). A file's own "# integration_start:" /
 * "# integration_stop:" / "# compression_reference:" / "# impedance:" / bandwidth lines and columns win over these;
 * left empty, the device class's defaults apply (no bandwidth: spurs stay as plotted, in dBc/Hz).
 */
function MeasurementSettings({ conditions, onChange: set }: Pick<UploadConditionsFormProps, "conditions" | "onChange">) {
  const id = useId();
  return (
    <fieldset className="space-y-3" data-testid="upload-settings">
      <legend className="text-[0.9375rem] font-semibold">Measurement settings</legend>
      <div className="grid gap-4 sm:grid-cols-2">
        <LabelledInput id={`${id}-band`} label="Integration band (rms phase, jitter)" hint="Phase-noise files only; a band outside the trace is refused">
          <select id={`${id}-band`} value={conditions.integrationBand} onChange={(e) => set("integrationBand", e.target.value)} className={selectClass} aria-describedby={`${id}-band-hint`}>
            <option value="">Device class default</option>
            {namedIntegrationBands.map((band) => (
              <option key={band.id} value={band.id}>
                {band.label}
              </option>
            ))}
            <option value="custom">Other band…</option>
          </select>
        </LabelledInput>
        <UnitInput
          label="Compression reference drive"
          unit="dBm"
          value={conditions.compressionReferenceDbm}
          onChange={(v) => set("compressionReferenceDbm", v)}
          hint="Small-signal gain for P1dB is read here; empty: the leading steps within 0.1 dB of the first"
        />
        <UnitInput
          label="Impedance"
          unit="Ω"
          value={conditions.impedanceOhm}
          onChange={(v) => set("impedanceOhm", v)}
          hint="For Vrms and dBµV of power readings, 1 to 1000 Ω; empty: 50 Ω. A Touchstone file keeps its own"
        />
        <LabelledInput id={`${id}-bandwidth-kind`} label="Analyzer bandwidth stated as" hint="Phase-noise files only: which bandwidth the figure below is">
          <select
            id={`${id}-bandwidth-kind`}
            value={conditions.spurBandwidthKind}
            onChange={(e) => set("spurBandwidthKind", e.target.value as SpurBandwidthKind)}
            className={selectClass}
            aria-describedby={`${id}-bandwidth-kind-hint`}
          >
            {spurBandwidthKinds.map((kind) => (
              <option key={kind} value={kind}>
                {spurBandwidthOptionWords[kind]}
              </option>
            ))}
          </select>
        </LabelledInput>
        <FrequencyInput
          label="Analyzer bandwidth (spurs in dBc)"
          hint="The trace's own line or column wins; empty: spurs stay as plotted, in dBc/Hz"
          value={conditions.spurBandwidth}
          unit={conditions.spurBandwidthUnit}
          onValue={(v) => set("spurBandwidth", v)}
          onUnit={(u) => set("spurBandwidthUnit", u)}
          testId="upload-spur-bandwidth"
        />
      </div>
      {conditions.integrationBand === "custom" ? (
        <div className="flex flex-wrap gap-4">
          <FrequencyInput label="Band start offset" value={conditions.integrationStart} unit={conditions.integrationStartUnit} onValue={(v) => set("integrationStart", v)} onUnit={(u) => set("integrationStartUnit", u)} />
          <FrequencyInput label="Band stop offset" value={conditions.integrationStop} unit={conditions.integrationStopUnit} onValue={(v) => set("integrationStop", v)} onUnit={(u) => set("integrationStopUnit", u)} />
        </div>
      ) : null}
    </fieldset>
  );
}

/** The choice's words: the 3 dB RBW is converted by a Gaussian filter's factor, a noise bandwidth is used as it is. */
const spurBandwidthOptionWords: Record<SpurBandwidthKind, string> = {
  resolution: "Resolution bandwidth (3 dB RBW)",
  noise: "Noise bandwidth (ENBW)",
};

/** One of the class's condition fields: a frequency with its unit, or a number in dBm or dB. */
function ClassConditionInput({ fieldId, conditions, onChange: set }: { fieldId: ConditionFieldId } & Pick<UploadConditionsFormProps, "conditions" | "onChange">) {
  const field = fieldOf(conditions, fieldId);
  const value = conditions.values[fieldId] ?? "";
  const setValue = (v: string) => set("values", { ...conditions.values, [fieldId]: v });
  if (field.kind === "frequency") {
    return (
      <FrequencyInput
        label={field.label}
        hint={field.hint}
        value={value}
        unit={unitOf(conditions, fieldId)}
        onValue={setValue}
        onUnit={(u) => set("units", { ...conditions.units, [fieldId]: u })}
        testId={`condition-${fieldId}`}
      />
    );
  }
  return <UnitInput label={field.label} unit={field.unit} value={value} onChange={setValue} hint={field.hint} testId={`condition-${fieldId}`} />;
}

function FrequencyInput(props: { label: string; hint?: string; value: string; unit: FrequencyUnit; onValue: (v: string) => void; onUnit: (u: FrequencyUnit) => void; testId?: string }) {
  const id = useId();
  return (
    <div className="space-y-1.5" data-testid={props.testId}>
      <label htmlFor={id} className="block text-[0.9375rem] font-semibold">
        {props.label}
      </label>
      <div className="flex items-center gap-2">
        <input
          id={id}
          inputMode="decimal"
          value={props.value}
          onChange={(e) => props.onValue(e.target.value)}
          className={`${selectClass} figure !w-28`}
          aria-describedby={props.hint ? `${id}-hint` : undefined}
        />
        <label htmlFor={`${id}-unit`} className="sr-only">
          {props.label} unit
        </label>
        <select id={`${id}-unit`} value={props.unit} onChange={(e) => props.onUnit(e.target.value as FrequencyUnit)} className={`${selectClass} !w-24`}>
          {frequencyUnitNames.map((u) => (
            <option key={u}>{u}</option>
          ))}
        </select>
      </div>
      {props.hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {props.hint}
        </p>
      ) : null}
    </div>
  );
}

/** The organization's instruments, ticked for the ones used; calibration state beside each. */
function InstrumentChoice({ instruments, chosen, onChange }: { instruments: InstrumentSummary[]; chosen: number[]; onChange: (ids: number[]) => void }) {
  return (
    <fieldset className="space-y-2">
      <legend className="text-[0.9375rem] font-semibold">Instruments</legend>
      {instruments.length === 0 ? (
        <p className="text-sm text-ink-muted">Your administrator has listed no instruments yet.</p>
      ) : (
        <ul className="max-h-52 space-y-1 overflow-y-auto border-y border-rule py-2" data-testid="upload-instruments">
          {instruments.map((instrument) => {
            const checked = chosen.includes(instrument.id);
            return (
              <li key={instrument.id}>
                <label className="flex items-baseline gap-2 text-[0.9375rem]">
                  <input
                    type="checkbox"
                    checked={checked}
                    onChange={() =>
                      onChange(checked ? chosen.filter((x) => x !== instrument.id) : [...chosen, instrument.id])
                    }
                    className="translate-y-px accent-[var(--color-signal)]"
                  />
                  <span>
                    {instrument.kind} · {instrument.model} <span className="figure text-ink-muted">{instrument.serial}</span>
                    {instrument.calibrationOverdue ? (
                      <span className="ml-1.5 font-semibold text-signal-deep">
                        · calibration overdue since <span className="figure">{formatDate(instrument.calibrationDueOn)}</span>
                      </span>
                    ) : (
                      <span className="ml-1.5 text-sm text-ink-muted">
                        · due <span className="figure">{formatDate(instrument.calibrationDueOn)}</span>
                      </span>
                    )}
                  </span>
                </label>
              </li>
            );
          })}
        </ul>
      )}
    </fieldset>
  );
}

function TextInput({ label, value, onChange, hint, mono }: { label: string; value: string; onChange: (v: string) => void; hint?: string; mono?: boolean }) {
  const id = useId();
  return (
    <LabelledInput id={id} label={label} hint={hint}>
      <input id={id} value={value} onChange={(e) => onChange(e.target.value)} className={`${selectClass} ${mono ? "figure" : ""}`} aria-describedby={hint ? `${id}-hint` : undefined} />
    </LabelledInput>
  );
}

function UnitInput({ label, unit, value, onChange, hint, testId }: { label: string; unit: string; value: string; onChange: (v: string) => void; hint?: string; testId?: string }) {
  const id = useId();
  return (
    <LabelledInput id={id} label={label} hint={hint} testId={testId}>
      <div className="flex items-center gap-2">
        <input id={id} inputMode="decimal" value={value} onChange={(e) => onChange(e.target.value)} className={`${selectClass} figure !w-28`} aria-describedby={hint ? `${id}-hint` : undefined} />
        <span className="unit">{unit}</span>
      </div>
    </LabelledInput>
  );
}

/** The label above an input (given as children, with this `id`) and its hint below, as `${id}-hint`. */
function LabelledInput({ id, label, hint, children, testId }: { id: string; label: string; hint?: string; children: React.ReactNode; testId?: string }) {
  return (
    <div className="space-y-1.5" data-testid={testId}>
      <label htmlFor={id} className="block text-[0.9375rem] font-semibold">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}
