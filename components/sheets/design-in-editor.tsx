"use client";

import { useState, type FormEvent } from "react";
import { ApiError, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { DesignInRows, type DraftRow, type RowColumn } from "./design-in-rows";
import type { WorkspaceDesignIn } from "./workspace-types";

type PinKey = "pin" | "name" | "function";
type OrderKey = "partNumber" | "options" | "packing";
type ConditionKey = "parameter" | "min" | "typ" | "max" | "unit";

const pinColumns: RowColumn<PinKey>[] = [
  { key: "pin", header: "Pin", maxLength: 16, figure: true, width: "w-24" },
  { key: "name", header: "Name", maxLength: 40, width: "w-40" },
  { key: "function", header: "Function", maxLength: 200 },
];
const orderColumns: RowColumn<OrderKey>[] = [
  { key: "partNumber", header: "Part number", maxLength: 64, figure: true },
  { key: "options", header: "Options", maxLength: 200 },
  { key: "packing", header: "Packing", maxLength: 120 },
];
const conditionColumns: RowColumn<ConditionKey>[] = [
  { key: "parameter", header: "Parameter", maxLength: 120 },
  { key: "min", header: "Min", maxLength: 24, figure: true, width: "w-24" },
  { key: "typ", header: "Typ", maxLength: 24, figure: true, width: "w-24" },
  { key: "max", header: "Max", maxLength: 24, figure: true, width: "w-24" },
  { key: "unit", header: "Unit", maxLength: 16, width: "w-24" },
];

const withIds = <T extends object>(rows: T[]) => rows.map((r, i) => ({ id: i, ...r }));
const filled = <K extends string>(rows: DraftRow<K>[]) => rows.filter((r) => Object.entries(r).some(([k, v]) => k !== "id" && String(v).trim()));
const strip = <K extends string>(rows: DraftRow<K>[]) => rows.map(({ id: _id, ...rest }) => rest);

/**
 * What a designer needs beside the specifications: recommended operating conditions, the package
 * outline (an SVG or PNG drawing, uploaded apart), pin functions and ordering information. The
 * class's usual pins and conditions are offered until the engineer states their own.
 */
export function DesignInEditor({ deviceId, designIn, onSaved }: { deviceId: number; designIn: WorkspaceDesignIn; onSaved: () => void }) {
  const [pins, setPins] = useState<DraftRow<PinKey>[]>(() => withIds(designIn.pinFunctions.length ? designIn.pinFunctions : designIn.templatePins));
  const [ordering, setOrdering] = useState<DraftRow<OrderKey>[]>(() => withIds(designIn.ordering));
  const [conditions, setConditions] = useState<DraftRow<ConditionKey>[]>(() =>
    withIds(designIn.recommendedOperatingConditions.length ? designIn.recommendedOperatingConditions : designIn.templateConditions.map((c) => ({ parameter: c.parameter, min: "", typ: "", max: "", unit: c.unit }))),
  );
  const [caption, setCaption] = useState(designIn.packageOutlineCaption);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const edited = <T,>(set: (v: T) => void) => (v: T) => {
    set(v);
    setSavedNote(null);
  };

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setSavedNote(null);
    // A pin row with a name but no function, or the class's suggestion left unfilled, is left out; so is an operating condition without figures.
    const sentPins = filled(pins).filter((p) => p.name.trim() && p.function.trim());
    const sentOrdering = filled(ordering);
    const sentConditions = filled(conditions).filter((c) => c.min.trim() || c.typ.trim() || c.max.trim());
    setSaving(true);
    try {
      await requestJson<{ ok: true }>(`/api/devices/${deviceId}/design-data`, {
        method: "PUT",
        body: { pinFunctions: strip(sentPins), ordering: strip(sentOrdering), recommendedOperatingConditions: strip(sentConditions), packageOutlineCaption: caption },
      });
      setFieldErrors({});
      const skipped = filled(conditions).length - sentConditions.length;
      setSavedNote(`Saved.${skipped > 0 ? ` ${skipped} operating ${skipped === 1 ? "condition" : "conditions"} without a figure ${skipped === 1 ? "is" : "are"} not printed.` : ""} The preview is rebuilt.`);
      onSaved();
    } catch (error) {
      if (error instanceof ApiError) {
        const byField: Record<string, string> = {};
        const lists = { pinFunctions: ["pins", sentPins], ordering: ["ordering", sentOrdering], recommendedOperatingConditions: ["conditions", sentConditions] } as const;
        for (const f of error.fields) {
          const m = /^(pinFunctions|ordering|recommendedOperatingConditions)\.(\d+)\.?(.*)$/.exec(f.field);
          if (!m) continue;
          const [key, rows] = lists[m[1] as keyof typeof lists];
          const row = rows[Number(m[2])];
          if (row) byField[`${key}-${row.id}`] = m[3] ? `${m[3]}: ${f.message}` : f.message;
        }
        setFieldErrors(byField);
        setFormError(error.message);
      } else {
        setFormError("The design-in data could not be saved.");
      }
    } finally {
      setSaving(false);
    }
  };

  return (
    <div data-testid="design-in-editor">
      <h2 id="design-in-title" className="text-xl font-semibold">
        Design-in
      </h2>
      <p className="mt-1 max-w-prose text-ink-muted">
        What a designer needs beside the specifications. Each list prints on the sheet once it has a row; figures print with the digits you type.
      </p>
      <PackageOutlineUpload deviceId={deviceId} current={designIn.packageOutline} onSaved={onSaved} />
      <form onSubmit={onSubmit} noValidate aria-labelledby="design-in-title">
        <div className="mt-4 max-w-2xl">
          <label htmlFor="outline-caption" className="block font-semibold">
            Caption of the outline
          </label>
          <input id="outline-caption" type="text" value={caption} maxLength={200} onChange={(e) => edited(setCaption)(e.target.value)} className={`${selectClass} mt-1`} />
        </div>
        <DesignInRows
          legend="Recommended operating conditions"
          hint="The conditions the part is meant to be used under, inside the absolute maximum ratings. A row without min, typ or max is not printed."
          rowNoun="Condition"
          columns={conditionColumns}
          rows={conditions}
          fieldErrors={fieldErrors}
          errorKey="conditions"
          onChange={edited(setConditions)}
        />
        <DesignInRows legend="Pin functions" hint="One row per pin: its number, its name and what it is for." rowNoun="Pin" columns={pinColumns} rows={pins} fieldErrors={fieldErrors} errorKey="pins" onChange={edited(setPins)} />
        <DesignInRows
          legend="Ordering information"
          hint="The part numbers a customer orders: options (screening, temperature grade) and packing (tape and reel, tray)."
          rowNoun="Part number"
          columns={orderColumns}
          rows={ordering}
          fieldErrors={fieldErrors}
          errorKey="ordering"
          onChange={edited(setOrdering)}
        />
        <div className="sticky bottom-0 z-10 mt-6 flex flex-wrap items-center gap-4 border-t border-ink bg-paper py-3">
          <button type="submit" className={buttonClass.primary} disabled={saving} data-testid="save-design-in">
            {saving ? "Saving…" : "Save design-in data"}
          </button>
          <div className="w-full">
            {formError ? <Notice tone="error">{formError}</Notice> : null}
            {savedNote ? <Notice tone="success">{savedNote}</Notice> : null}
          </div>
        </div>
      </form>
    </div>
  );
}

