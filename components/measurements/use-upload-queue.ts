"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { buildForm, checkConditions, type Row, type RowState, type UploadConditions } from "./upload-form-data";
import { sendUpload, type ApiErrorBody } from "./upload-request";

let rowCounter = 0;

/**
 * The files of one upload batch and their progress: added files wait as "ready"; uploading sends
 * two at a time with the batch's conditions, each row following its own phase to done, failed or
 * needs-mapping. The page's data is refreshed once anything was stored.
 */
export function useUploadQueue(deviceId: number, conditions: UploadConditions) {
  const router = useRouter();
  const [rows, setRows] = useState<Row[]>([]);
  const [formError, setFormError] = useState<string | null>(null);
  const [running, setRunning] = useState(false);

  const updateRow = (key: string, state: RowState) => setRows((all) => all.map((r) => (r.key === key ? { ...r, state } : r)));

  function addFiles(list: FileList | File[]) {
    const files = Array.from(list);
    if (files.length === 0) return;
    setRows((all) => [...all.filter((r) => r.state.phase !== "ready" || !files.some((f) => f.name === r.file.name)), ...files.map((file) => ({ key: `f${++rowCounter}`, file, state: { phase: "ready" } as RowState }))]);
  }

  async function uploadOne(row: Row, c: UploadConditions): Promise<boolean> {
    updateRow(row.key, { phase: "uploading", loaded: 0, total: row.file.size });
    try {
      const response = await sendUpload({
        url: `/api/devices/${deviceId}/measurements`,
        form: buildForm(row.file, c),
        onProgress: ({ loaded, total }) => {
          if (loaded >= total) updateRow(row.key, { phase: "processing" });
          else updateRow(row.key, { phase: "uploading", loaded, total });
        },
      });
      if (response.status === 201) {
        const body = response.body as { measurementSet: { id: number; warnings: string[] } };
        updateRow(row.key, { phase: "done", setId: body.measurementSet.id, warnings: body.measurementSet.warnings.length });
        return true;
      }
      const error = (response.body as ApiErrorBody | null)?.error;
      const message = error?.message ?? `The server answered ${response.status}.`;
      if (response.status === 422 && error?.details?.mapping) {
        updateRow(row.key, { phase: "needs-mapping", status: response.status, message, mapping: error.details.mapping, mappingOpen: true });
      } else {
        updateRow(row.key, { phase: "failed", status: response.status, message, ingest: error?.details?.ingest, existingSetId: error?.details?.existingSetId });
      }
    } catch (error) {
      updateRow(row.key, { phase: "failed", status: 0, message: error instanceof Error ? error.message : "The upload failed." });
    }
    return false;
  }

  async function uploadRows(targets: Row[]) {
    const problem = checkConditions(conditions, targets.length);
    setFormError(problem);
    if (problem || targets.length === 0) return;
    setRunning(true);
    const snapshot = conditions;
    // Two at a time: each row shows its own progress, and a batch of many files does not flood the server.
    const queue = [...targets];
    let anyDone = false;
    const worker = async () => {
      for (let next = queue.shift(); next; next = queue.shift()) anyDone = (await uploadOne(next, snapshot)) || anyDone;
    };
    await Promise.all([worker(), worker()]);
    setRunning(false);
    if (anyDone) router.refresh();
  }

  return { rows, setRows, updateRow, addFiles, uploadRows, formError, running };
}
