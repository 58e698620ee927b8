"use client";

import { useMemo, useState, type FormEvent } from "react";
import { limitBases, limitBasisWords, type LimitBasis } from "@/lib/domain/sheets";
import type { SpecLimitInput, StatisticsGroup } from "@/lib/sheet/types";
import { ApiError, requestJson } from "@/components/api-client";
import { formatNumber } from "@/lib/format";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Notation } from "@/components/sheet/notation";
import { FlagList } from "./flag-list";
import { figureInputText, parseFigure } from "./parse-figure";
import type { WorkspaceModel } from "./workspace-types";

type LimitDraft = { min: string; typ: string; max: string; basis: LimitBasis; footnote: string };

/** A statistics group's identity and words, plus the group itself when the data fill it. */
type EditorRow = Pick<StatisticsGroup, "parameter" | "conditionsKey" | "label" | "symbol" | "unit" | "conditionsText" | "rowId"> & {
  key: string;
  group: StatisticsGroup | null;
};

const basisOptions = limitBases.map((value) => ({ value, label: limitBasisWords[value].choice }));

const limitKey = (parameter: string, conditionsKey: string) => `${parameter}|${conditionsKey}`;

function draftOf(limit: SpecLimitInput | undefined, defaultBasis: LimitBasis): LimitDraft {
  return {
    min: figureInputText(limit?.min),
    typ: figureInputText(limit?.typ),
    max: figureInputText(limit?.max),
    basis: limit?.basis ?? defaultBasis,
    footnote: limit?.footnote ?? "",
  };
}

const sameDraft = (a: LimitDraft, b: LimitDraft) =>
  a.min.trim() === b.min.trim() && a.typ.trim() === b.typ.trim() && a.max.trim() === b.max.trim() && a.footnote.trim() === b.footnote.trim() && (a.basis === b.basis || !hasValue(a));
const hasValue = (d: LimitDraft) => d.min.trim() !== "" || d.typ.trim() !== "" || d.max.trim() !== "";

type SpecLimitsEditorProps = { deviceId: number; model: WorkspaceModel; limits: SpecLimitInput[]; onSaved: () => void };

