"use client";

import { useMemo, useState, type FormEvent } from "react";
import type { ProseSectionId } from "@/lib/sheet/types";
import { ApiError, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { figureInputText } from "./parse-figure";
import { ProseSectionFields, RatingsEditor, UncertaintyFields } from "./prose-editor-fields";
import { collectContent, initialRatings, uncertaintyParameters, type RatingDraft } from "./prose-editor-state";
import type { WorkspaceContent, WorkspaceModel, WorkspaceTemplate } from "./workspace-types";

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
  const [ratings, setRatings] = useState<RatingDraft[]>(() => initialRatings(content, template));

  const parameters = useMemo(() => uncertaintyParameters(model.statistics.groups, content.measurementUncertainty), [model.statistics.groups, content.measurementUncertainty]);
  const [uncertainty, setUncertainty] = useState<Record<string, string>>(() =>
    Object.fromEntries(Object.entries(content.measurementUncertainty).map(([k, v]) => [k, figureInputText(v)])),
  );

  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const edited = (change: () => void) => {
    change();
    setSavedNote(null);
  };

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setSavedNote(null);
    const { body, errors, sentRatings } = collectContent({ prose, ratings, uncertainty });
    setFieldErrors(errors);
    if (Object.keys(errors).length > 0) {
      setFormError("Correct the marked fields before saving.");
      return;
    }
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

      <ProseSectionFields
        sections={template.prose}
        prose={prose}
        fieldErrors={fieldErrors}
        onChange={(id, text) => edited(() => setProse((p) => ({ ...p, [id]: text })))}
      />
      <RatingsEditor ratings={ratings} fieldErrors={fieldErrors} onChange={(next) => edited(() => setRatings(next))} />
      <UncertaintyFields
        parameters={parameters}
        values={uncertainty}
        fieldErrors={fieldErrors}
        onChange={(parameter, text) => edited(() => setUncertainty((u) => ({ ...u, [parameter]: text })))}
      />

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
