import Link from "next/link";
import type { KeyboardEvent, MouseEvent, ReactNode } from "react";
import { PageHeader } from "@/components/ui/page-header";
import { PdfPreview } from "./pdf-preview";
import { SpecDataTable } from "./spec-data-table";
import type { WorkspaceTab, WorkspaceTabId } from "./use-workspace-tabs";
import type { WorkspaceModel } from "./workspace-types";

/** The draft's title, where it comes from, and the way back to the device and the sheets list. */
export function WorkspaceHeader({ model, deviceId, approvedSetCount }: { model: WorkspaceModel; deviceId: number; approvedSetCount: number }) {
  const { header } = model;
  return (
    <div className="print:hidden">
      <PageHeader
        runningHead={[header.organizationName, header.deviceClassLabel, `${header.revisionText}, ${header.stateLabel.toLowerCase()}`].join(" · ")}
        title={`${header.partNumber} — sheet draft`}
        lead={
          <>
            {header.title}. Built just now from <span className="figure">{approvedSetCount}</span> approved measurement{" "}
            {approvedSetCount === 1 ? "set" : "sets"}; nothing here is published until a revision is released.{" "}
            <Link href={`/devices/${deviceId}`}>Device and measurement sets</Link>
          </>
        }
        actions={
          <Link href="/sheets" className="text-[0.9375rem]">
            All sheets
          </Link>
        }
      />
    </div>
  );
}

/** What stands between the draft and review: open issues and flagged statistics groups. */
export function WorkspaceIssues({ model }: { model: WorkspaceModel }) {
  const { issues, statistics } = model;
  return (
    <section aria-labelledby="issues-title" className="mb-8 print:hidden" data-testid="sheet-issues">
      <h2 id="issues-title" className="running-head mb-2 text-ink">
        Before review · <span className="figure">{issues.length}</span> {issues.length === 1 ? "open issue" : "open issues"}
        {statistics.flaggedGroupCount > 0 ? (
          <>
            {" "}
            · <span className="figure text-signal-deep">{statistics.flaggedGroupCount}</span> flagged{" "}
            {statistics.flaggedGroupCount === 1 ? "group" : "groups"}
          </>
        ) : null}
      </h2>
      {issues.length === 0 ? (
        <p className="text-ink-muted">No open issues: every rating is stated, every limit is backed by data, and every instrument was in calibration.</p>
      ) : (
        <ul className="max-w-[60rem] space-y-1 border-l-2 border-signal pl-4">
          {issues.map((issue, i) => (
            <li key={i} data-code={issue.code}>
              {issue.message}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

export function WorkspaceTabList({
  visibleTabs,
  tab,
  refreshing,
  onSelect,
  onTabKey,
}: {
  visibleTabs: readonly WorkspaceTab[];
  tab: WorkspaceTabId;
  refreshing: boolean;
  onSelect: (id: WorkspaceTabId) => void;
  onTabKey: (event: KeyboardEvent<HTMLButtonElement>) => void;
}) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-3 border-b border-rule print:hidden">
      <div role="tablist" aria-label="Sheet workspace" className="flex gap-1">
        {visibleTabs.map((t) => (
          <button
            key={t.id}
            id={`sheet-tab-${t.id}`}
            type="button"
            role="tab"
            aria-selected={tab === t.id}
            aria-controls={`sheet-panel-${t.id}`}
            tabIndex={tab === t.id ? 0 : -1}
            onClick={() => onSelect(t.id)}
            onKeyDown={onTabKey}
            className="-mb-px border-b-2 border-transparent px-3 py-2 text-[0.9375rem] font-semibold text-ink-muted hover:text-ink aria-selected:border-signal aria-selected:text-ink"
          >
            {t.label}
          </button>
        ))}
      </div>
      {refreshing ? (
        <p role="status" className="pb-2 text-sm text-ink-muted">
          Rebuilding the preview…
        </p>
      ) : null}
    </div>
  );
}

/** The figures with the data behind them, then the web sheet and its PDF side by side. */
export function PreviewPanel({
  model,
  deviceId,
  sheetView,
  pdfVersion,
  hidden,
  asTabPanel,
  openGroupId,
  openGroup,
}: {
  model: WorkspaceModel;
  deviceId: number;
  sheetView: ReactNode;
  pdfVersion: number;
  hidden: boolean;
  asTabPanel: boolean;
  openGroupId: string | null;
  openGroup: (groupId: string, trigger: HTMLElement | null) => void;
}) {
  /** The web sheet is drawn as published, without the table's row hook: a click on one of its rows opens the same data, by row order. */
  const onSheetClick = (event: MouseEvent<HTMLDivElement>) => {
    const target = event.target as HTMLElement;
    if (target.closest("a, button")) return;
    const tr = target.closest('section[aria-labelledby="sheet-specifications"] tbody tr');
    if (!tr || !tr.parentElement) return;
    const index = Array.from(tr.parentElement.children).indexOf(tr);
    const row = model.specifications.rows[index];
    if (row) openGroup(row.groupId, null);
  };

  return (
    <div
      id="sheet-panel-preview"
      role={asTabPanel ? "tabpanel" : undefined}
      aria-labelledby={asTabPanel ? "sheet-tab-preview" : undefined}
      hidden={hidden}
      className="print:!block"
    >
      <section aria-labelledby="spec-data-title" className="mb-10 print:hidden">
        <h2 id="spec-data-title" className="mb-3 text-xl font-semibold">
          Specifications and the data behind them
        </h2>
        <SpecDataTable model={model} openGroupId={openGroupId} onOpen={openGroup} />
      </section>

      <section aria-label="Web sheet and PDF" className="relative left-1/2 w-screen max-w-[120rem] -translate-x-1/2 px-4 sm:px-8 print:static print:w-auto print:max-w-none print:translate-x-0 print:px-0">
        {/* Side by side from 1536 px: below that each would be too narrow for the specifications table (issue 13, read at 1360 px). */}
        <div className="grid gap-8 2xl:grid-cols-2 print:block">
          <div className="min-w-0">
            <p className="running-head mb-2 print:hidden">Web sheet · draft</p>
            <div
              className="border border-rule bg-paper-bright print:border-0 print:bg-transparent [&_section[aria-labelledby=sheet-specifications]_tbody_tr]:cursor-pointer"
              onClick={onSheetClick}
              data-testid="web-sheet"
            >
              {sheetView}
            </div>
          </div>
          <div className="min-w-0 2xl:sticky 2xl:top-4 2xl:h-[calc(100dvh-2rem)] print:hidden">
            <PdfPreview deviceId={deviceId} version={pdfVersion} partNumber={model.header.partNumber} />
          </div>
        </div>
      </section>
    </div>
  );
}
