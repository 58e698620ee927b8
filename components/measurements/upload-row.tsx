"use client";

import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import type { Row, RowState } from "./upload-form-data";
import { formatByteSize } from "@/lib/format";

export type UploadRowViewProps = {
  row: Row;
  deviceId: number;
  onRemove: () => void;
  onRetry: () => void;
  onToggleMapping: (open: boolean) => void;
};

export function UploadRowView({ row, deviceId, onRemove, onRetry, onToggleMapping }: UploadRowViewProps) {
  const { file, state } = row;
  const percent = state.phase === "uploading" && state.total > 0 ? Math.round((state.loaded / state.total) * 100) : state.phase === "processing" ? 100 : 0;
  return (
    <li className="py-3" data-testid="upload-row" data-phase={state.phase} data-file={file.name}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <p className="min-w-0 truncate">
          <span className="figure font-semibold">{file.name}</span> <span className="text-sm text-ink-muted">{formatByteSize(file.size)}</span>
        </p>
        <UploadRowStatus state={state} percent={percent} deviceId={deviceId} />
      </div>

      {state.phase === "uploading" || state.phase === "processing" ? (
        <div className="mt-2">
          <progress
            max={100}
            value={percent}
            aria-label={`Upload of ${file.name}`}
            className="upload-progress h-1.5 w-full appearance-none overflow-hidden rounded-none [&::-moz-progress-bar]:bg-ink [&::-webkit-progress-bar]:bg-paper-deep [&::-webkit-progress-value]:bg-ink"
            data-testid="upload-progress"
          />
        </div>
      ) : null}

      {state.phase === "failed" ? <UploadRefusal state={state} deviceId={deviceId} /> : null}

      {state.phase === "needs-mapping" ? (
        <div className="mt-2 space-y-3">
          <p className="text-[0.9375rem]">
            <span className="figure text-[0.875rem]">{state.message}</span>{" "}
            {state.mappingOpen ? (
              <a href={`#mapping-${row.key}`} className="text-[0.9375rem]">
                Map the columns below ↓
              </a>
            ) : (
              <button type="button" className={buttonClass.quiet} onClick={() => onToggleMapping(true)}>
                Map the columns
              </button>
            )}
          </p>
        </div>
      ) : null}

      {state.phase === "ready" || state.phase === "failed" ? (
        <p className="mt-1.5 flex gap-4 text-sm">
          {state.phase === "failed" ? (
            <button type="button" className={buttonClass.quiet} onClick={onRetry}>
              Try again
            </button>
          ) : null}
          <button type="button" className={buttonClass.quiet} onClick={onRemove}>
            Remove<span className="sr-only"> {file.name}</span>
          </button>
        </p>
      ) : null}
    </li>
  );
}

type RowStateOf<P extends RowState["phase"]> = Extract<RowState, { phase: P }>;

/** One word or two for where the file stands, with the set it became once done. */
function UploadRowStatus({ state, percent, deviceId }: { state: RowState; percent: number; deviceId: number }) {
  return (
    <p className="text-sm" data-testid="upload-row-status">
      {state.phase === "ready" ? <span className="text-ink-muted">Ready</span> : null}
      {state.phase === "uploading" ? (
        <span className="text-ink-muted">
          Sending <span className="figure">{percent}</span>%
        </span>
      ) : null}
      {state.phase === "processing" ? <span className="text-ink-muted">Sent; checking and computing…</span> : null}
      {state.phase === "done" ? (
        <span>
          <span className="running-head mr-1.5 !text-ink">Done</span>
          <Link href={`/devices/${deviceId}/measurements/${state.setId}`} className="font-semibold">
            Set <span className="figure">#{state.setId}</span>
          </Link>
          {state.warnings > 0 ? (
            <span className="ml-1.5 text-signal-deep">
              · <span className="figure">{state.warnings}</span> {state.warnings === 1 ? "warning" : "warnings"}
            </span>
          ) : null}
        </span>
      ) : null}
      {state.phase === "failed" ? (
        <span className="running-head !text-signal-deep">
          Refused{state.status ? <> · <span className="figure">{state.status}</span></> : null}
        </span>
      ) : null}
      {state.phase === "needs-mapping" ? <span className="running-head !text-signal-deep">Columns not recognised</span> : null}
    </p>
  );
}

/** Why the server refused the file: its message, and where in the file when the engine said so. */
function UploadRefusal({ state, deviceId }: { state: RowStateOf<"failed">; deviceId: number }) {
  return (
    <div className="mt-2 border-l-2 border-signal bg-signal-wash px-3 py-2 text-[0.9375rem]" role="alert" data-testid="upload-error">
      <p className="figure text-[0.875rem] leading-relaxed break-words">{state.message}</p>
      {state.ingest && (state.ingest.line !== undefined || state.ingest.column !== undefined) ? (
        <p className="mt-1 text-sm text-ink-muted">
          {state.ingest.line !== undefined ? (
            <>
              line <span className="figure text-ink">{state.ingest.line}</span>
            </>
          ) : null}
          {state.ingest.column !== undefined ? (
            <>
              {" "}
              · column <span className="figure text-ink">{state.ingest.column}</span>
            </>
          ) : null}
          {state.ingest.field ? (
            <>
              {" "}
              · <span className="figure text-ink">{state.ingest.field}</span>
            </>
          ) : null}
          {state.ingest.code ? <> · {state.ingest.code}</> : null}
        </p>
      ) : null}
      {state.existingSetId ? (
        <p className="mt-1 text-sm">
          <Link href={`/devices/${deviceId}/measurements/${state.existingSetId}`}>Open set #{state.existingSetId}</Link>
        </p>
      ) : null}
    </div>
  );
}
