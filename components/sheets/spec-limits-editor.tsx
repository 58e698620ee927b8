"use client";

import { useMemo, useState, type FormEvent } from "react";
import type { SpecLimitInput } from "@/lib/sheet/types";
import { ApiError, requestJson } from "@/components/api-client";
import { formatNumber } from "@/lib/format";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { SpecLimitRow } from "./spec-limit-row";
import {
  buildEditorRows,
  checkLimitDrafts,
  defaultBasisLookup,
  draftOf,
  initialLimitDrafts,
  rowErrorsFromFields,
  rowHeadings,
  sameDraft,
  type EditorRow,
  type LimitDraft,
} from "./spec-limits-state";
import type { WorkspaceModel } from "./workspace-types";

type SpecLimitsEditorProps = { deviceId: number; model: WorkspaceModel; limits: SpecLimitInput[]; onSaved: () => void };

/** One line per statistics group: the limits an engineer states, beside the statistics and flags that judge them. */
export function SpecLimitsEditor({ deviceId, model, limits, onSaved }: SpecLimitsEditorProps) {
  const { statistics, specifications } = model;
  const rows = useMemo(() => buildEditorRows(statistics.groups, limits), [statistics.groups, limits]);

  const defaultBasisOf = useMemo(() => defaultBasisLookup(specifications.rows), [specifications.rows]);
  const initialDrafts = useMemo(() => initialLimitDrafts(rows, limits, specifications.rows), [rows, limits, specifications.rows]);

  const [drafts, setDrafts] = useState<Record<string, LimitDraft>>(initialDrafts);
  const [saved, setSaved] = useState<Record<string, LimitDraft>>(initialDrafts);
  const [rowErrors, setRowErrors] = useState<Record<string, string[]>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const draftFor = (row: EditorRow) => drafts[row.key] ?? initialDrafts[row.key] ?? draftOf(undefined, defaultBasisOf(row));
  const savedFor = (row: EditorRow) => saved[row.key] ?? initialDrafts[row.key];
  const headings = rowHeadings(rows);
  const dirtyRows = rows.filter((r) => !sameDraft(draftFor(r), savedFor(r)));

  const update = (row: EditorRow, patch: Partial<LimitDraft>) => {
    setDrafts((d) => ({ ...d, [row.key]: { ...draftFor(row), ...patch } }));
    setSavedNote(null);
  };

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setSavedNote(null);
    const { errors, limits: sent, sentRows } = checkLimitDrafts(rows, draftFor);
    setRowErrors(errors);
    if (Object.keys(errors).length > 0) {
      setFormError(`Correct ${Object.keys(errors).length === 1 ? "the marked line" : `the ${Object.keys(errors).length} marked lines`} before saving.`);
      return;
    }
    setSaving(true);
    try {
      const result = await requestJson<{ saved: number }>(`/api/devices/${deviceId}/spec-limits`, { method: "PUT", body: { limits: sent } });
      setSaved(drafts);
      setSavedNote(`Saved ${result.saved} ${result.saved === 1 ? "limit" : "limits"}. The statistics, flags and preview are rebuilt from them.`);
      onSaved();
    } catch (error) {
      if (error instanceof ApiError) {
        setRowErrors(rowErrorsFromFields(error.fields, sentRows));
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

  return (
    <form onSubmit={onSubmit} noValidate data-testid="spec-limits-editor" aria-labelledby="limits-title">
      <h2 id="limits-title" className="text-xl font-semibold">
        Spec limits
      </h2>
      <LimitsIntro cpkThreshold={statistics.cpkThreshold} />

      <ol className="mt-6">
        {rows.map((row, i) => (
          <SpecLimitRow
            key={row.key}
            row={row}
            heading={headings[i]}
            draft={draftFor(row)}
            dirty={!sameDraft(draftFor(row), savedFor(row))}
            errors={rowErrors[row.key]}
            cpkThreshold={statistics.cpkThreshold}
            onChange={(patch) => update(row, patch)}
          />
        ))}
      </ol>

      <LimitsSaveBar saving={saving} dirtyCount={dirtyRows.length} formError={formError} savedNote={savedNote} />
    </form>
  );
}

function LimitsIntro({ cpkThreshold }: { cpkThreshold: number }) {
  return (
    <p className="mt-1 max-w-prose text-ink-muted">
      One line per parameter under one set of conditions. Leave min, typ and max empty to publish the measured mean as typical. Flags are
      computed from the saved limits: Cpk below <span className="figure">{formatNumber(cpkThreshold, { digits: { maxDecimals: 2 } })}</span>, or a
      unit outside the guard-banded limit. Saving replaces the whole set.
    </p>
  );
}

function LimitsSaveBar({ saving, dirtyCount, formError, savedNote }: { saving: boolean; dirtyCount: number; formError: string | null; savedNote: string | null }) {
  return (
    <div className="sticky bottom-0 z-10 mt-4 flex flex-wrap items-center gap-4 border-t border-ink bg-paper py-3">
      <button type="submit" className={buttonClass.primary} disabled={saving}>
        {saving ? "Saving…" : "Save limits"}
      </button>
      <p className="text-sm text-ink-muted" aria-live="polite">
        {dirtyCount === 0 ? "No unsaved changes." : `${dirtyCount} ${dirtyCount === 1 ? "line" : "lines"} changed.`}
      </p>
      <div className="w-full">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
        {savedNote ? <Notice tone="success">{savedNote}</Notice> : null}
      </div>
    </div>
  );
}
