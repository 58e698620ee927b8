"use client";

import type { ProseSectionId } from "@/lib/sheet/types";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import type { RatingDraft, UncertaintyParameter } from "./prose-editor-state";
import type { WorkspaceTemplate } from "./workspace-types";

type FieldErrors = Record<string, string>;

/** One markdown field per prose section of the template, with whether the default prints. */
export function ProseSectionFields({
  sections,
  prose,
  fieldErrors,
  onChange,
}: {
  sections: WorkspaceTemplate["prose"];
  prose: Partial<Record<ProseSectionId, string>>;
  fieldErrors: FieldErrors;
  onChange: (id: ProseSectionId, text: string) => void;
}) {
  return (
    <div className="mt-6 space-y-8">
      {sections.map((section) => {
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
                onChange={(e) => onChange(section.id, e.target.value)}
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
                    onClick={() => onChange(section.id, section.markdown)}
                  >
                    Start from the default text
                  </button>
                </>
              ) : (
                <>
                  <p>Your text replaces the default.</p>
                  <button type="button" className={`${buttonClass.quiet} mt-1 text-sm`} onClick={() => onChange(section.id, "")}>
                    Clear, use the default
                  </button>
                </>
              )}
            </div>
          </div>
        );
      })}
    </div>
  );
}

/** The absolute maximum ratings as an editable table: label, value, unit. */
export function RatingsEditor({ ratings, fieldErrors, onChange }: { ratings: RatingDraft[]; fieldErrors: FieldErrors; onChange: (ratings: RatingDraft[]) => void }) {
  return (
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
            const set = (patch: Partial<RatingDraft>) => onChange(ratings.map((x) => (x.id === r.id ? { ...x, ...patch } : x)));
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
                    onClick={() => onChange(ratings.filter((x) => x.id !== r.id))}
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
        onClick={() => onChange([...ratings, { id: Math.max(999, ...ratings.map((x) => x.id)) + 1, label: "", value: "", unit: "" }])}
      >
        Add a rating
      </button>
    </fieldset>
  );
}

/** The stated expanded uncertainty U (k = 2) per parameter with data. */
export function UncertaintyFields({
  parameters,
  values,
  fieldErrors,
  onChange,
}: {
  parameters: UncertaintyParameter[];
  values: Record<string, string>;
  fieldErrors: FieldErrors;
  onChange: (parameter: string, text: string) => void;
}) {
  return (
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
                  value={values[p.parameter] ?? ""}
                  onChange={(e) => onChange(p.parameter, e.target.value)}
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
  );
}
