"use client";

import { useMemo, useState, type FormEvent } from "react";
import type { ProseSectionId } from "@/lib/sheet/types";
import { ApiError, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { figureInputText, parseFigure } from "./parse-figure";
import type { WorkspaceContent, WorkspaceModel, WorkspaceTemplate } from "./workspace-types";

type RatingDraft = { id: number; label: string; value: string; unit: string };

type ProseEditorProps = {
  deviceId: number;
  model: WorkspaceModel;
  content: WorkspaceContent;
  template: WorkspaceTemplate;
  onSaved: () => void;
};

/**
 * The sheet's words: markdown per prose section (the server renders and sanitizes it; this page never
 * turns it into HTML), the absolute maximum ratings, and the stated expanded uncertainty per parameter.
 */
export function ProseEditor({ deviceId, model, content, template, onSaved }: ProseEditorProps) {
  const [prose, setProse] = useState<Partial<Record<ProseSectionId, string>>>(() => ({ ...content.prose }));
  const [ratings, setRatings] = useState<RatingDraft[]>(() => {
    const stated = content.absoluteMaximumRatings.map((r, i) => ({ id: i, ...r }));
    const statedLabels = new Set(stated.map((r) => r.label));
    // The class's required ratings not yet stated: their labels prefilled, values to be entered.
    const missing = template.absoluteMaximumRatings
      .filter((r) => !statedLabels.has(r.label))
      .map((r, i) => ({ id: stated.length + i, label: r.label, value: "", unit: r.unit }));
    return [...stated, ...missing];
  });
  const [nextId, setNextId] = useState(1000);

  const parameters = useMemo(() => {
    const seen = new Map<string, { parameter: string; label: string; unit: string }>();
    const rowsOf = new Map<string, Map<string, { label: string; symbol: string }>>();
    for (const g of model.statistics.groups) {
      if (!rowsOf.has(g.parameter)) rowsOf.set(g.parameter, new Map());
      rowsOf.get(g.parameter)!.set(g.rowId, { label: g.label, symbol: g.symbol });
      if (!seen.has(g.parameter)) seen.set(g.parameter, { parameter: g.parameter, label: g.label, unit: g.unit });
    }
    // One U per parameter: a parameter behind several table rows (e.g. HS1, HS3, HS4) is named for all of them.
    for (const [parameter, rows] of rowsOf) {
      if (rows.size < 2) continue;
      const name = parameter.replace(/-/g, " ");
      seen.get(parameter)!.label = `${name[0].toUpperCase()}${name.slice(1)} (${[...rows.values()].map((r) => r.symbol).join(", ")})`;
    }
    for (const p of Object.keys(content.measurementUncertainty)) if (!seen.has(p)) seen.set(p, { parameter: p, label: p, unit: "" });
    return [...seen.values()];
  }, [model.statistics.groups, content.measurementUncertainty]);
  const [uncertainty, setUncertainty] = useState<Record<string, string>>(() =>
    Object.fromEntries(Object.entries(content.measurementUncertainty).map(([k, v]) => [k, figureInputText(v)])),
  );

  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setSavedNote(null);
    const errors: Record<string, string> = {};
    const sentRatings: RatingDraft[] = [];
    for (const r of ratings) {
      const label = r.label.trim();
      const value = r.value.trim();
      if (!label && !value) continue;
      if (!label) errors[`rating-${r.id}`] = "Give the rating a label.";
      else if (value) sentRatings.push(r);
    }
    const measurementUncertainty: Record<string, number> = {};
    for (const [parameter, text] of Object.entries(uncertainty)) {
      const parsed = parseFigure(text);
      if (parsed.error) errors[`u-${parameter}`] = `U is ${parsed.error}.`;
      else if (parsed.value !== undefined) {
        if (parsed.value <= 0) errors[`u-${parameter}`] = "U must be greater than zero.";
        else measurementUncertainty[parameter] = parsed.value;
      }
    }
    setFieldErrors(errors);
    if (Object.keys(errors).length > 0) {
      setFormError("Correct the marked fields before saving.");
      return;
    }
    const body = {
      prose: Object.fromEntries(Object.entries(prose).filter(([, text]) => text !== undefined && text.trim() !== "")),
      absoluteMaximumRatings: sentRatings.map((r) => ({ label: r.label.trim(), value: r.value.trim(), unit: r.unit.trim() })),
      measurementUncertainty,
    };
    setSaving(true);
    try {
      await requestJson<{ ok: true }>(`/api/devices/${deviceId}/sheet-content`, { method: "PUT", body });
      const skipped = ratings.filter((r) => r.label.trim() && !r.value.trim()).length;
      setSavedNote(
        `Saved.${skipped > 0 ? ` ${skipped} ${skipped === 1 ? "rating without a value stays" : "ratings without a value stay"} “to be stated” on the sheet.` : ""} The preview is rebuilt.`,
      );
      onSaved();
    } catch (error) {
      if (error instanceof ApiError) {
        const byField: Record<string, string> = {};
        for (const f of error.fields) {
          const rating = /^absoluteMaximumRatings\.(\d+)/.exec(f.field);
          const u = /^measurementUncertainty\.(.+)$/.exec(f.field);
          const section = /^prose\.(.+)$/.exec(f.field);
          if (rating && sentRatings[Number(rating[1])]) byField[`rating-${sentRatings[Number(rating[1])].id}`] = f.message;
          else if (u) byField[`u-${u[1]}`] = f.message;
          else if (section) byField[`prose-${section[1]}`] = f.message;
        }
        setFieldErrors(byField);
        setFormError(error.message);
      } else {
        setFormError("The sheet text could not be saved.");
      }
    } finally {
      setSaving(false);
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate data-testid="prose-editor" aria-labelledby="prose-title">
      <h2 id="prose-title" className="text-xl font-semibold">
        Prose and ratings
      </h2>
      <p className="mt-1 max-w-prose text-ink-muted">
        Sections are written in Markdown: paragraphs, lists, <code>**bold**</code>, <code>*italic*</code>, <code>`code`</code> and links. Raw HTML is
        removed when the sheet is built. An empty section prints the template’s default text.
      </p>

      <div className="mt-6 space-y-8">
        {template.prose.map((section) => {
          const value = prose[section.id] ?? "";
          const usingDefault = value.trim() === "";
          const id = `prose-${section.id}`;
          return (
            <div key={section.id} className="grid gap-x-6 gap-y-2 lg:grid-cols-[minmax(0,2fr)_minmax(14rem,1fr)]">
              <div>
                <label htmlFor={id} className="block font-semibold">
                  {section.title}
                </label>
                <textarea
                  id={id}
                  name={id}
                  value={value}
                  onChange={(e) => {
                    setProse((p) => ({ ...p, [section.id]: e.target.value }));
                    setSavedNote(null);
                  }}
                  placeholder={section.markdown}
                  rows={Math.min(14, Math.max(4, value.split("\n").length + 1, section.markdown.split("\n").length + 1))}
                  maxLength={20_000}
                  aria-describedby={`${id}-note`}
                  aria-invalid={fieldErrors[id] ? true : undefined}
                  className={`${selectClass} mt-1 font-mono text-[0.875rem] leading-relaxed placeholder:text-ink-muted/70 aria-[invalid=true]:border-signal`}
                  data-testid={`prose-${section.id}`}
                />
                {fieldErrors[id] ? <p className="text-sm text-signal-deep">{fieldErrors[id]}</p> : null}
              </div>
              <div id={`${id}-note`} className="text-sm text-ink-muted lg:pt-7">
                {usingDefault ? (
                  <>
                    <p>
                      <span className="font-semibold text-ink">Using the default.</span> The sheet prints{" "}
                      {section.defaultSource === "device" ? "the device’s description" : "the template’s text"}, shown greyed in the field.
                    </p>
                    <button
                      type="button"
                      className={`${buttonClass.quiet} mt-1 text-sm`}
                      onClick={() => setProse((p) => ({ ...p, [section.id]: section.markdown }))}
                    >
                      Start from the default text
                    </button>
                  </>
                ) : (
                  <>
                    <p>Your text replaces the default.</p>
                    <button type="button" className={`${buttonClass.quiet} mt-1 text-sm`} onClick={() => setProse((p) => ({ ...p, [section.id]: "" }))}>
                      Clear, use the default
                    </button>
                  </>
                )}
              </div>
            </div>
          );
        })}
      </div>

      <fieldset className="mt-10" data-testid="ratings-editor">
        <legend className="text-lg font-semibold">Absolute maximum ratings</legend>
        <p className="max-w-prose text-sm text-ink-muted">
          Stresses beyond these may damage the device. A rating without a value is printed as “to be stated” and listed as an issue for the reviewer.
        </p>
        <table className="sheet-table mt-3 max-w-4xl">
          <thead>
            <tr>
              <th scope="col">Rating</th>
              <th scope="col">Value</th>
              <th scope="col">Unit</th>
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {ratings.map((r, i) => {
              const err = fieldErrors[`rating-${r.id}`];
              const set = (patch: Partial<RatingDraft>) => {
                setRatings((rs) => rs.map((x) => (x.id === r.id ? { ...x, ...patch } : x)));
                setSavedNote(null);
              };
              return (
                <tr key={r.id}>
                  <td className="w-[55%]">
                    <input
                      type="text"
                      value={r.label}
                      maxLength={120}
                      onChange={(e) => set({ label: e.target.value })}
                      aria-label={`Rating ${i + 1}, label`}
                      aria-invalid={err ? true : undefined}
                      className={`${selectClass} px-2 py-1 text-sm aria-[invalid=true]:border-signal`}
                    />
                    {err ? <p className="text-sm text-signal-deep">{err}</p> : null}
                  </td>
                  <td>
                    <input
                      type="text"
                      value={r.value}
                      maxLength={40}
                      placeholder="to be stated"
                      onChange={(e) => set({ value: e.target.value })}
                      aria-label={`Value of ${r.label || `rating ${i + 1}`}`}
                      className={`${selectClass} figure px-2 py-1 text-sm`}
                    />
                  </td>
                  <td className="w-24">
                    <input
                      type="text"
                      value={r.unit}
                      maxLength={16}
                      onChange={(e) => set({ unit: e.target.value })}
                      aria-label={`Unit of ${r.label || `rating ${i + 1}`}`}
                      className={`${selectClass} px-2 py-1 text-sm`}
                    />
                  </td>
                  <td className="w-20 text-right">
                    <button
                      type="button"
                      className={`${buttonClass.quiet} text-sm`}
                      onClick={() => setRatings((rs) => rs.filter((x) => x.id !== r.id))}
                      aria-label={`Remove ${r.label || `rating ${i + 1}`}`}
                    >
                      Remove
                    </button>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <button
          type="button"
          className={`${buttonClass.secondary} mt-3 px-3 py-1 text-sm`}
          onClick={() => {
            setRatings((rs) => [...rs, { id: nextId, label: "", value: "", unit: "" }]);
            setNextId((n) => n + 1);
          }}
        >
          Add a rating
        </button>
      </fieldset>

      <fieldset className="mt-10" data-testid="uncertainty-editor">
        <legend className="text-lg font-semibold">Stated measurement uncertainty</legend>
        <p className="max-w-prose text-sm text-ink-muted">
          Expanded uncertainty U (k = 2) of each parameter, in its own unit. It sets the guard bands: with U stated, a limit is moved inward by U
          before a unit is judged. Leave empty where none is stated.
        </p>
        {parameters.length === 0 ? (
          <p className="mt-2 text-sm text-ink-muted">No parameter has data yet.</p>
        ) : (
          <div className="mt-3 grid max-w-4xl gap-x-6 gap-y-3 sm:grid-cols-2">
            {parameters.map((p) => {
              const id = `u-${p.parameter}`;
              return (
                <div key={p.parameter}>
                  <label htmlFor={id} className="block text-sm font-semibold">
                    {p.label} <span className="font-normal text-ink-muted">U (k = 2){p.unit ? `, ${p.unit}` : ""}</span>
                  </label>
                  <input
                    id={id}
                    type="text"
                    inputMode="decimal"
                    value={uncertainty[p.parameter] ?? ""}
                    onChange={(e) => {
                      setUncertainty((u) => ({ ...u, [p.parameter]: e.target.value }));
                      setSavedNote(null);
                    }}
                    aria-invalid={fieldErrors[id] ? true : undefined}
                    className={`${selectClass} figure mt-0.5 max-w-[10rem] px-2 py-1 text-right text-sm aria-[invalid=true]:border-signal`}
                    autoComplete="off"
                  />
                  {fieldErrors[id] ? <p className="text-sm text-signal-deep">{fieldErrors[id]}</p> : null}
                </div>
              );
            })}
          </div>
        )}
      </fieldset>

      <div className="sticky bottom-0 z-10 mt-6 flex flex-wrap items-center gap-4 border-t border-ink bg-paper py-3">
        <button type="submit" className={buttonClass.primary} disabled={saving} data-testid="save-prose">
          {saving ? "Saving…" : "Save text and ratings"}
        </button>
        <div className="w-full">
          {formError ? <Notice tone="error">{formError}</Notice> : null}
          {savedNote ? <Notice tone="success">{savedNote}</Notice> : null}
        </div>
      </div>
    </form>
  );
}
