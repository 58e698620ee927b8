"use client";

import { useId, useMemo, useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { kindLabel } from "@/lib/domain/measurements";
import { findMappingProblems, guessTarget, likeliestKind, metadataFor, type Choice, type MappingMetadata } from "./column-mapping-choices";
import { MappingTable, MissingMetadataFields } from "./column-mapping-fields";
import { unitOf, type UploadConditions } from "./upload-form-data";
import type { MappingDetail } from "./upload-request";

type ColumnMappingPanelProps = {
  fileName: string;
  detail: MappingDetail;
  conditions: UploadConditions;
  onCancel: () => void;
  onSaved: () => void;
};

/** Maps a foreign CSV's columns to the quantities of a measurement kind, saves the mapping, and retries the upload. */
export function ColumnMappingPanel({ fileName, detail, conditions, onCancel, onSaved }: ColumnMappingPanelProps) {
  const id = useId();
  const kinds = Object.keys(detail.targets);
  const [kind, setKind] = useState<string>(() => (conditions.kind && kinds.includes(conditions.kind) ? conditions.kind : likeliestKind(detail)));
  const targets = useMemo(() => detail.targets[kind] ?? [], [detail, kind]);
  const [choices, setChoices] = useState<Choice[]>(() => detail.headers.map((h) => guessTarget(h, detail.targets[kind] ?? [])));
  const [name, setName] = useState(() => `${fileName.replace(/\.[^.]+$/, "")} columns`);
  const [metadata, setMetadata] = useState<MappingMetadata>({
    frequency: conditions.values.inputFrequencyHz ?? "",
    frequencyUnit: unitOf(conditions, "inputFrequencyHz"),
    wantedOrder: "2",
  });
  const [problems, setProblems] = useState<string[]>([]);
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  function changeKind(next: string) {
    setKind(next);
    setChoices(detail.headers.map((h) => guessTarget(h, detail.targets[next] ?? [])));
    setProblems([]);
  }

  function choose(index: number, change: Partial<Choice>) {
    setChoices((all) =>
      all.map((c, i) => {
        if (i !== index) return c;
        const next = { ...c, ...change };
        if (change.target !== undefined) next.unit = targets.find((t) => t.target === change.target)?.units[0] ?? "";
        return next;
      }),
    );
  }

  async function save(event: React.FormEvent) {
    event.preventDefault();
    setError(null);
    const found = findMappingProblems({ choices, targets, name, kind, metadata });
    setProblems(found);
    if (found.length) return;
    setPending(true);
    try {
      await requestJson("/api/column-mappings", {
        method: "POST",
        body: {
          name: name.trim(),
          kind,
          headers: detail.headers,
          mapping: detail.headers.flatMap((column, i) => (choices[i]?.target ? [{ column, target: choices[i].target, unit: choices[i].unit }] : [])),
          metadata: metadataFor(kind, metadata),
        },
      });
      onSaved();
    } catch (e) {
      setError(messageOf(e));
      setPending(false);
    }
  }

  return (
    <form onSubmit={save} noValidate className="space-y-5 border border-rule-strong bg-paper-bright p-4 sm:p-5" data-testid="mapping-panel" aria-labelledby={`${id}-title`}>
      <div>
        <h3 id={`${id}-title`} className="text-lg font-semibold">
          Map the columns of <span className="figure">{fileName}</span>
        </h3>
        <p className="mt-1 text-[0.9375rem] text-ink-muted">
          Say what each column holds and in which unit. The mapping is saved for your organization: the next file with these same headers is read with it
          automatically, and every mapped file meets the same checks as a file in our own format.
        </p>
      </div>

      <div className="grid gap-4 sm:grid-cols-2">
        <div className="space-y-1.5">
          <label htmlFor={`${id}-kind`} className="block text-[0.9375rem] font-semibold">
            Kind of measurement
          </label>
          <select id={`${id}-kind`} value={kind} onChange={(e) => changeKind(e.target.value)} className={selectClass}>
            {kinds.map((k) => (
              <option key={k} value={k}>
                {kindLabel(k)}
              </option>
            ))}
          </select>
        </div>
        <div className="space-y-1.5">
          <label htmlFor={`${id}-name`} className="block text-[0.9375rem] font-semibold">
            Name of the mapping
          </label>
          <input id={`${id}-name`} value={name} onChange={(e) => setName(e.target.value)} className={selectClass} />
        </div>
      </div>

      <MappingTable detail={detail} targets={targets} choices={choices} onChoose={choose} />

      {kind === "drive-sweep" || kind === "phase-noise" ? (
        <MissingMetadataFields kind={kind} metadata={metadata} onChange={setMetadata} />
      ) : null}

      <div aria-live="polite" className="space-y-2 empty:hidden">
        {problems.length ? (
          <Notice tone="error">
            <ul className="inline">
              {problems.map((p) => (
                <li key={p}>{p}</li>
              ))}
            </ul>
          </Notice>
        ) : null}
        {error ? <Notice tone="error">{error}</Notice> : null}
      </div>

      <div className="flex flex-wrap items-center gap-4">
        <button type="submit" disabled={pending} className={buttonClass.primary}>
          {pending ? "Saving…" : "Save mapping and upload again"}
        </button>
        <button type="button" onClick={onCancel} className={buttonClass.quiet}>
          Not now
        </button>
      </div>
    </form>
  );
}
