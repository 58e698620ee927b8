"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useId, useRef, useState } from "react";
import type { InstrumentSummary } from "@/lib/server/instruments/instrument-summary";
import { formatDate } from "@/components/format-quantity";
import { frequencyUnitNames, toHz, type FrequencyUnit } from "@/components/devices/frequency-units";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ColumnMappingPanel } from "./column-mapping-panel";
import { kindLabel, measurementKindLabels } from "./measurement-labels";
import { formatByteSize, sendUpload, type ApiErrorBody, type IngestDetail, type MappingDetail } from "./upload-request";

export type SupersedableSet = { id: number; kind: string; fileName: string; serial?: string };

type RowState =
  | { phase: "ready" }
  | { phase: "uploading"; loaded: number; total: number }
  | { phase: "processing" }
  | { phase: "done"; setId: number; warnings: number }
  | { phase: "failed"; status: number; message: string; ingest?: IngestDetail; existingSetId?: number }
  | { phase: "needs-mapping"; status: number; message: string; mapping: MappingDetail; mappingOpen: boolean };

type Row = { key: string; file: File; state: RowState };

export type UploadConditions = {
  serial: string;
  lot: string;
  temperatureC: string;
  inputFrequency: string;
  inputFrequencyUnit: FrequencyUnit;
  driveLevelDbm: string;
  splitterExcessLossDb: string;
  cableLossDb: string;
  measuredOn: string;
  notes: string;
  kind: string;
  instrumentIds: number[];
  supersedesId: string;
};

const initialConditions: UploadConditions = {
  serial: "",
  lot: "",
  temperatureC: "",
  inputFrequency: "",
  inputFrequencyUnit: "GHz",
  driveLevelDbm: "",
  splitterExcessLossDb: "",
  cableLossDb: "",
  measuredOn: "",
  notes: "",
  kind: "",
  instrumentIds: [],
  supersedesId: "",
};

let rowCounter = 0;

/** The form fields the upload routes read (lib/schemas/measurements uploadFieldsSchema). */
function buildForm(file: File, c: UploadConditions): FormData {
  const form = new FormData();
  form.append("file", file, file.name);
  const text: [string, string][] = [
    ["serial", c.serial],
    ["lot", c.lot],
    ["temperatureC", c.temperatureC],
    ["driveLevelDbm", c.driveLevelDbm],
    ["splitterExcessLossDb", c.splitterExcessLossDb],
    ["cableLossDb", c.cableLossDb],
    ["measuredOn", c.measuredOn],
    ["notes", c.notes],
    ["kind", c.kind],
    ["supersedesId", c.supersedesId],
  ];
  for (const [key, value] of text) if (value.trim() !== "") form.append(key, value.trim().replace("\u2212", "-"));
  const hz = toHz(c.inputFrequency, c.inputFrequencyUnit);
  if (hz !== undefined) form.append("inputFrequencyHz", String(hz));
  if (c.instrumentIds.length) form.append("instrumentIds", c.instrumentIds.join(","));
  return form;
}

function checkConditions(c: UploadConditions, fileCount: number): string | null {
  const numbers: [string, string][] = [
    ["Temperature", c.temperatureC],
    ["Drive level", c.driveLevelDbm],
    ["Splitter excess loss", c.splitterExcessLossDb],
    ["Cable loss", c.cableLossDb],
  ];
  for (const [label, value] of numbers) {
    if (value.trim() !== "" && !Number.isFinite(Number(value.trim().replace("\u2212", "-")))) return `${label} must be a number.`;
  }
  const hz = toHz(c.inputFrequency, c.inputFrequencyUnit);
  if (hz !== undefined && !(hz > 0)) return "Input frequency must be a number above 0.";
  if (c.supersedesId && fileCount > 1) return "A correction replaces one set: choose one file when a set is superseded.";
  return null;
}

type UploadPanelProps = { deviceId: number; instruments: InstrumentSummary[]; supersedable: SupersedableSet[] };

