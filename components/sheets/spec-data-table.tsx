"use client";

import { Notation } from "@/components/sheet/notation";

import type { StatisticsGroup } from "@/lib/sheet/types";
import { SpecHeadCells } from "@/components/sheet/sheet-spec-table";
import type { WorkspaceModel } from "./workspace-types";

type SpecDataTableProps = {
  model: WorkspaceModel;
  openGroupId: string | null;
  onOpen: (groupId: string, trigger: HTMLElement) => void;
};

/**
 * The electrical specifications as on the sheet, with each figure a button that opens the data behind it,
 * plus n, Cpk and flags. The web sheet's own table (components/sheet) has no click hook, so this one is
 * laid out here from the same model rows and statistics groups (same groupId).
 */
export function SpecDataTable({ model, openGroupId, onOpen }: SpecDataTableProps) {
  const { specifications, statistics } = model;
  const groups = new Map<string, StatisticsGroup>(statistics.groups.map((g) => [g.groupId, g]));
  if (specifications.rows.length === 0) {
    return (
      <p className="border-y border-rule py-4 text-ink-muted" data-testid="spec-data-empty">
        No specification rows yet: the sheet needs approved measurement sets of the kinds its class takes.
      </p>
    );
  }
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Specifications with their data, scrolls sideways on narrow screens">
      <table className="sheet-table" data-testid="spec-data-table">
        <caption>
          Select a figure, or a row’s <span className="font-semibold">data</span> button, to see the units and statistics behind it.
        </caption>
        <thead>
          <tr>
            <SpecHeadCells columns={specifications.conditionColumns} />
            <th scope="col" className="num">
              n
            </th>
            <th scope="col" className="num">
              Cpk
            </th>
            <th scope="col">
              <span className="sr-only">Data</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {specifications.rows.map((row) => {
            const group = groups.get(row.groupId);
            const flagged = group ? group.flags.length > 0 : false;
            const cpkLow = group?.cpk.value != null && group.cpk.value < statistics.cpkThreshold;
            const where = row.conditions.filter(Boolean).join(", ");
            const cell = (which: "min" | "typ" | "max") => {
              const text = row[which].text;
              if (!text) return <td className="num" />;
              return (
                <td className="num">
                  <button
                    type="button"
                    onClick={(e) => onOpen(row.groupId, e.currentTarget)}
                    aria-label={`${row.label} ${which} ${text} ${row.unit}${where ? `, ${where}` : ""}: show data`}
                    className={`figure rounded px-1 underline decoration-rule-strong decoration-dotted underline-offset-4 hover:decoration-signal ${
                      which === "typ" && row.typIsMeasuredMean ? "text-ink-muted" : ""
                    }`}
                    data-testid="spec-value"
                  >
                    {text}
                  </button>
                </td>
              );
            };
            return (
              <tr key={row.groupId} data-group-id={row.groupId} aria-current={openGroupId === row.groupId ? "true" : undefined} className="aria-[current=true]:bg-signal-wash">
                <th scope="row">
                  {row.label}
                  {flagged ? (
                    <span className="ml-1 font-semibold text-signal-deep" title="Flagged: see the data">
                      ! <span className="sr-only">flagged</span>
                    </span>
                  ) : null}
                </th>
                <td className="whitespace-nowrap">
                  <Notation text={row.symbol} />
                </td>
                {row.conditions.map((c, i) => (
                  <td key={i} className="figure whitespace-nowrap">
                    {c}
                  </td>
                ))}
                {cell("min")}
                {cell("typ")}
                {cell("max")}
                <td className="unit whitespace-nowrap">{row.unit}</td>
                <td>{row.basisMark}</td>
                <td className="num figure">{row.n}</td>
                <td className={`num figure ${cpkLow ? "font-semibold text-signal-deep" : ""}`}>{group?.cpk.text || <span className="text-ink-muted">—</span>}</td>
                <td>
                  <button
                    type="button"
                    onClick={(e) => onOpen(row.groupId, e.currentTarget)}
                    className="rounded border border-rule-strong px-1.5 py-px text-[0.8125rem] font-semibold hover:border-signal"
                    aria-label={`Data for ${row.label}${where ? `, ${where}` : ""}`}
                    data-testid="spec-data-button"
                  >
                    data
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
