import Link from "next/link";
import type { Curve } from "@/lib/analysis/types";
import type { DeviceSummary } from "@/lib/domain/devices";
import type { MeasurementSetDetail } from "@/lib/domain/measurements";
import { curvesForDisplay, thermalFloorFromParameters } from "@/lib/charts";
import { CurveFigure } from "@/components/charts/curve-figure";
import { formatByteSize, formatDate, formatDateTime } from "@/lib/format";
import { Notice } from "@/components/ui/notice";
import { NumberQuantity } from "@/components/ui/quantity";
import { conditionFieldIds, conditionFields } from "@/lib/domain/measurement-conditions";
import { ReviewActions } from "./review-actions";
import { TermGrid } from "@/components/ui/term-grid";
import { isPlausibilityWarning, PLAUSIBILITY_PREFIX } from "@/lib/ingest/plausibility-warning";

type SetProps = { device: DeviceSummary; set: MeasurementSetDetail };

export function SetBreadcrumb({ device, set }: SetProps) {
  return (
    <nav aria-label="Breadcrumb" className="mb-3 text-sm text-ink-muted">
      <Link href="/devices">Devices</Link> <span aria-hidden="true">/</span>{" "}
      <Link href={`/devices/${device.id}`} className="figure">
        {device.partNumber}
      </Link>{" "}
      <span aria-hidden="true">/</span> <span className="figure">Set #{set.id}</span>
    </nav>
  );
}

/** Approved, rejected, superseded, and any instrument whose calibration had lapsed. */
export function SetStatusNotices({ device, set }: SetProps) {
  const lapsed = set.instruments.filter((i) => i.calibrationLapsed);
  return (
    <div className="mb-8 space-y-3 empty:hidden">
      {set.state === "approved" ? (
        <Notice tone="success">
          Approved by {set.reviewedBy ?? "a reviewer"}
          {set.reviewedAt ? <> on {formatDateTime(set.reviewedAt)}</> : null}. This set is read-only; a correction is uploaded as a new set that
          supersedes it.
        </Notice>
      ) : null}
      {set.state === "rejected" ? (
        <Notice tone="error">
          Rejected by {set.reviewedBy ?? "a reviewer"}
          {set.reviewedAt ? <> on {formatDateTime(set.reviewedAt)}</> : null}: “{set.rejectionReason}”
        </Notice>
      ) : null}
      {set.supersededById ? (
        <Notice>
          Superseded by <Link href={`/devices/${device.id}/measurements/${set.supersededById}`}>set #{set.supersededById}</Link>; kept on record.
        </Notice>
      ) : null}
      {lapsed.length > 0 ? (
        <Notice tone="error">
          Calibration lapsed on the measurement date for {lapsed.map((i) => `${i.model} (serial ${i.serial})`).join(", ")}.
        </Notice>
      ) : null}
    </div>
  );
}

/** A reviewer decides on a submitted set, unless they uploaded it. */
export function SetReview({ set, viewer }: { set: MeasurementSetDetail; viewer: { id: number; canReview: boolean } }) {
  if (set.state !== "submitted" || !viewer.canReview) return null;
  const isUploader = set.uploadedById !== null && set.uploadedById === viewer.id;
  return isUploader ? (
    <div className="mb-10 max-w-prose" data-testid="review-own-set">
      <Notice>You uploaded this set, so another reviewer decides on it.</Notice>
    </div>
  ) : (
    <div className="mb-10">
      <ReviewActions setId={set.id} />
    </div>
  );
}

export function SetCurves({ set }: { set: MeasurementSetDetail }) {
  const curves = curvesForDisplay(Array.isArray(set.curves) ? (set.curves as Curve[]) : []);
  const thermalFloor = thermalFloorFromParameters(set.parameters);
  return (
    <section aria-labelledby="curves-title">
      <h2 id="curves-title" className="mb-3 text-xl font-semibold">
        Curves
      </h2>
      {curves.length === 0 ? (
        <p className="border-y border-rule py-4 text-ink-muted">The engine drew no curve from this file.</p>
      ) : (
        <div className="space-y-10">
          {curves.map((curve, i) => (
            <CurveFigure key={`${curve.id}-${i}`} curve={curve} number={i + 1} thermalFloorDbcHz={curve.id === "phase-noise" ? thermalFloor : undefined} />
          ))}
        </div>
      )}
    </section>
  );
}

export function SetWarnings({ warnings }: { warnings: string[] }) {
  return (
    <>
      <h2 id="warnings-title" className="mb-3 text-xl font-semibold">
        Warnings <span className="figure text-base font-normal text-ink-muted">({warnings.length})</span>
      </h2>
      {warnings.length === 0 ? (
        <p className="border-y border-rule py-3 text-ink-muted">None: the file and the stated conditions agree.</p>
      ) : (
        <ul className="divide-y divide-rule border-y border-rule" data-testid="set-warnings">
          {warnings.map((w, i) =>
            isPlausibilityWarning(w) ? (
              <li key={i} className="py-2 text-[0.9375rem]" data-testid="plausibility-warning">
                <span className="running-head mr-2 !text-signal-deep">Plausibility</span>
                {w.slice(PLAUSIBILITY_PREFIX.length)}
              </li>
            ) : (
              <li key={i} className="py-2 text-[0.9375rem]">
                <span className="running-head mr-2 !text-signal-deep">Warning</span>
                {w}
              </li>
            ),
          )}
        </ul>
      )}
    </>
  );
}