export function UploadPanel({ deviceId, instruments, supersedable }: UploadPanelProps) {
  const router = useRouter();
  const id = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const [conditions, setConditions] = useState<UploadConditions>(initialConditions);
  const [rows, setRows] = useState<Row[]>([]);
  const [dragging, setDragging] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const [running, setRunning] = useState(false);

  const set = <K extends keyof UploadConditions>(key: K, value: UploadConditions[K]) => setConditions((c) => ({ ...c, [key]: value }));
  const updateRow = (key: string, state: RowState) => setRows((all) => all.map((r) => (r.key === key ? { ...r, state } : r)));

  function addFiles(list: FileList | File[]) {
    const files = Array.from(list);
    if (files.length === 0) return;
    setRows((all) => [...all.filter((r) => r.state.phase !== "ready" || !files.some((f) => f.name === r.file.name)), ...files.map((file) => ({ key: `f${++rowCounter}`, file, state: { phase: "ready" } as RowState }))]);
  }

  async function uploadOne(row: Row, c: UploadConditions): Promise<boolean> {
    updateRow(row.key, { phase: "uploading", loaded: 0, total: row.file.size });
    try {
      const response = await sendUpload({
        url: `/api/devices/${deviceId}/measurements`,
        form: buildForm(row.file, c),
        onProgress: ({ loaded, total }) => {
          if (loaded >= total) updateRow(row.key, { phase: "processing" });
          else updateRow(row.key, { phase: "uploading", loaded, total });
        },
      });
      if (response.status === 201) {
        const body = response.body as { measurementSet: { id: number; warnings: string[] } };
        updateRow(row.key, { phase: "done", setId: body.measurementSet.id, warnings: body.measurementSet.warnings.length });
        return true;
      }
      const error = (response.body as ApiErrorBody | null)?.error;
      const message = error?.message ?? `The server answered ${response.status}.`;
      if (response.status === 422 && error?.details?.mapping) {
        updateRow(row.key, { phase: "needs-mapping", status: response.status, message, mapping: error.details.mapping, mappingOpen: true });
      } else {
        updateRow(row.key, { phase: "failed", status: response.status, message, ingest: error?.details?.ingest, existingSetId: error?.details?.existingSetId });
      }
    } catch (error) {
      updateRow(row.key, { phase: "failed", status: 0, message: error instanceof Error ? error.message : "The upload failed." });
    }
    return false;
  }

  async function uploadRows(targets: Row[]) {
    const problem = checkConditions(conditions, targets.length);
    setFormError(problem);
    if (problem || targets.length === 0) return;
    setRunning(true);
    const snapshot = conditions;
    // Two at a time: each row shows its own progress, and a batch of many files does not flood the server.
    const queue = [...targets];
    let anyDone = false;
    const worker = async () => {
      for (let next = queue.shift(); next; next = queue.shift()) anyDone = (await uploadOne(next, snapshot)) || anyDone;
    };
    await Promise.all([worker(), worker()]);
    setRunning(false);
    if (anyDone) router.refresh();
  }

  const ready = rows.filter((r) => r.state.phase === "ready");
  const finished = rows.filter((r) => r.state.phase === "done" || r.state.phase === "failed");

  return (
    <section aria-labelledby={`${id}-title`} className="border-t border-rule pt-8" data-testid="upload-panel">
      <h2 id={`${id}-title`} className="mb-1 text-xl font-semibold">
        Upload measurements
      </h2>
      <p className="mb-6 max-w-prose text-ink-muted">
        CSV sweeps (drive, frequency, two-tone, phase noise) or Touchstone files. The conditions below apply to every file in the batch; a value the file
        states itself is kept, and a disagreement is recorded as a warning.
      </p>

      <div className="grid gap-10 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
        <fieldset className="space-y-4" disabled={running} data-testid="upload-conditions">
          <legend className="running-head mb-3">Conditions for this batch</legend>
          <div className="grid gap-4 sm:grid-cols-2">
            <TextInput label="Serial" value={conditions.serial} onChange={(v) => set("serial", v)} hint="Used when the file has no # serial: line" mono />
            <TextInput label="Lot" value={conditions.lot} onChange={(v) => set("lot", v)} mono />
            <UnitInput label="Temperature" unit="°C" value={conditions.temperatureC} onChange={(v) => set("temperatureC", v)} />
            <div className="space-y-1.5">
              <label htmlFor={`${id}-fin`} className="block text-[0.9375rem] font-semibold">
                Input frequency
              </label>
              <div className="flex items-center gap-2">
                <input
                  id={`${id}-fin`}
                  inputMode="decimal"
                  value={conditions.inputFrequency}
                  onChange={(e) => set("inputFrequency", e.target.value)}
                  className={`${selectClass} figure !w-28`}
                />
                <label htmlFor={`${id}-fin-unit`} className="sr-only">
                  Input frequency unit
                </label>
                <select
                  id={`${id}-fin-unit`}
                  value={conditions.inputFrequencyUnit}
                  onChange={(e) => set("inputFrequencyUnit", e.target.value as FrequencyUnit)}
                  className={`${selectClass} !w-24`}
                >
                  {frequencyUnitNames.map((u) => (
                    <option key={u}>{u}</option>
                  ))}
                </select>
              </div>
            </div>
            <UnitInput label="Drive level" unit="dBm" value={conditions.driveLevelDbm} onChange={(v) => set("driveLevelDbm", v)} />
            <UnitInput label="Splitter excess loss" unit="dB" value={conditions.splitterExcessLossDb} onChange={(v) => set("splitterExcessLossDb", v)} hint="Beyond the ideal 3.01 dB split" />
            <UnitInput label="Cable loss" unit="dB" value={conditions.cableLossDb} onChange={(v) => set("cableLossDb", v)} />
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

          <fieldset className="space-y-2">
            <legend className="text-[0.9375rem] font-semibold">Instruments</legend>
            {instruments.length === 0 ? (
              <p className="text-sm text-ink-muted">Your administrator has listed no instruments yet.</p>
            ) : (
              <ul className="max-h-52 space-y-1 overflow-y-auto border-y border-rule py-2" data-testid="upload-instruments">
                {instruments.map((instrument) => {
                  const checked = conditions.instrumentIds.includes(instrument.id);
                  return (
                    <li key={instrument.id}>
                      <label className="flex items-baseline gap-2 text-[0.9375rem]">
                        <input
                          type="checkbox"
                          checked={checked}
                          onChange={() =>
                            set("instrumentIds", checked ? conditions.instrumentIds.filter((x) => x !== instrument.id) : [...conditions.instrumentIds, instrument.id])
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

          <div className="space-y-1.5">
            <label htmlFor={`${id}-notes`} className="block text-[0.9375rem] font-semibold">
              Notes
            </label>
            <textarea id={`${id}-notes`} value={conditions.notes} onChange={(e) => set("notes", e.target.value)} rows={2} className={selectClass} />
          </div>
        </fieldset>

        <div className="min-w-0 space-y-4">
          <div
            onDragOver={(e) => {
              e.preventDefault();
              setDragging(true);
            }}
            onDragLeave={() => setDragging(false)}
            onDrop={(e) => {
              e.preventDefault();
              setDragging(false);
              addFiles(e.dataTransfer.files);
            }}
            className={`flex flex-col items-center justify-center gap-3 border border-dashed px-6 py-10 text-center transition-colors ${
              dragging ? "border-signal bg-signal-wash" : "border-rule-strong bg-paper-bright"
            }`}
            data-testid="upload-dropzone"
          >
            <p className="text-[1.0625rem]">Drop measurement files here</p>
            <p className="text-sm text-ink-muted">.csv, .tsv, .txt, .s1p–.s4p, .ts · up to 10 MB each</p>
            <input
              ref={inputRef}
              id={`${id}-files`}
              type="file"
              multiple
              className="peer sr-only"
              onChange={(e) => {
                if (e.target.files) addFiles(e.target.files);
                e.target.value = "";
              }}
              data-testid="upload-file-input"
            />
            <label htmlFor={`${id}-files`} className={`${buttonClass.secondary} cursor-pointer peer-focus-visible:outline-2 peer-focus-visible:outline-signal`}>
              Choose files…
            </label>
          </div>

          <div aria-live="polite" className="empty:hidden">
            {formError ? <Notice tone="error">{formError}</Notice> : null}
          </div>


          {rows.length > 0 ? (
            <ol className="divide-y divide-rule border-y border-rule" data-testid="upload-rows" aria-label="Files in this batch">
              {rows.map((row) => (
                <UploadRowView
                  key={row.key}
                  row={row}
                  deviceId={deviceId}
                  onRemove={() => setRows((all) => all.filter((r) => r.key !== row.key))}
                  onRetry={() => void uploadRows([row])}
                  onToggleMapping={(open) => row.state.phase === "needs-mapping" && updateRow(row.key, { ...row.state, mappingOpen: open })}
                />
              ))}
            </ol>
          ) : null}

          <div className="flex flex-wrap items-center gap-4">
            <button type="button" className={buttonClass.primary} disabled={running || ready.length === 0} onClick={() => void uploadRows(ready)}>
              {running ? "Uploading…" : ready.length > 1 ? `Upload ${ready.length} files` : "Upload"}
            </button>
            {finished.length > 0 && !running ? (
              <button type="button" className={buttonClass.quiet} onClick={() => setRows((all) => all.filter((r) => r.state.phase !== "done" && r.state.phase !== "failed"))}>
                Clear finished rows
              </button>
            ) : null}
          </div>
        </div>
      </div>

      {rows.map((row) =>
        row.state.phase === "needs-mapping" && row.state.mappingOpen ? (
          <div key={row.key} id={`mapping-${row.key}`} className="mt-10 scroll-mt-6">
            <ColumnMappingPanel
              fileName={row.file.name}
              detail={row.state.mapping}
              conditions={conditions}
              onCancel={() => row.state.phase === "needs-mapping" && updateRow(row.key, { ...row.state, mappingOpen: false })}
              onSaved={() => void uploadRows([row])}
            />
          </div>
        ) : null,
      )}
    </section>
  );
}

type UploadRowViewProps = {
  row: Row;
  deviceId: number;
  onRemove: () => void;
  onRetry: () => void;
  onToggleMapping: (open: boolean) => void;
};

function UploadRowView({ row, deviceId, onRemove, onRetry, onToggleMapping }: UploadRowViewProps) {
  const { file, state } = row;
  const percent = state.phase === "uploading" && state.total > 0 ? Math.round((state.loaded / state.total) * 100) : state.phase === "processing" ? 100 : 0;
  return (
    <li className="py-3" data-testid="upload-row" data-phase={state.phase} data-file={file.name}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <p className="min-w-0 truncate">
          <span className="figure font-semibold">{file.name}</span> <span className="text-sm text-ink-muted">{formatByteSize(file.size)}</span>
        </p>
        <p className="text-sm" data-testid="upload-row-status">
          {state.phase === "ready" ? <span className="text-ink-muted">Ready</span> : null}
          {state.phase === "uploading" ? (
            <span className="text-ink-muted">
              Sending <span className="figure">{percent}</span>%
            </span>
          ) : null}
          {state.phase === "processing" ? <span className="text-ink-muted">Sent; checking and computing…</span> : null}
          {state.phase === "done" ? (
            <span>
              <span className="running-head mr-1.5 !text-ink">Done</span>
              <Link href={`/devices/${deviceId}/measurements/${state.setId}`} className="font-semibold">
                Set <span className="figure">#{state.setId}</span>
              </Link>
              {state.warnings > 0 ? (
                <span className="ml-1.5 text-signal-deep">
                  · <span className="figure">{state.warnings}</span> {state.warnings === 1 ? "warning" : "warnings"}
                </span>
              ) : null}
            </span>
          ) : null}
          {state.phase === "failed" ? (
            <span className="running-head !text-signal-deep">
              Refused{state.status ? <> · <span className="figure">{state.status}</span></> : null}
            </span>
          ) : null}
          {state.phase === "needs-mapping" ? <span className="running-head !text-signal-deep">Columns not recognised</span> : null}
        </p>
      </div>

      {state.phase === "uploading" || state.phase === "processing" ? (
        <div className="mt-2">
          <progress
            max={100}
            value={percent}
            aria-label={`Upload of ${file.name}`}
            className="upload-progress h-1.5 w-full appearance-none overflow-hidden rounded-none [&::-moz-progress-bar]:bg-ink [&::-webkit-progress-bar]:bg-paper-deep [&::-webkit-progress-value]:bg-ink"
            data-testid="upload-progress"
          />
        </div>
      ) : null}

      {state.phase === "failed" ? (
        <div className="mt-2 border-l-2 border-signal bg-signal-wash px-3 py-2 text-[0.9375rem]" role="alert" data-testid="upload-error">
          <p className="figure text-[0.875rem] leading-relaxed break-words">{state.message}</p>
          {state.ingest && (state.ingest.line !== undefined || state.ingest.column !== undefined) ? (
            <p className="mt-1 text-sm text-ink-muted">
              {state.ingest.line !== undefined ? (
                <>
                  line <span className="figure text-ink">{state.ingest.line}</span>
                </>
              ) : null}
              {state.ingest.column !== undefined ? (
                <>
                  {" "}
                  · column <span className="figure text-ink">{state.ingest.column}</span>
                </>
              ) : null}
              {state.ingest.field ? (
                <>
                  {" "}
                  · <span className="figure text-ink">{state.ingest.field}</span>
                </>
              ) : null}
              {state.ingest.code ? <> · {state.ingest.code}</> : null}
            </p>
          ) : null}
          {state.existingSetId ? (
            <p className="mt-1 text-sm">
              <Link href={`/devices/${deviceId}/measurements/${state.existingSetId}`}>Open set #{state.existingSetId}</Link>
            </p>
          ) : null}
        </div>
      ) : null}

      {state.phase === "needs-mapping" ? (
        <div className="mt-2 space-y-3">
          <p className="text-[0.9375rem]">
            <span className="figure text-[0.875rem]">{state.message}</span>{" "}
            {state.mappingOpen ? (
              <a href={`#mapping-${row.key}`} className="text-[0.9375rem]">
                Map the columns below ↓
              </a>
            ) : (
              <button type="button" className={buttonClass.quiet} onClick={() => onToggleMapping(true)}>
                Map the columns
              </button>
            )}
          </p>
        </div>
      ) : null}

      {state.phase === "ready" || state.phase === "failed" ? (
        <p className="mt-1.5 flex gap-4 text-sm">
          {state.phase === "failed" ? (
            <button type="button" className={buttonClass.quiet} onClick={onRetry}>
              Try again
            </button>
          ) : null}
          <button type="button" className={buttonClass.quiet} onClick={onRemove}>
            Remove<span className="sr-only"> {file.name}</span>
          </button>
        </p>
      ) : null}
    </li>
  );
}

function TextInput({ label, value, onChange, hint, mono }: { label: string; value: string; onChange: (v: string) => void; hint?: string; mono?: boolean }) {
  const id = useId();
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-[0.9375rem] font-semibold">
        {label}
      </label>
      <input id={id} value={value} onChange={(e) => onChange(e.target.value)} className={`${selectClass} ${mono ? "figure" : ""}`} aria-describedby={hint ? `${id}-hint` : undefined} />
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

function UnitInput({ label, unit, value, onChange, hint }: { label: string; unit: string; value: string; onChange: (v: string) => void; hint?: string }) {
  const id = useId();
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-[0.9375rem] font-semibold">
        {label}
      </label>
      <div className="flex items-center gap-2">
        <input id={id} inputMode="decimal" value={value} onChange={(e) => onChange(e.target.value)} className={`${selectClass} figure !w-28`} aria-describedby={hint ? `${id}-hint` : undefined} />
        <span className="unit">{unit}</span>
      </div>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}
