"use client";

import { useId } from "react";
import { frequencyUnitNames, type FrequencyUnit } from "@/components/devices/frequency-units";
import { selectClass } from "@/components/ui/field";
import type { Choice, MappingMetadata } from "./column-mapping-choices";
import type { MappingDetail, MappingTarget } from "./upload-request";

/** The file's columns with a quantity and unit to choose for each, and the first rows read that way. */
export function MappingTable({
  detail,
  targets,
  choices,
  onChoose,
}: {
  detail: MappingDetail;
  targets: MappingTarget[];
  choices: Choice[];
  onChoose: (index: number, change: Partial<Choice>) => void;
}) {
  const id = useId();
  return (
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
                <select id={`${id}-t${i}`} value={choices[i]?.target ?? ""} onChange={(e) => onChoose(i, { target: e.target.value })} className={`${selectClass} !py-1 !text-[0.875rem]`}>
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
                      <select id={`${id}-u${i}`} value={choices[i]?.unit ?? ""} onChange={(e) => onChoose(i, { unit: e.target.value })} className={`${selectClass} figure !w-auto !py-1 !text-[0.875rem]`}>
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
  );
}

/** The frequency (and a sweep's wanted order) that a mapped file of this kind needs when it does not state them. */
export function MissingMetadataFields({ kind, metadata, onChange }: { kind: string; metadata: MappingMetadata; onChange: (next: MappingMetadata) => void }) {
  const id = useId();
  return (
    <fieldset className="grid gap-4 sm:grid-cols-2">
      <legend className="mb-2 text-[0.9375rem] font-semibold">What the file does not say</legend>
      <div className="space-y-1.5">
        <label htmlFor={`${id}-f`} className="block text-[0.9375rem]">
          {kind === "drive-sweep" ? "Input frequency" : "Carrier frequency"}
        </label>
        <div className="flex items-center gap-2">
          <input id={`${id}-f`} inputMode="decimal" value={metadata.frequency} onChange={(e) => onChange({ ...metadata, frequency: e.target.value })} className={`${selectClass} figure !w-28`} />
          <label htmlFor={`${id}-fu`} className="sr-only">
            Frequency unit
          </label>
          <select id={`${id}-fu`} value={metadata.frequencyUnit} onChange={(e) => onChange({ ...metadata, frequencyUnit: e.target.value as FrequencyUnit })} className={`${selectClass} !w-24`}>
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
            <input id={`${id}-n`} inputMode="numeric" value={metadata.wantedOrder} onChange={(e) => onChange({ ...metadata, wantedOrder: e.target.value })} className={`${selectClass} figure !w-20`} />
          </div>
        </div>
      ) : null}
      <p className="text-sm text-ink-muted sm:col-span-2">Saved with the mapping; a value the file states in a # line wins.</p>
    </fieldset>
  );
}
