"use client";

import type { StatisticsGroup } from "@/lib/sheet/types";
import { SpecTable, type SpecRowHook } from "@/components/sheet/sheet-spec-table";
import type { WorkspaceModel } from "./workspace-types";

type SpecDataTableProps = {
  model: WorkspaceModel;
  openGroupId: string | null;
  onOpen: (groupId: string, trigger: HTMLElement) => void;
};

/**
 * The web sheet's specifications table with each figure a button that opens the data behind it, plus n,
 * Cpk and a data button per row (the same groupId as the statistics group).
 */
export function SpecDataTable({ model, openGroupId, onOpen }: SpecDataTableProps) {
  const { specifications, statistics } = model;
  if (specifications.rows.length === 0) {
    return (
      <p className="border-y border-rule py-4 text-ink-muted" data-testid="spec-data-empty">
        No specification rows yet: the sheet needs approved measurement sets of the kinds its class takes.
      </p>
    );
  }
  const groups = new Map<string, StatisticsGroup>(statistics.groups.map((g) => [g.groupId, g]));
  const where = (conditions: string[]) => conditions.filter(Boolean).join(", ");
  const hook: SpecRowHook = {
    headCells: (
      <>
        <th scope="col" className="num">
          n
        </th>
        <th scope="col" className="num">
          Cpk
        </th>
        <th scope="col">
          <span className="sr-only">Data</span>
        </th>
      </>
    ),
    figure: (row, which) => {
      const text = row[which].text;
      const at = where(row.conditions);
      return (
        <button
          type="button"
          onClick={(e) => onOpen(row.groupId, e.currentTarget)}
          aria-label={`${row.label} ${which} ${text} ${row.unit}${at ? `, ${at}` : ""}: show data`}
          className="rounded px-1 underline decoration-rule-strong decoration-dotted underline-offset-4 hover:decoration-signal"
          data-testid="spec-value"
        >
          {text}
        </button>
      );
    },
    rowProps: (row) => ({
      "data-group-id": row.groupId,
      "aria-current": openGroupId === row.groupId ? "true" : undefined,
      className: "aria-[current=true]:bg-signal-wash",
    }),
    cells: (row) => {
      const group = groups.get(row.groupId);
      const cpkLow = group?.cpk.value != null && group.cpk.value < statistics.cpkThreshold;
      const at = where(row.conditions);
      return (
        <>
          <td className="num figure">{row.n}</td>
          <td className={`num figure ${cpkLow ? "font-semibold text-signal-deep" : ""}`}>{group?.cpk.text || <span className="text-ink-muted">—</span>}</td>
          <td>
            <button
              type="button"
              onClick={(e) => onOpen(row.groupId, e.currentTarget)}
              className="rounded border border-rule-strong px-1.5 py-px text-[0.8125rem] font-semibold hover:border-signal"
              aria-label={`Data for ${row.label}${at ? `, ${at}` : ""}`}
              data-testid="spec-data-button"
            >
              data
            </button>
          </td>
        </>
      );
    },
  };
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Specifications with their data, scrolls sideways on narrow screens">
      <SpecTable
        specifications={specifications}
        hook={hook}
        data-testid="spec-data-table"
        caption={
          <>
            Select a figure, or a row’s <span className="font-semibold">data</span> button, to see the units and statistics behind it.
          </>
        }
      />
    </div>
  );
}