/** One line per statistics group: the limits an engineer states, beside the statistics and flags that judge them. */
export function SpecLimitsEditor({ deviceId, model, limits, onSaved }: SpecLimitsEditorProps) {
  const { statistics, specifications } = model;
  const rows = useMemo<EditorRow[]>(() => {
    const fromGroups: EditorRow[] = statistics.groups.map((g) => ({
      key: limitKey(g.parameter, g.conditionsKey),
      parameter: g.parameter,
      conditionsKey: g.conditionsKey,
      label: g.label,
      symbol: g.symbol,
      unit: g.unit,
      conditionsText: g.conditionsText,
      rowId: g.rowId,
      group: g,
    }));
    const offered = new Set(fromGroups.map((r) => r.key));
    // Limits stated earlier whose data are gone still belong to the saved set: shown, so nothing is dropped unseen.
    const orphans: EditorRow[] = limits
      .filter((l) => !offered.has(limitKey(l.parameter, l.conditionsKey)))
      .map((l) => ({
        key: limitKey(l.parameter, l.conditionsKey),
        parameter: l.parameter,
        conditionsKey: l.conditionsKey,
        label: l.parameter,
        symbol: "",
        unit: l.unit,
        conditionsText: l.conditionsKey || "no conditions",
        rowId: "without-data",
        group: null,
      }));
    return [...fromGroups, ...orphans];
  }, [statistics.groups, limits]);

  const defaultBasisOf = useMemo(() => {
    const byGroup = new Map(specifications.rows.map((r) => [r.groupId, r.basis]));
    return (row: EditorRow): LimitBasis => (row.group ? (byGroup.get(row.group.groupId) ?? "characterization") : "characterization");
  }, [specifications.rows]);

  const initialDrafts = useMemo(() => {
    const byKey = new Map(limits.map((l) => [limitKey(l.parameter, l.conditionsKey), l]));
    return Object.fromEntries(rows.map((r) => [r.key, draftOf(byKey.get(r.key), defaultBasisOf(r))]));
  }, [rows, limits, defaultBasisOf]);

  const [drafts, setDrafts] = useState<Record<string, LimitDraft>>(initialDrafts);
  const [saved, setSaved] = useState<Record<string, LimitDraft>>(initialDrafts);
  const [rowErrors, setRowErrors] = useState<Record<string, string[]>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const draftFor = (row: EditorRow) => drafts[row.key] ?? initialDrafts[row.key] ?? draftOf(undefined, defaultBasisOf(row));
  const savedFor = (row: EditorRow) => saved[row.key] ?? initialDrafts[row.key];
  const dirtyRows = rows.filter((r) => !sameDraft(draftFor(r), savedFor(r)));

  const update = (row: EditorRow, patch: Partial<LimitDraft>) => {
    setDrafts((d) => ({ ...d, [row.key]: { ...draftFor(row), ...patch } }));
    setSavedNote(null);
  };

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setSavedNote(null);
    const errors: Record<string, string[]> = {};
    const sentRows: EditorRow[] = [];
    const body: { limits: SpecLimitInput[] } = { limits: [] };
    for (const row of rows) {
      const d = draftFor(row);
      const min = parseFigure(d.min);
      const typ = parseFigure(d.typ);
      const max = parseFigure(d.max);
      const problems: string[] = [];
      if (min.error) problems.push(`Min: ${min.error}.`);
      if (typ.error) problems.push(`Typ: ${typ.error}.`);
      if (max.error) problems.push(`Max: ${max.error}.`);
      if (!hasValue(d)) {
        if (d.footnote.trim()) problems.push("A footnote needs a limit: give at least one of min, typ, max, or clear the footnote.");
      } else if (min.value !== undefined && max.value !== undefined && min.value > max.value) {
        problems.push("Min must not exceed max.");
      }
      if (problems.length > 0) {
        errors[row.key] = problems;
        continue;
      }
      if (!hasValue(d)) continue;
      sentRows.push(row);
      body.limits.push({
        parameter: row.parameter,
        conditionsKey: row.conditionsKey,
        ...(min.value !== undefined ? { min: min.value } : {}),
        ...(typ.value !== undefined ? { typ: typ.value } : {}),
        ...(max.value !== undefined ? { max: max.value } : {}),
        unit: row.unit,
        basis: d.basis,
        ...(d.footnote.trim() ? { footnote: d.footnote.trim() } : {}),
      });
    }
    setRowErrors(errors);
    if (Object.keys(errors).length > 0) {
      setFormError(`Correct ${Object.keys(errors).length === 1 ? "the marked line" : `the ${Object.keys(errors).length} marked lines`} before saving.`);
      return;
    }
    setSaving(true);
    try {
      const result = await requestJson<{ saved: number }>(`/api/devices/${deviceId}/spec-limits`, { method: "PUT", body });
      setSaved(drafts);
      setSavedNote(`Saved ${result.saved} ${result.saved === 1 ? "limit" : "limits"}. The statistics, flags and preview are rebuilt from them.`);
      onSaved();
    } catch (error) {
      if (error instanceof ApiError) {
        const byRow: Record<string, string[]> = {};
        for (const f of error.fields) {
          const match = /^limits\.(\d+)(?:\.(\w+))?/.exec(f.field);
          const row = match ? sentRows[Number(match[1])] : undefined;
          if (row) (byRow[row.key] ??= []).push(`${match?.[2] ? `${match[2]}: ` : ""}${f.message}`);
        }
        setRowErrors(byRow);
        setFormError(error.message);
      } else {
        setFormError("The limits could not be saved.");
      }
    } finally {
      setSaving(false);
    }
  };

  if (rows.length === 0) {
    return (
      <p className="border-y border-rule py-4 text-ink-muted" data-testid="spec-limits-editor">
        No parameter has data yet: limits are set per parameter and condition once approved measurement sets feed the sheet.
      </p>
    );
  }

  let lastRowId = "";
  return (
    <form onSubmit={onSubmit} noValidate data-testid="spec-limits-editor" aria-labelledby="limits-title">
      <h2 id="limits-title" className="text-xl font-semibold">
        Spec limits
      </h2>
      <p className="mt-1 max-w-prose text-ink-muted">
        One line per parameter under one set of conditions. Leave min, typ and max empty to publish the measured mean as typical. Flags are
        computed from the saved limits: Cpk below <span className="figure">{formatNumber(statistics.cpkThreshold, { digits: { maxDecimals: 2 } })}</span>, or a
        unit outside the guard-banded limit. Saving replaces the whole set.
      </p>

      <ol className="mt-6">
        {rows.map((row) => {
          const d = draftFor(row);
          const g = row.group;
          const heading = row.rowId !== lastRowId ? (row.group ? `${row.label} (${row.symbol})` : "Limits without data") : null;
          lastRowId = row.rowId;
          const dirty = !sameDraft(d, savedFor(row));
          const errors = rowErrors[row.key];
          const name = `${row.label}, ${row.conditionsText}`;
          return (
            <li key={row.key} className="list-none" data-testid="limit-row" data-key={row.key}>
              {heading ? <h3 className="running-head mt-6 border-b border-ink pb-1 text-ink">{heading}</h3> : null}
              <div
                className={`grid gap-x-6 gap-y-3 border-b border-rule py-3 lg:grid-cols-[minmax(11rem,1fr)_minmax(26rem,2.2fr)_minmax(15rem,1.4fr)] ${errors ? "bg-signal-wash/50" : ""}`}
              >
                <div>
                  <p className="font-semibold">{row.conditionsText ? <Notation text={row.conditionsText} /> : "No conditions"}</p>
                  <p className="text-sm text-ink-muted">
                    in <span className="unit">{row.unit}</span>
                    {dirty ? <span className="ml-2 font-semibold text-ink">· changed, not saved</span> : null}
                  </p>
                </div>
                <fieldset className="grid grid-cols-3 gap-2 sm:grid-cols-[repeat(3,minmax(5rem,1fr))_minmax(11rem,1.6fr)]">
                  <legend className="sr-only">Limits for {name}</legend>
                  {(["min", "typ", "max"] as const).map((which) => (
                    <label key={which} className="block text-sm">
                      <span className="font-semibold capitalize">{which}</span> <span className="unit">{row.unit}</span>
                      <input
                        type="text"
                        inputMode="decimal"
                        value={d[which]}
                        onChange={(e) => update(row, { [which]: e.target.value })}
                        aria-label={`${which} ${row.unit}, ${name}`}
                        aria-invalid={errors ? true : undefined}
                        className={`${selectClass} figure mt-0.5 px-2 py-1 text-right aria-[invalid=true]:border-signal`}
                        autoComplete="off"
                      />
                    </label>
                  ))}
                  <label className="col-span-3 block text-sm sm:col-span-1">
                    <span className="font-semibold">Basis</span>
                    <select
                      value={d.basis}
                      onChange={(e) => update(row, { basis: e.target.value as LimitBasis })}
                      aria-label={`Basis, ${name}`}
                      className={`${selectClass} mt-0.5 px-2 py-1 text-sm`}
                    >
                      {basisOptions.map((o) => (
                        <option key={o.value} value={o.value}>
                          {o.label}
                        </option>
                      ))}
                    </select>
                  </label>
                  <label className="col-span-3 block text-sm sm:col-span-4">
                    <span className="font-semibold">Footnote</span> <span className="text-ink-muted">(optional)</span>
                    <input
                      type="text"
                      value={d.footnote}
                      maxLength={500}
                      onChange={(e) => update(row, { footnote: e.target.value })}
                      aria-label={`Footnote, ${name}`}
                      className={`${selectClass} mt-0.5 px-2 py-1 text-sm`}
                    />
                  </label>
                  {errors ? (
                    <ul className="col-span-full text-sm text-signal-deep" role="alert">
                      {errors.map((e) => (
                        <li key={e}>{e}</li>
                      ))}
                    </ul>
                  ) : null}
                </fieldset>
                <div className="text-sm">
                  {g ? <GroupFigures group={g} cpkThreshold={statistics.cpkThreshold} /> : <p className="text-ink-muted">No approved data under these conditions.</p>}
                  {g ? (
                    <div className="mt-2">
                      <FlagList flags={g.flags} compact />
                      {dirty && g.flags.length > 0 ? <p className="mt-1 text-ink-muted">Flags are for the saved limits; save to re-check.</p> : null}
                    </div>
                  ) : null}
                </div>
              </div>
            </li>
          );
        })}
      </ol>

      <div className="sticky bottom-0 z-10 mt-4 flex flex-wrap items-center gap-4 border-t border-ink bg-paper py-3">
        <button type="submit" className={buttonClass.primary} disabled={saving}>
          {saving ? "Saving…" : "Save limits"}
        </button>
        <p className="text-sm text-ink-muted" aria-live="polite">
          {dirtyRows.length === 0 ? "No unsaved changes." : `${dirtyRows.length} ${dirtyRows.length === 1 ? "line" : "lines"} changed.`}
        </p>
        <div className="w-full">
          {formError ? <Notice tone="error">{formError}</Notice> : null}
          {savedNote ? <Notice tone="success">{savedNote}</Notice> : null}
        </div>
      </div>
    </form>
  );
}

function GroupFigures({ group: g, cpkThreshold }: { group: StatisticsGroup; cpkThreshold: number }) {
  const cpkLow = g.cpk.value !== null && g.cpk.value < cpkThreshold;
  const item = (label: string, text: string) => (
    <div className="flex justify-between gap-2">
      <dt className="text-ink-muted">{label}</dt>
      <dd className="figure">{text || "—"}</dd>
    </div>
  );
  return (
    <dl className="grid grid-cols-2 gap-x-5 gap-y-0.5" data-testid="limit-statistics">
      {item("n", String(g.n))}
      {item("mean", g.mean.text)}
      {item("s", g.standardDeviation.text)}
      {item("min", g.min.text)}
      {item("max", g.max.text)}
      {item("tol. low", g.toleranceInterval?.lower.text ?? "")}
      {item("tol. high", g.toleranceInterval?.upper.text ?? "")}
      <div className="flex justify-between gap-2">
        <dt className="text-ink-muted">Cpk</dt>
        <dd className={`figure ${cpkLow ? "font-semibold text-signal-deep" : ""}`}>{g.cpk.text || "—"}</dd>
      </div>
    </dl>
  );
}
