"use client";

import { useRouter } from "next/navigation";
import { useCallback, useMemo, useRef, useState, useTransition, type ReactNode } from "react";
import { DesignInEditor } from "./design-in-editor";
import { ProseEditor } from "./prose-editor";
import { PreviewPanel, WorkspaceHeader, WorkspaceIssues, WorkspaceTabList } from "./sheet-workspace-sections";
import { SpecLimitsEditor } from "./spec-limits-editor";
import { StatisticsPanel } from "./statistics-panel";
import { useWorkspaceTabs } from "./use-workspace-tabs";
import type { WorkspaceContent, WorkspaceDesignIn, WorkspaceModel, WorkspaceTemplate } from "./workspace-types";

type SheetWorkspaceProps = {
  deviceId: number;
  canEdit: boolean;
  model: WorkspaceModel;
  content: WorkspaceContent;
  template: WorkspaceTemplate;
  designIn: WorkspaceDesignIn;
  approvedSetCount: number;
  /** The web sheet, rendered on the server. */
  sheetView: ReactNode;
  /** Where the sheet stands in review, the submission and release forms, and its revision history. */
  reviewPanel: ReactNode;
};

// The site's own header and footer carry no print rule of their own; on this page the printout is the sheet.
const printSheetOnly = `@media print {
  body > header, body > footer, .skip-link { display: none !important; }
  main#content { padding: 0 !important; max-width: none !important; }
}`;

/** The preview workspace of one draft sheet: issues, the figures and their data, web and PDF side by side, and the editors. */
export function SheetWorkspace({ deviceId, canEdit, model, content, template, designIn, approvedSetCount, sheetView, reviewPanel }: SheetWorkspaceProps) {
  const router = useRouter();
  const [refreshing, startRefresh] = useTransition();
  const [pdfVersion, setPdfVersion] = useState(0);
  const [openGroupId, setOpenGroupId] = useState<string | null>(null);
  const triggerRef = useRef<HTMLElement | null>(null);
  const { tab, visibleTabs, selectTab, onTabKey } = useWorkspaceTabs(canEdit);

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

  const { statistics } = model;
  return (
    <div data-testid="sheet-workspace">
      {/* Printing this page prints the web sheet alone, as the sheet's own print rules lay it out. */}
      <style>{printSheetOnly}</style>
      <WorkspaceHeader model={model} deviceId={deviceId} approvedSetCount={approvedSetCount} />

      <WorkspaceIssues model={model} />

      {reviewPanel}

      {visibleTabs.length > 1 ? (
        <WorkspaceTabList visibleTabs={visibleTabs} tab={tab} refreshing={refreshing} onSelect={selectTab} onTabKey={onTabKey} />
      ) : null}

      <PreviewPanel
        model={model}
        deviceId={deviceId}
        sheetView={sheetView}
        pdfVersion={pdfVersion}
        hidden={tab !== "preview"}
        asTabPanel={visibleTabs.length > 1}
        openGroupId={openGroupId}
        openGroup={openGroup}
      />

      {canEdit ? (
        <>
          <div id="sheet-panel-limits" role="tabpanel" aria-labelledby="sheet-tab-limits" hidden={tab !== "limits"} className="print:hidden">
            <SpecLimitsEditor deviceId={deviceId} model={model} limits={content.limits} onSaved={refreshPreview} />
          </div>
          <div id="sheet-panel-prose" role="tabpanel" aria-labelledby="sheet-tab-prose" hidden={tab !== "prose"} className="print:hidden">
            <ProseEditor deviceId={deviceId} model={model} content={content} template={template} onSaved={refreshPreview} />
          </div>
          <div id="sheet-panel-design-in" role="tabpanel" aria-labelledby="sheet-tab-design-in" hidden={tab !== "design-in"} className="print:hidden">
            <DesignInEditor deviceId={deviceId} designIn={designIn} onSaved={refreshPreview} />
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
