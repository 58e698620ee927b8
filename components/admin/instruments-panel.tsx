"use client";

import { useId, useState } from "react";
import type { InstrumentSummary } from "@/lib/domain/instruments";
import { instrumentBodySchema, type InstrumentBody } from "@/lib/schemas/measurements";
import { formatDate, formatNumber } from "@/lib/format";
import { useJsonForm, type FormCheck } from "@/components/use-json-form";
import { useJsonResource } from "@/components/use-json-resource";
import { buttonClass } from "@/components/ui/button";
import { Field, selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { parseDecimalText } from "@/lib/ingest/number";
import { ScrollTable } from "@/components/ui/scroll-table";

type UncertaintyRow = { quantity: string; value: string; unit: string; coverageFactor: string };
type Draft = { kind: string; model: string; serial: string; calibratedOn: string; calibrationDueOn: string; uncertainty: UncertaintyRow[] };

const emptyDraft: Draft = { kind: "", model: "", serial: "", calibratedOn: "", calibrationDueOn: "", uncertainty: [] };

function draftOf(i: InstrumentSummary): Draft {
  return {
    kind: i.kind,
    model: i.model,
    serial: i.serial,
    calibratedOn: i.calibratedOn,
    calibrationDueOn: i.calibrationDueOn,
    uncertainty: i.uncertainty.map((u) => ({ quantity: u.quantity, value: String(u.value), unit: u.unit, coverageFactor: String(u.coverageFactor) })),
  };
}

export function InstrumentsPanel({ initialInstruments }: { initialInstruments: InstrumentSummary[] }) {
  const instruments = useJsonResource("/api/admin/instruments", initialInstruments, (body: { instruments: InstrumentSummary[] }) => body.instruments);
  const [editing, setEditing] = useState<InstrumentSummary | null>(null);
  const [formKey, setFormKey] = useState(0);
  const [message, setMessage] = useState<string | null>(null);
  const overdue = instruments.data.filter((i) => i.calibrationOverdue).length;

  return (
    <div className="space-y-14">
      <section aria-labelledby="instruments-title">
        <h2 id="instruments-title" className="mb-1 text-xl font-semibold">
          Instruments <span className="figure text-base font-normal text-ink-muted">({instruments.data.length})</span>
        </h2>
        <p className="mb-4 text-ink-muted">
          {overdue > 0 ? (
            <span className="font-semibold text-signal-deep">
              <span className="figure">{overdue}</span> {overdue === 1 ? "instrument is" : "instruments are"} past the calibration due date.{" "}
            </span>
          ) : null}
          Engineers choose from this list when they upload; a set measured outside an instrument&apos;s calibration window carries a warning.
        </p>
        <div aria-live="polite" className="mb-4 empty:hidden">
          {message ? <Notice tone="success">{message}</Notice> : null}
          {instruments.loadError ? <Notice tone="error">{instruments.loadError}</Notice> : null}
        </div>
        {instruments.data.length === 0 ? (
          <p className="border-y border-rule py-4 text-ink-muted" data-testid="no-instruments">
            No instrument is listed yet.
          </p>
        ) : (
          <InstrumentsTable
            instruments={instruments.data}
            onEdit={(i) => {
              setEditing(i);
              setFormKey((k) => k + 1);
              setMessage(null);
              document.getElementById("instrument-form")?.scrollIntoView({ behavior: "smooth" });
            }}
          />
        )}
      </section>

      <section id="instrument-form" aria-labelledby="instrument-form-title" className="max-w-3xl scroll-mt-8">
        <h2 id="instrument-form-title" className="mb-1 text-xl font-semibold">
          {editing ? (
            <>
              Edit {editing.model} <span className="figure">{editing.serial}</span>
            </>
          ) : (
            "Add an instrument"
          )}
        </h2>
        <p className="mb-5 text-ink-muted">The stated uncertainty (with its coverage factor) feeds the guard bands of a datasheet&apos;s limits.</p>
        <InstrumentForm
          key={formKey}
          instrument={editing}
          onSaved={(saved, created) => {
            setMessage(`${saved.model} (serial ${saved.serial}) ${created ? "added" : "updated"}.`);
            setEditing(null);
            setFormKey((k) => k + 1);
            void instruments.reload();
          }}
          onCancel={() => {
            setEditing(null);
            setFormKey((k) => k + 1);
          }}
        />
      </section>
    </div>
  );
}

function InstrumentForm({
  instrument,
  onSaved,
  onCancel,
}: {
  instrument: InstrumentSummary | null;
  onSaved: (saved: InstrumentSummary, created: boolean) => void;
  onCancel: () => void;
}) {
  const id = useId();
  const [draft, setDraft] = useState<Draft>(instrument ? draftOf(instrument) : emptyDraft);
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));
  const setRow = (index: number, change: Partial<UncertaintyRow>) => set("uncertainty", draft.uncertainty.map((r, i) => (i === index ? { ...r, ...change } : r)));

  function check(): FormCheck<InstrumentBody> {
    const parsed = instrumentBodySchema.safeParse({
      ...draft,
      uncertainty: draft.uncertainty.map((r) => ({ quantity: r.quantity, value: parseDecimalText(r.value) ?? Number.NaN, unit: r.unit, coverageFactor: parseDecimalText(r.coverageFactor) ?? 2 })),
    });
    if (parsed.success) return { body: parsed.data };
    const found: Record<string, string> = {};
    for (const issue of parsed.error.issues) {
      const key = issue.path[0] === "uncertainty" ? "uncertainty" : String(issue.path[0] ?? "");
      if (!found[key]) found[key] = issue.path[0] === "uncertainty" ? `Uncertainty row ${Number(issue.path[1]) + 1}, ${String(issue.path[2] ?? "")}: ${issue.message}` : issue.message;
    }
    return { errors: found };
  }

  // Saving remounts the form (a new key), so the button stays pending until then.
  const { errors, formError: error, pending, submit } = useJsonForm<InstrumentBody, { instrument: InstrumentSummary }>({
    url: instrument ? `/api/admin/instruments/${instrument.id}` : "/api/admin/instruments",
    method: instrument ? "PATCH" : "POST",
    check,
    onSuccess: (result) => onSaved(result.instrument, !instrument),
    keepPendingOnSuccess: true,
  });

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid="instrument-form">
      <div className="grid gap-5 sm:grid-cols-3">
        <Field label="Kind" name="kind" value={draft.kind} onChange={(v) => set("kind", v)} error={errors.kind} hint="e.g. Spectrum analyzer" required />
        <Field label="Model" name="model" value={draft.model} onChange={(v) => set("model", v)} error={errors.model} required />
        <Field label="Serial" name="serial" value={draft.serial} onChange={(v) => set("serial", v)} error={errors.serial} required />
      </div>
      <div className="grid gap-5 sm:grid-cols-3">
        <Field label="Calibrated on" name="calibratedOn" type="date" value={draft.calibratedOn} onChange={(v) => set("calibratedOn", v)} error={errors.calibratedOn} required />
        <Field label="Calibration due" name="calibrationDueOn" type="date" value={draft.calibrationDueOn} onChange={(v) => set("calibrationDueOn", v)} error={errors.calibrationDueOn} required />
      </div>
      <fieldset className="space-y-2">
        <legend className="text-[0.9375rem] font-semibold">Stated uncertainty</legend>
        {draft.uncertainty.length === 0 ? <p className="text-sm text-ink-muted">None stated yet.</p> : null}
        {draft.uncertainty.map((row, i) => (
          <div key={i} className="flex flex-wrap items-end gap-2" data-testid="uncertainty-row">
            <div className="space-y-1">
              <label htmlFor={`${id}-q${i}`} className="block text-sm">
                Quantity
              </label>
              <input id={`${id}-q${i}`} value={row.quantity} onChange={(e) => setRow(i, { quantity: e.target.value })} className={`${selectClass} !w-56`} placeholder="e.g. absolute power" />
            </div>
            <div className="space-y-1">
              <label htmlFor={`${id}-v${i}`} className="block text-sm">
                ± value
              </label>
              <input id={`${id}-v${i}`} inputMode="decimal" value={row.value} onChange={(e) => setRow(i, { value: e.target.value })} className={`${selectClass} figure !w-24`} />
            </div>
            <div className="space-y-1">
              <label htmlFor={`${id}-u${i}`} className="block text-sm">
                Unit
              </label>
              <input id={`${id}-u${i}`} value={row.unit} onChange={(e) => setRow(i, { unit: e.target.value })} className={`${selectClass} figure !w-24`} placeholder="dB" />
            </div>
            <div className="space-y-1">
              <label htmlFor={`${id}-k${i}`} className="block text-sm">
                Coverage k
              </label>
              <input id={`${id}-k${i}`} inputMode="decimal" value={row.coverageFactor} onChange={(e) => setRow(i, { coverageFactor: e.target.value })} className={`${selectClass} figure !w-20`} />
            </div>
            <button type="button" className={`${buttonClass.quiet} mb-2`} onClick={() => set("uncertainty", draft.uncertainty.filter((_, k) => k !== i))}>
              Remove<span className="sr-only"> uncertainty row {i + 1}</span>
            </button>
          </div>
        ))}
        {errors.uncertainty ? <p className="text-sm text-signal-deep">{errors.uncertainty}</p> : null}
        <button type="button" className={buttonClass.quiet} onClick={() => set("uncertainty", [...draft.uncertainty, { quantity: "", value: "", unit: "dB", coverageFactor: "2" }])}>
          Add an uncertainty row
        </button>
      </fieldset>
      <div aria-live="polite" className="empty:hidden">
        {error ? <Notice tone="error">{error}</Notice> : null}
      </div>
      <div className="flex flex-wrap gap-4">
        <button type="submit" disabled={pending} className={buttonClass.primary}>
          {pending ? "Saving…" : instrument ? "Save changes" : "Add instrument"}
        </button>
        {instrument ? (
          <button type="button" onClick={onCancel} className={buttonClass.quiet}>
            Cancel
          </button>
        ) : null}
      </div>
    </form>
  );
}

