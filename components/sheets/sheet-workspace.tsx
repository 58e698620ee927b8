"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useMemo, useRef, useState, useTransition, type KeyboardEvent, type MouseEvent, type ReactNode } from "react";
import { PageHeader } from "@/components/ui/page-header";
import { PdfPreview } from "./pdf-preview";
import { ProseEditor } from "./prose-editor";
import { SpecDataTable } from "./spec-data-table";
import { SpecLimitsEditor } from "./spec-limits-editor";
import { StatisticsPanel } from "./statistics-panel";
import type { WorkspaceContent, WorkspaceModel, WorkspaceTemplate } from "./workspace-types";

type SheetWorkspaceProps = {
  deviceId: number;
  canEdit: boolean;
  model: WorkspaceModel;
  content: WorkspaceContent;
  template: WorkspaceTemplate;
  approvedSetCount: number;
  /** The web sheet, rendered on the server. */
  sheetView: ReactNode;
};

const tabs = [
  { id: "preview", label: "Preview" },
  { id: "limits", label: "Spec limits" },
  { id: "prose", label: "Prose and ratings" },
] as const;
type TabId = (typeof tabs)[number]["id"];

// The site's own header and footer carry no print rule of their own; on this page the printout is the sheet.
const printSheetOnly = `@media print {
  body > header, body > footer, .skip-link { display: none !important; }
  main#content { padding: 0 !important; max-width: none !important; }
}`;

/** The preview workspace of one draft sheet: issues, the figures and their data, web and PDF side by side, and the editors. */
export function SheetWorkspace({ deviceId, canEdit, model, content, template, approvedSetCount, sheetView }: SheetWorkspaceProps) {
  const router = useRouter();
  const [refreshing, startRefresh] = useTransition();
  const [pdfVersion, setPdfVersion] = useState(0);
  const [tab, setTab] = useState<TabId>("preview");
  const [openGroupId, setOpenGroupId] = useState<string | null>(null);
  const triggerRef = useRef<HTMLElement | null>(null);
  const visibleTabs = canEdit ? tabs : tabs.filter((t) => t.id === "preview");

  useEffect(() => {
    const followHash = () => {
      const fromHash = window.location.hash.slice(1);
      if (canEdit && tabs.some((t) => t.id === fromHash)) setTab(fromHash as TabId);
    };
    followHash();
    window.addEventListener("hashchange", followHash);
    return () => window.removeEventListener("hashchange", followHash);
  }, [canEdit]);

  const selectTab = (id: TabId) => {
    setTab(id);
    window.history.replaceState(null, "", id === "preview" ? window.location.pathname : `#${id}`);
  };

  const onTabKey = (event: KeyboardEvent<HTMLButtonElement>) => {
    if (event.key !== "ArrowRight" && event.key !== "ArrowLeft") return;
    const i = visibleTabs.findIndex((t) => t.id === tab);
    const next = visibleTabs[(i + (event.key === "ArrowRight" ? 1 : visibleTabs.length - 1)) % visibleTabs.length];
    selectTab(next.id);
    document.getElementById(`sheet-tab-${next.id}`)?.focus();
  };

  const openGroup = useCallback((groupId: string, trigger: HTMLElement | null) => {
    triggerRef.current = trigger;
    setOpenGroupId(groupId);
  }, []);
  const closePanel = useCallback(() => {
    setOpenGroupId(null);
    triggerRef.current?.focus();
  }, []);

  /** After a save: the server rebuilds the model (and the web sheet), and the PDF is fetched again. */
  const refreshPreview = useCallback(() => {
    startRefresh(() => router.refresh());
    setPdfVersion((v) => v + 1);
  }, [router]);

  const groups = useMemo(() => new Map(model.statistics.groups.map((g) => [g.groupId, g])), [model.statistics.groups]);
  const openGroupModel = openGroupId ? groups.get(openGroupId) : undefined;

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

  const { header, issues, statistics } = model;
  return (
    <div data-testid="sheet-workspace">
      {/* Printing this page prints the web sheet alone, as the sheet's own print rules lay it out. */}
      <style>{printSheetOnly}</style>
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

      {visibleTabs.length > 1 ? (
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
                onClick={() => selectTab(t.id)}
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
      ) : null}

      <div
        id="sheet-panel-preview"
        role={visibleTabs.length > 1 ? "tabpanel" : undefined}
        aria-labelledby={visibleTabs.length > 1 ? "sheet-tab-preview" : undefined}
        hidden={tab !== "preview"}
        className="print:!block"
      >
        <section aria-labelledby="spec-data-title" className="mb-10 print:hidden">
          <h2 id="spec-data-title" className="mb-3 text-xl font-semibold">
            Specifications and the data behind them
          </h2>
          <SpecDataTable model={model} openGroupId={openGroupId} onOpen={openGroup} />
        </section>

        <section aria-label="Web sheet and PDF, side by side" className="relative left-1/2 w-screen max-w-[120rem] -translate-x-1/2 px-4 sm:px-8 print:static print:w-auto print:max-w-none print:translate-x-0 print:px-0">
          <div className="grid gap-8 xl:grid-cols-2 print:block">
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
            <div className="min-w-0 xl:sticky xl:top-4 xl:h-[calc(100dvh-2rem)] print:hidden">
              <PdfPreview deviceId={deviceId} version={pdfVersion} partNumber={header.partNumber} />
            </div>
          </div>
        </section>
      </div>

      {canEdit ? (
        <>
          <div id="sheet-panel-limits" role="tabpanel" aria-labelledby="sheet-tab-limits" hidden={tab !== "limits"} className="print:hidden">
            <SpecLimitsEditor deviceId={deviceId} model={model} limits={content.limits} onSaved={refreshPreview} />
          </div>
          <div id="sheet-panel-prose" role="tabpanel" aria-labelledby="sheet-tab-prose" hidden={tab !== "prose"} className="print:hidden">
            <ProseEditor deviceId={deviceId} model={model} content={content} template={template} onSaved={refreshPreview} />
          </div>
        </>
      ) : null}

      {openGroupModel ? (
        <StatisticsPanel
          group={openGroupModel}
          deviceId={deviceId}
          coverage={statistics.coverage}
          confidence={statistics.confidence}
          cpkThreshold={statistics.cpkThreshold}
          decisionRules={statistics.decisionRules}
          onClose={closePanel}
        />
      ) : null}
    </div>
  );
}