export function SetInstruments({ instruments }: { instruments: MeasurementSetDetail["instruments"] }) {
  return (
    <>
      <h2 className="mb-3 mt-10 text-xl font-semibold">Instruments</h2>
      {instruments.length === 0 ? (
        <p className="border-y border-rule py-3 text-ink-muted">No instrument was stated with this upload.</p>
      ) : (
        <table className="sheet-table" data-testid="set-instruments">
          <thead>
            <tr>
              <th scope="col">Instrument</th>
              <th scope="col">Serial</th>
              <th scope="col" className="num">
                Calibration due
              </th>
            </tr>
          </thead>
          <tbody>
            {instruments.map((i) => (
              <tr key={i.id}>
                <td>
                  {i.kind} · {i.model}
                </td>
                <td className="figure">{i.serial}</td>
                <td className="num whitespace-nowrap">
                  <span className="figure">{formatDate(i.calibrationDueOn)}</span>
                  {i.calibrationLapsed ? <span className="ml-2 font-semibold text-signal-deep">lapsed</span> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}

/** Uploaded, reviewed (or awaiting review), superseded: the set's life as a timeline. */
export function SetHistory({ device, set }: SetProps) {
  return (
    <ol className="space-y-0 border-l border-rule-strong pl-5" data-testid="set-history">
      <HistoryItem when={set.createdAt} title="Uploaded">
        by {set.uploadedBy ?? (set.source === "bench-api" ? "a bench token (API)" : "—")}
        {set.source === "bench-api" ? " through the bench API" : " in the browser"}
        {set.supersedesId ? (
          <>
            , superseding <Link href={`/devices/${device.id}/measurements/${set.supersedesId}`}>set #{set.supersedesId}</Link>
          </>
        ) : null}
      </HistoryItem>
      {set.reviewedAt ? (
        <HistoryItem when={set.reviewedAt} title={set.state === "approved" ? "Approved" : "Rejected"}>
          by {set.reviewedBy ?? "a reviewer"}
          {set.rejectionReason ? <>: “{set.rejectionReason}”</> : null}
        </HistoryItem>
      ) : (
        <HistoryItem title="Awaiting review">a reviewer other than the uploader decides</HistoryItem>
      )}
      {set.supersededById ? (
        <HistoryItem title="Superseded">
          by <Link href={`/devices/${device.id}/measurements/${set.supersededById}`}>set #{set.supersededById}</Link>
        </HistoryItem>
      ) : null}
    </ol>
  );
}

export function RawFileFacts({ set }: { set: MeasurementSetDetail }) {
  return (
    <>
      <h2 className="mb-3 mt-10 text-xl font-semibold">Raw file</h2>
      <dl className="grid grid-cols-[max-content_minmax(0,1fr)] gap-x-6 gap-y-1.5 text-[0.9375rem]">
        <dt className="text-ink-muted">Name</dt>
        <dd className="figure break-all">{set.fileName}</dd>
        <dt className="text-ink-muted">Size</dt>
        <dd className="figure">{formatByteSize(set.sizeBytes)}</dd>
        <dt className="text-ink-muted">SHA-256</dt>
        <dd className="figure break-all text-[0.8125rem]">{set.sha256}</dd>
      </dl>
      <p className="mt-3 text-[0.9375rem]">
        <a href={`/api/measurements/${set.id}/file`} download={set.fileName} data-testid="download-raw-file">
          Download the raw file
        </a>{" "}
        <span className="text-[0.8125rem] text-ink-muted">(the bytes as uploaded)</span>
      </p>
    </>
  );
}

function HistoryItem({ when, title, children }: { when?: string; title: string; children: React.ReactNode }) {
  return (
    <li className="relative pb-4 text-[0.9375rem] before:absolute before:-left-[1.6rem] before:top-2 before:h-2 before:w-2 before:rounded-full before:bg-ink">
      <p>
        <span className="font-semibold">{title}</span> {children}
      </p>
      {when ? <p className="figure text-sm text-ink-muted">{formatDateTime(when)}</p> : null}
    </li>
  );
}

export function ConditionsList({ set }: { set: MeasurementSetDetail }) {
  const k = set.conditions;
  const items: [string, React.ReactNode][] = [
    ["Serial", k.serial ? <span className="figure">{k.serial}</span> : "—"],
    ["Lot", k.lot ? <span className="figure">{k.lot}</span> : "—"],
    ["Temperature", k.temperatureC === undefined ? "—" : <NumberQuantity value={k.temperatureC} unit="°C" />],
    // The condition fields the upload or the file stated (lib/domain/measurement-conditions.ts), in that list's order.
    ...conditionFieldIds.flatMap((fieldId): [string, React.ReactNode][] => {
      const value = k[fieldId];
      if (value === undefined) return [];
      const field = conditionFields[fieldId];
      return [[field.label, <NumberQuantity key={fieldId} value={value} unit={field.unit} signed={field.kind === "power-dbm"} />]];
    }),
    ...(k.impedanceOhm === undefined ? [] : ([["Impedance", <NumberQuantity key="z" value={k.impedanceOhm} unit="Ω" />]] as [string, React.ReactNode][])),
    ["Measured on", set.measuredOn ? <span className="figure">{formatDate(set.measuredOn)}</span> : "—"],
  ];
  return (
    <>
      <TermGrid items={items} columns="sm:grid-cols-4" testId="set-conditions" />
      {k.notes ? <p className="mt-3 max-w-prose text-[0.9375rem]"><span className="running-head mr-2">Notes</span>{k.notes}</p> : null}
    </>
  );
}