/** The register: kind, model, serial, calibration dates (overdue marked in words), stated uncertainty, Edit. */
function InstrumentsTable({ instruments, onEdit }: { instruments: InstrumentSummary[]; onEdit: (instrument: InstrumentSummary) => void }) {
  return (
    <ScrollTable label="Instruments" testId="instruments-table">
      <thead>
        <tr>
          <th scope="col">Kind</th>
          <th scope="col">Model</th>
          <th scope="col">Serial</th>
          <th scope="col" className="num">
            Calibrated
          </th>
          <th scope="col" className="num">
            Due
          </th>
          <th scope="col">Stated uncertainty</th>
          <th scope="col">
            <span className="sr-only">Edit</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {instruments.map((i) => (
          <tr key={i.id} data-testid={`instrument-${i.serial}`}>
            <td>{i.kind}</td>
            <th scope="row" className="font-semibold">
              {i.model}
            </th>
            <td className="figure">{i.serial}</td>
            <td className="num">
              <span className="figure">{formatDate(i.calibratedOn)}</span>
            </td>
            <td className="num whitespace-nowrap">
              <span className="figure">{formatDate(i.calibrationDueOn)}</span>
              {i.calibrationOverdue ? <span className="ml-2 font-semibold text-signal-deep">overdue</span> : null}
            </td>
            <td className="text-[0.875rem]">
              {i.uncertainty.length === 0 ? (
                <span className="text-ink-muted">none stated</span>
              ) : (
                <ul>
                  {i.uncertainty.map((u, k) => (
                    <li key={k} className="whitespace-nowrap">
                      {u.quantity} <span className="figure">±{formatNumber(u.value)}</span>
                      {"\u00a0"}
                      <span className="unit">{u.unit}</span> <span className="text-ink-muted">(k = {formatNumber(u.coverageFactor)})</span>
                    </li>
                  ))}
                </ul>
              )}
            </td>
            <td className="num">
              <button
                type="button"
                className={buttonClass.quiet}
                onClick={() => onEdit(i)}
              >
                Edit<span className="sr-only"> {i.model} {i.serial}</span>
              </button>
            </td>
          </tr>
        ))}
      </tbody>
    </ScrollTable>
  );
}
