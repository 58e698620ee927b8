"use client";

import { useEffect, useState, type KeyboardEvent } from "react";

export const workspaceTabs = [
  { id: "preview", label: "Preview" },
  { id: "limits", label: "Spec limits" },
  { id: "prose", label: "Prose and ratings" },
  { id: "design-in", label: "Design-in" },
] as const;
export type WorkspaceTabId = (typeof workspaceTabs)[number]["id"];
export type WorkspaceTab = (typeof workspaceTabs)[number];

/**
 * The workspace's tabs: the preview only for a reader, all three for an editor. The URL's hash
 * names the open tab (so a link or the back button can open one); arrow keys move between tabs.
 */
export function useWorkspaceTabs(canEdit: boolean) {
  const [tab, setTab] = useState<WorkspaceTabId>("preview");
  const visibleTabs: readonly WorkspaceTab[] = canEdit ? workspaceTabs : workspaceTabs.filter((t) => t.id === "preview");

  useEffect(() => {
    const followHash = () => {
      const fromHash = window.location.hash.slice(1);
      if (canEdit && workspaceTabs.some((t) => t.id === fromHash)) setTab(fromHash as WorkspaceTabId);
    };
    followHash();
    window.addEventListener("hashchange", followHash);
    return () => window.removeEventListener("hashchange", followHash);
  }, [canEdit]);

  const selectTab = (id: WorkspaceTabId) => {
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

  return { tab, visibleTabs, selectTab, onTabKey };
}
