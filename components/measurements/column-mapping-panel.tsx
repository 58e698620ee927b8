"use client";

import { useId, useMemo, useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { frequencyUnitNames, toHz, type FrequencyUnit } from "@/components/devices/frequency-units";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { kindLabel } from "./measurement-labels";
import type { UploadConditions } from "./upload-panel";
import type { MappingDetail, MappingTarget } from "./upload-request";

type Choice = { target: string; unit: string };

/** A first guess from the header text: "Pin_dBm" → input power in dBm, "Harm2 (dBm)" → output at 2×. */
export function guessTarget(header: string, targets: MappingTarget[]): Choice {
  const h = header.toLowerCase();
  const unitMatch = /(dbc\/hz|dbm|dbc|db|mw|w|ghz|mhz|khz|hz)\b/i.exec(header.replace(/[()[\]_]/g, " "));
  const find = (target: string) => targets.find((t) => t.target === target);
  let target: MappingTarget | undefined;
  const order = /(?:harm|h|p|order)\s*_?(\d+)/i.exec(h);
  if (/^(pin|p_in|input|drive|source)/.test(h) || /\bpin\b/.test(h)) target = find("input_power");
  else if (/fund/.test(h)) target = find("fund_out") ?? find("p1_out");
  else if (/im3|imd3/.test(h)) target = find("im3_out");
  else if (order) target = find(`p${order[1]}_out`);
  else if (/offset/.test(h)) target = find("offset");
  else if (/^l\b|l\(f\)|phase.?noise/.test(h)) target = find("L");
  else if (/freq/.test(h)) target = find("frequency");
  else if (/conv|loss/.test(h)) target = find("conversion_loss");
  else if (/pout|output/.test(h)) target = find("output_power");
  if (!target) return { target: "", unit: "" };
  const unitText = unitMatch?.[1];
  const unit = target.units.find((u) => u.toLowerCase() === unitText?.toLowerCase()) ?? target.units[0];
  return { target: target.target, unit };
}

/** Metadata a mapped file of this kind needs when the file itself does not state it (fixtures/FORMATS.md). */
function metadataFor(kind: string, meta: { frequency: string; unit: FrequencyUnit; wantedOrder: string }): Record<string, string> {
  const frequency = meta.frequency.trim() ? `${meta.frequency.trim()} ${meta.unit}` : "";
  if (kind === "drive-sweep") return { ...(frequency ? { input_frequency: frequency } : {}), ...(meta.wantedOrder.trim() ? { wanted_order: meta.wantedOrder.trim() } : {}) };
  if (kind === "phase-noise") return frequency ? { carrier_frequency: frequency } : {};
  return {};
}

type ColumnMappingPanelProps = {
  fileName: string;
  detail: MappingDetail;
  conditions: UploadConditions;
  onCancel: () => void;
  onSaved: () => void;
};

export function ColumnMappingPanel({ fileName, detail, conditions, onCancel, onSaved }: ColumnMappingPanelProps) {
  const id = useId();
  const kinds = Object.keys(detail.targets);
  const [kind, setKind] = useState<string>(() => {
    const preferred = conditions.kind && kinds.includes(conditions.kind) ? conditions.kind : undefined;
    if (preferred) return preferred;
    // The kind whose quantities the headers suggest best.
    let best = kinds[0] ?? "";
    let bestScore = -1;
    for (const k of kinds) {
      const score = detail.headers.filter((h) => guessTarget(h, detail.targets[k]).target !== "").length;
      if (score > bestScore) {
        best = k;
        bestScore = score;
      }
    }
    return best;
  });
  const targets = useMemo(() => detail.targets[kind] ?? [], [detail, kind]);
  const [choices, setChoices] = useState<Choice[]>(() => detail.headers.map((h) => guessTarget(h, detail.targets[kind] ?? [])));
  const [name, setName] = useState(() => `${fileName.replace(/\.[^.]+$/, "")} columns`);
  const [frequency, setFrequency] = useState(conditions.inputFrequency);
  const [frequencyUnit, setFrequencyUnit] = useState<FrequencyUnit>(conditions.inputFrequencyUnit);
  const [wantedOrder, setWantedOrder] = useState("2");
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

  function findProblems(): string[] {
    const found: string[] = [];
    const used = new Map<string, number>();
    choices.forEach((c) => c.target && used.set(c.target, (used.get(c.target) ?? 0) + 1));
    for (const [target, count] of used) if (count > 1) found.push(`${labelOf(target)} is chosen for ${count} columns; pick one.`);
    for (const t of targets) if (t.required && !used.has(t.target)) found.push(`Map a column to ${t.label}.`);
    if (used.size === 0) found.push("Map at least one column.");
    if (name.trim().length < 2) found.push("Name the mapping (at least 2 characters).");
    const hz = toHz(frequency, frequencyUnit);
    if (hz !== undefined && !(hz > 0)) found.push("The frequency must be a number above 0.");
    if (kind === "drive-sweep" && wantedOrder.trim() !== "" && !/^\d+$/.test(wantedOrder.trim())) found.push("The wanted order is a whole number (2 for a doubler).");
    return found;
  }

  const labelOf = (target: string) => targets.find((t) => t.target === target)?.label ?? target;

  async function save(event: React.FormEvent) {
    event.preventDefault();
    setError(null);
    const found = findProblems();
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
          metadata: metadataFor(kind, { frequency, unit: frequencyUnit, wantedOrder }),
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

      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Columns of the file and their preview">
        <table className="sheet-table text-[0.875rem]" data-testid="mapping-table">
          <thead>
            <tr>
              <th scope="col" className="w-24">
                <span className="sr-only">Row</span>
              </th>
              {detail.headers.map((h, i) => (
                <th key={i} scope="col" className="!normal-case !tracking-normal">
                  <span className="figure text-ink">{h || `column ${i + 1}`}</span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            <tr>
              <th scope="row" className="running-head !align-middle">
                Quantity
              </th>
              {detail.headers.map((h, i) => (
                <td key={i} className="min-w-[13rem]">
                  <label htmlFor={`${id}-t${i}`} className="sr-only">
                    Quantity in column {h}
                  </label>
                  <select id={`${id}-t${i}`} value={choices[i]?.target ?? ""} onChange={(e) => choose(i, { target: e.target.value })} className={`${selectClass} !py-1 !text-[0.875rem]`}>
                    <option value="">Not used</option>
                    {targets.map((t) => (
                      <option key={t.target} value={t.target}>
                        {t.label}
                        {t.required ? " (required)" : ""}
                      </option>
                    ))}
                  </select>
                </td>
              ))}
            </tr>
            <tr>
              <th scope="row" className="running-head !align-middle">
                Unit
              </th>
              {detail.headers.map((h, i) => {
                const target = targets.find((t) => t.target === choices[i]?.target);
                return (
                  <td key={i}>
                    {target ? (
                      <>
                        <label htmlFor={`${id}-u${i}`} className="sr-only">
                          Unit of column {h}
                        </label>
                        <select id={`${id}-u${i}`} value={choices[i]?.unit ?? ""} onChange={(e) => choose(i, { unit: e.target.value })} className={`${selectClass} figure !w-auto !py-1 !text-[0.875rem]`}>
                          {target.units.map((u) => (
                            <option key={u}>{u}</option>
                          ))}
                        </select>
                      </>
                    ) : (
                      <span className="text-ink-muted">—</span>
                    )}
                  </td>
                );
              })}
            </tr>
            <tr className="bg-paper-deep/60">
              <th scope="row" className="running-head">
                Read as
              </th>
              {detail.headers.map((_, i) => {
                const target = targets.find((t) => t.target === choices[i]?.target);
                return (
                  <td key={i} className="figure" data-testid={`mapped-heading-${i}`}>
                    {target ? (
                      <span className="font-semibold">
                        {target.target} [{choices[i].unit}]
                      </span>
                    ) : (
                      <span className="text-ink-muted">ignored</span>
                    )}
                  </td>
                );
              })}
            </tr>
            {detail.preview.map((cells, r) => (
              <tr key={r}>
                <th scope="row" className="text-ink-muted">
                  <span className="sr-only">Preview row </span>
                  <span className="figure">{r + 1}</span>
                </th>
                {detail.headers.map((_, i) => (
                  <td key={i} className={`figure num ${choices[i]?.target ? "" : "text-ink-muted"}`}>
                    {cells[i] ?? ""}
                    {choices[i]?.target && cells[i] ? <span className="unit">{"\u00a0"}{choices[i].unit}</span> : null}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      {kind === "drive-sweep" || kind === "phase-noise" ? (
        <fieldset className="grid gap-4 sm:grid-cols-2">
          <legend className="mb-2 text-[0.9375rem] font-semibold">What the file does not say</legend>
          <div className="space-y-1.5">
            <label htmlFor={`${id}-f`} className="block text-[0.9375rem]">
              {kind === "drive-sweep" ? "Input frequency" : "Carrier frequency"}
            </label>
            <div className="flex items-center gap-2">
              <input id={`${id}-f`} inputMode="decimal" value={frequency} onChange={(e) => setFrequency(e.target.value)} className={`${selectClass} figure !w-28`} />
              <label htmlFor={`${id}-fu`} className="sr-only">
                Frequency unit
              </label>
              <select id={`${id}-fu`} value={frequencyUnit} onChange={(e) => setFrequencyUnit(e.target.value as FrequencyUnit)} className={`${selectClass} !w-24`}>
                {frequencyUnitNames.map((u) => (
                  <option key={u}>{u}</option>
                ))}
              </select>
            </div>
          </div>
          {kind === "drive-sweep" ? (
            <div className="space-y-1.5">
              <label htmlFor={`${id}-n`} className="block text-[0.9375rem]">
                Wanted output order
              </label>
              <div className="flex items-center gap-2">
                <span className="unit">×</span>
                <input id={`${id}-n`} inputMode="numeric" value={wantedOrder} onChange={(e) => setWantedOrder(e.target.value)} className={`${selectClass} figure !w-20`} />
              </div>
            </div>
          ) : null}
          <p className="text-sm text-ink-muted sm:col-span-2">Saved with the mapping; a value the file states in a # line wins.</p>
        </fieldset>
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
