"use client";

import { useEffect, useRef } from "react";
import type { StatisticsGroup } from "@/lib/sheet/types";
import { FlagList } from "./flag-list";
import { GroupSummary, PanelHeading, UnitResults } from "./statistics-panel-sections";

type StatisticsPanelProps = {
  group: StatisticsGroup;
  deviceId: number;
  coverage: number;
  confidence: number;
  cpkThreshold: number;
  decisionRules: string[];
  onClose: () => void;
};

/** The data behind one figure of the specifications table: the statistics group, its flags and every unit's result. */
export function StatisticsPanel({ group: g, deviceId, coverage, confidence, cpkThreshold, decisionRules, onClose }: StatisticsPanelProps) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    headingRef.current?.focus();
  }, [g.groupId]);
  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") onClose();
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [onClose]);

  return (
    <aside
      role="dialog"
      aria-modal="false"
      aria-labelledby="statistics-panel-title"
      data-testid="statistics-panel"
      className="sheet-no-print fixed inset-y-0 right-0 z-40 flex w-full max-w-[30rem] flex-col border-l border-rule-strong bg-paper-bright shadow-[-8px_0_24px_-12px_rgba(28,26,23,0.25)]"
    >
      <PanelHeading group={g} headingRef={headingRef} onClose={onClose} />

      <div className="flex-1 space-y-6 overflow-y-auto px-5 py-4">
        <FlagList flags={g.flags} emptyText="No flags for this group." />

        <GroupSummary group={g} coverage={coverage} confidence={confidence} cpkThreshold={cpkThreshold} decisionRules={decisionRules} />

        <UnitResults group={g} deviceId={deviceId} />
      </div>
    </aside>
  );
}

