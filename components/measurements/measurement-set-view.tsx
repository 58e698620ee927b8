import Link from "next/link";
import { parameterCatalog } from "@/lib/analysis/catalog";
import type { Curve, DerivedParameter } from "@/lib/analysis/types";
import type { DeviceSummary } from "@/lib/domain/devices";
import type { MeasurementSetDetail } from "@/lib/domain/measurements";
import { curvesForDisplay, thermalFloorFromParameters } from "@/lib/charts";
import { CurveFigure } from "@/components/charts/curve-figure";
import { formatDate, formatDateTime } from "@/lib/format";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { NumberQuantity, Quantity } from "@/components/ui/quantity";
import { kindLabel } from "@/lib/domain/measurements";
import { describeConditions } from "./parameter-conditions";
import { ReviewActions } from "./review-actions";
import { StateBadge } from "./state-badge";
import { formatByteSize } from "@/lib/format";

type MeasurementSetViewProps = {
  device: DeviceSummary;
  set: MeasurementSetDetail;
  organizationName: string;
  viewer: { id: number; canReview: boolean };
};

export function MeasurementSetView({ device, set, organizationName, viewer }: MeasurementSetViewProps) {
  const curves = curvesForDisplay(Array.isArray(set.curves) ? (set.curves as Curve[]) : []);
  const thermalFloor = thermalFloorFromParameters(set.parameters);
  const isUploader = set.uploadedById !== null && set.uploadedById === viewer.id;
  const lapsed = set.instruments.filter((i) => i.calibrationLapsed);

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-3 text-sm text-ink-muted">
        <Link href="/devices">Devices</Link> <span aria-hidden="true">/</span>{" "}
        <Link href={`/devices/${device.id}`} className="figure">
          {device.partNumber}
        </Link>{" "}
        <span aria-hidden="true">/</span> <span className="figure">Set #{set.id}</span>
      </nav>
      <PageHeader
        runningHead={`${organizationName} · ${device.partNumber}`}
        title={`${kindLabel(set.kind)} · set #${set.id}`}
        actions={<StateBadge state={set.state} />}
        lead={
          <p>
            <span className="figure text-ink">{set.fileName}</span> · serial <span className="figure text-ink">{set.conditions.serial ?? "—"}</span>
            {set.conditions.lot ? (
              <>
                {" "}
                · lot <span className="figure text-ink">{set.conditions.lot}</span>
              </>
            ) : null}
            {set.measuredOn ? (
              <>
                {" "}
                · measured <span className="figure text-ink">{formatDate(set.measuredOn)}</span>
              </>
            ) : null}
          </p>
        }
      />

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

      {set.state === "submitted" && viewer.canReview ? (
        isUploader ? (
          <div className="mb-10 max-w-prose" data-testid="review-own-set">
            <Notice>You uploaded this set, so another reviewer decides on it.</Notice>
          </div>
        ) : (
          <div className="mb-10">
            <ReviewActions setId={set.id} />
          </div>
        )
      ) : null}

      <section aria-labelledby="conditions-title" className="mb-10">
        <h2 id="conditions-title" className="mb-3 text-xl font-semibold">
          Conditions
        </h2>
        <ConditionsList set={set} />
      </section>

      <div className="mb-12 grid gap-x-12 gap-y-10 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <section aria-labelledby="parameters-title">
          <h2 id="parameters-title" className="mb-3 text-xl font-semibold">
            Derived parameters
          </h2>
          <ParametersTable parameters={set.parameters} />
        </section>
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
      </div>

      <div className="grid gap-x-12 gap-y-10 lg:grid-cols-2">
        <section aria-labelledby="warnings-title">
          <h2 id="warnings-title" className="mb-3 text-xl font-semibold">
            Warnings <span className="figure text-base font-normal text-ink-muted">({set.warnings.length})</span>
          </h2>
          {set.warnings.length === 0 ? (
            <p className="border-y border-rule py-3 text-ink-muted">None: the file and the stated conditions agree.</p>
          ) : (
            <ul className="divide-y divide-rule border-y border-rule" data-testid="set-warnings">
              {set.warnings.map((w, i) => (
                <li key={i} className="py-2 text-[0.9375rem]">
                  <span className="running-head mr-2 !text-signal-deep">Warning</span>
                  {w}
                </li>
              ))}
            </ul>
          )}

          <h2 className="mb-3 mt-10 text-xl font-semibold">Instruments</h2>
          {set.instruments.length === 0 ? (
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
                {set.instruments.map((i) => (
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
        </section>

        <section aria-labelledby="history-title">
          <h2 id="history-title" className="mb-3 text-xl font-semibold">
            History
          </h2>
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

          <h2 className="mb-3 mt-10 text-xl font-semibold">Raw file</h2>
          <dl className="grid grid-cols-[max-content_minmax(0,1fr)] gap-x-6 gap-y-1.5 text-[0.9375rem]">
            <dt className="text-ink-muted">Name</dt>
            <dd className="figure break-all">{set.fileName}</dd>
            <dt className="text-ink-muted">Size</dt>
            <dd className="figure">{formatByteSize(set.sizeBytes)}</dd>
            <dt className="text-ink-muted">SHA-256</dt>
            <dd className="figure break-all text-[0.8125rem]">{set.sha256}</dd>
          </dl>
        </section>
      </div>
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

function ConditionsList({ set }: { set: MeasurementSetDetail }) {
  const k = set.conditions;
  const items: [string, React.ReactNode][] = [
    ["Serial", k.serial ? <span className="figure">{k.serial}</span> : "—"],
    ["Lot", k.lot ? <span className="figure">{k.lot}</span> : "—"],
    ["Temperature", k.temperatureC === undefined ? "—" : <NumberQuantity value={k.temperatureC} unit="°C" />],
    ["Input frequency", k.inputFrequencyHz === undefined ? "—" : <NumberQuantity value={k.inputFrequencyHz} unit="Hz" />],
    ["Drive level", k.driveLevelDbm === undefined ? "—" : <NumberQuantity value={k.driveLevelDbm} unit="dBm" signed />],
    ["Splitter excess loss", k.splitterExcessLossDb === undefined ? "—" : <NumberQuantity value={k.splitterExcessLossDb} unit="dB" />],
    ["Cable loss", k.cableLossDb === undefined ? "—" : <NumberQuantity value={k.cableLossDb} unit="dB" />],
    ["Measured on", set.measuredOn ? <span className="figure">{formatDate(set.measuredOn)}</span> : "—"],
  ];
  return (
    <>
      <dl className="grid grid-cols-2 gap-x-8 gap-y-3 border-y border-rule py-4 sm:grid-cols-4" data-testid="set-conditions">
        {items.map(([term, value]) => (
          <div key={term}>
            <dt className="running-head">{term}</dt>
            <dd className="mt-0.5">{value}</dd>
          </div>
        ))}
      </dl>
      {k.notes ? <p className="mt-3 max-w-prose text-[0.9375rem]"><span className="running-head mr-2">Notes</span>{k.notes}</p> : null}
    </>
  );
}

function labelOf(name: string): { label: string; description?: string } {
  const entry = (parameterCatalog as Record<string, { label: string; description: string }>)[name];
  return entry ? { label: entry.label, description: entry.description } : { label: name };
}

function ParameterValue({ p }: { p: DerivedParameter }) {
  if (p.value === null) return <span className="text-ink-muted">not computed</span>;
  // Two decimals, or three significant figures for a small value (an RMS phase error of 0.0042° is not "0°").
  return <NumberQuantity value={p.value} unit={p.unit} digits={{ maxDecimals: 2, minSignificant: 3 }} signed={p.unit === "dBm"} />;
}

/** Parameters that recur at every sweep step (conversion loss per drive step) fold away below the key figures. */
const FOLD_AT = 9;

function ParametersTable({ parameters }: { parameters: DerivedParameter[] }) {
  if (parameters.length === 0) return <p className="border-y border-rule py-4 text-ink-muted">No parameter was derived from this file.</p>;
  const counts = new Map<string, number>();
  for (const p of parameters) counts.set(p.name, (counts.get(p.name) ?? 0) + 1);
  // Within a recurring name, the rows a datasheet quotes (optimum, worst, band statistics) stay up top.
  const isSummary = (p: DerivedParameter) =>
    (counts.get(p.name) ?? 0) < FOLD_AT || "statistic" in p.conditions || p.conditions.drive === "optimum" || "method" in p.conditions;
  const key = parameters.filter(isSummary);
  const steps = parameters.filter((p) => !isSummary(p));
  const stepNames = [...new Set(steps.map((p) => labelOf(p.name).label))];
  return (
    <>
      <ParameterRows parameters={key} testId="set-parameters" />
      {steps.length > 0 ? (
        <details className="mt-4 border-b border-rule pb-2" data-testid="set-parameters-steps">
          <summary className="cursor-pointer py-1 text-[0.9375rem] font-semibold">
            {stepNames.join(", ")} at each step <span className="figure font-normal text-ink-muted">({steps.length})</span>
          </summary>
          <div className="mt-3">
            <ParameterRows parameters={steps} />
          </div>
        </details>
      ) : null}
    </>
  );
}

function ParameterRows({ parameters, testId }: { parameters: DerivedParameter[]; testId?: string }) {
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Derived parameters, scrolls sideways on narrow screens">
      <table className="sheet-table" data-testid={testId}>
        <thead>
          <tr>
            <th scope="col">Parameter</th>
            <th scope="col">Conditions</th>
            <th scope="col" className="num">
              Value
            </th>
          </tr>
        </thead>
        <tbody>
          {parameters.map((p, i) => {
            const { label, description } = labelOf(p.name);
            const parts = describeConditions(p.conditions);
            return (
              <tr key={i}>
                <th scope="row" className="font-semibold" title={description}>
                  {label}
                </th>
                <td className="text-[0.875rem] text-ink-muted">
                  {parts.length === 0
                    ? "—"
                    : parts.map((part, j) => (
                        <span key={j} className="mr-2.5 inline-block whitespace-nowrap">
                          {part.label ? `${part.label} ` : ""}
                          <span className="figure text-ink">{part.value}</span>
                          {part.unit ? <span>{part.unit === "°" ? "°" : `\u00a0${part.unit}`}</span> : null}
                        </span>
                      ))}
                </td>
                <td className="num whitespace-nowrap">
                  <ParameterValue p={p} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
