"use client";

import { useId, useState } from "react";
import type { InstrumentSummary } from "@/lib/domain/instruments";
import { deviceClassLabels, type DeviceClass } from "@/lib/domain/device-classes";
import { classConditions, uploadConditionFields } from "@/templates/upload-conditions";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { ColumnMappingPanel } from "./column-mapping-panel";
import { UploadConditionsForm } from "./upload-conditions-form";
import { UploadDropzone } from "./upload-dropzone";
import { initialConditions, type SupersedableSet, type UploadConditions } from "./upload-form-data";
import { useUploadQueue } from "./use-upload-queue";
import { UploadRowView } from "./upload-row";

export type { SupersedableSet, UploadConditions } from "./upload-form-data";

type UploadPanelProps = { deviceId: number; deviceClass: DeviceClass; instruments: InstrumentSummary[]; supersedable: SupersedableSet[] };

export function UploadPanel({ deviceId, deviceClass, instruments, supersedable }: UploadPanelProps) {
  const id = useId();
  const [conditions, setConditions] = useState<UploadConditions>(() => initialConditions(uploadConditionFields(deviceClass), classConditions[deviceClass]));
  const { rows, setRows, updateRow, addFiles, uploadRows, formError, running } = useUploadQueue(deviceId, conditions);

  const set = <K extends keyof UploadConditions>(key: K, value: UploadConditions[K]) => setConditions((c) => ({ ...c, [key]: value }));
  const ready = rows.filter((r) => r.state.phase === "ready");
  const finished = rows.filter((r) => r.state.phase === "done" || r.state.phase === "failed");

  return (
    <section aria-labelledby={`${id}-title`} className="border-t border-rule pt-8" data-testid="upload-panel">
      <h2 id={`${id}-title`} className="mb-1 text-xl font-semibold">
        Upload measurements
      </h2>
      <p className="mb-6 max-w-prose text-ink-muted">
        CSV sweeps (drive, frequency, two-tone, phase noise) or Touchstone files. The conditions below apply to every file in the batch; a value the file
        states itself is kept, and a disagreement is recorded as a warning.
      </p>

      <div className="grid gap-10 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
        <UploadConditionsForm conditions={conditions} classLabel={deviceClassLabels[deviceClass]} onChange={set} disabled={running} instruments={instruments} supersedable={supersedable} />

        <div className="min-w-0 space-y-4">
          <UploadDropzone onFiles={addFiles} />

          <div aria-live="polite" className="empty:hidden">
            {formError ? <Notice tone="error">{formError}</Notice> : null}
          </div>

          {rows.length > 0 ? (
            <ol className="divide-y divide-rule border-y border-rule" data-testid="upload-rows" aria-label="Files in this batch">
              {rows.map((row) => (
                <UploadRowView
                  key={row.key}
                  row={row}
                  deviceId={deviceId}
                  onRemove={() => setRows((all) => all.filter((r) => r.key !== row.key))}
                  onRetry={() => void uploadRows([row])}
                  onToggleMapping={(open) => row.state.phase === "needs-mapping" && updateRow(row.key, { ...row.state, mappingOpen: open })}
                />
              ))}
            </ol>
          ) : null}

          <div className="flex flex-wrap items-center gap-4">
            <button type="button" className={buttonClass.primary} disabled={running || ready.length === 0} onClick={() => void uploadRows(ready)}>
              {running ? "Uploading…" : ready.length > 1 ? `Upload ${ready.length} files` : "Upload"}
            </button>
            {finished.length > 0 && !running ? (
              <button type="button" className={buttonClass.quiet} onClick={() => setRows((all) => all.filter((r) => r.state.phase !== "done" && r.state.phase !== "failed"))}>
                Clear finished rows
              </button>
            ) : null}
          </div>
        </div>
      </div>

      {rows.map((row) =>
        row.state.phase === "needs-mapping" && row.state.mappingOpen ? (
          <div key={row.key} id={`mapping-${row.key}`} className="mt-10 scroll-mt-6">
            <ColumnMappingPanel
              fileName={row.file.name}
              detail={row.state.mapping}
              conditions={conditions}
              onCancel={() => row.state.phase === "needs-mapping" && updateRow(row.key, { ...row.state, mappingOpen: false })}
              onSaved={() => void uploadRows([row])}
            />
          </div>
        ) : null,
      )}
    </section>
  );
}