/** Uploads the package outline drawing (SVG or PNG, at most 1 MiB) or takes it off the sheet; the server checks and stores it at once. */
function PackageOutlineUpload({ deviceId, current, onSaved }: { deviceId: number; current: WorkspaceDesignIn["packageOutline"]; onSaved: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(null);

  const send = async (method: "POST" | "DELETE") => {
    setError(null);
    setNote(null);
    if (method === "POST" && !file) {
      setError("Choose an SVG or PNG file first.");
      return;
    }
    setBusy(true);
    try {
      let response: Response;
      if (method === "POST") {
        const body = new FormData();
        body.set("file", file!);
        response = await fetch(`/api/devices/${deviceId}/package-outline`, { method, body, credentials: "same-origin" });
      } else {
        response = await fetch(`/api/devices/${deviceId}/package-outline`, { method, credentials: "same-origin" });
      }
      const json = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
      if (!response.ok) {
        setError(json?.error?.message ?? `The server answered ${response.status}.`);
        return;
      }
      setNote(method === "POST" ? "The drawing is on the sheet. The preview is rebuilt." : "The drawing is off the sheet.");
      setFile(null);
      onSaved();
    } catch {
      setError("Benchfold could not be reached. Check your connection and try again.");
    } finally {
      setBusy(false);
    }
  };

  return (
    <fieldset className="mt-6 max-w-2xl" data-testid="package-outline-upload">
      <legend className="text-lg font-semibold">Package outline</legend>
      <p className="text-sm text-ink-muted">
        {current ? `A drawing of ${current.widthPx} × ${current.heightPx} pixels is on the sheet.` : "No drawing yet."} An SVG is drawn to a PNG on the server
        (scripts, embedded images and links to other files are refused); a PNG is taken as it is, up to 512 KiB and 4000 pixels a side.
      </p>
      <div className="mt-2 flex flex-wrap items-center gap-3">
        <label htmlFor="outline-file" className="sr-only">
          Drawing file (SVG or PNG)
        </label>
        <input id="outline-file" type="file" accept=".svg,.png,image/svg+xml,image/png" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="text-sm" />
        <button type="button" className={`${buttonClass.secondary} px-3 py-1 text-sm`} disabled={busy} onClick={() => send("POST")} data-testid="upload-outline">
          {busy ? "Sending…" : "Upload drawing"}
        </button>
        {current ? (
          <button type="button" className={`${buttonClass.quiet} text-sm`} disabled={busy} onClick={() => send("DELETE")}>
            Remove drawing
          </button>
        ) : null}
      </div>
      <div aria-live="polite">
        {error ? <Notice tone="error">{error}</Notice> : null}
        {note ? <Notice tone="success">{note}</Notice> : null}
      </div>
    </fieldset>
  );
}
