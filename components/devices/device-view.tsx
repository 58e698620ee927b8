import Link from "next/link";
import type { DeviceSummary } from "@/lib/domain/devices";
import type { InstrumentSummary } from "@/lib/domain/instruments";
import type { MeasurementSetSummary } from "@/lib/domain/measurements";
import type { CandidateSummary, RevisionSummary } from "@/lib/domain/reviews";
import { RevisionHistory } from "@/components/review/revision-history";
import { ReviewStateBadge, sheetReviewStanding } from "@/components/review/review-state";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { MeasurementSetsTable } from "@/components/measurements/measurement-sets-table";
import { UploadPanel } from "@/components/measurements/upload-panel";
import { DeviceForm } from "./device-form";
import { DeviceKeyConditions } from "./device-key-conditions";
import { ConformitySection } from "./conformity-section";
import type { ConformityWatchView } from "@/lib/domain/conformity";

type DeviceViewProps = {
  device: DeviceSummary;
  organizationName: string;
  sets: MeasurementSetSummary[];
  /** The device's released sheet revisions, newest first. */
  revisions: RevisionSummary[];
  /** The sheet workspace, for a role that opens drafts. */
  sheetHref: string | null;
  /** The sheet's review (findDeviceReview), for a role that reads candidates. */
  review: { open: CandidateSummary | null; latest: CandidateSummary | null } | null;
  /** The viewer may withdraw a released revision. */
  canWithdraw: boolean;
  /** Present when the viewer may upload. */
  upload: { instruments: InstrumentSummary[] } | null;
  /** The viewer may change the device's number, class, title and key conditions. */
  canEdit: boolean;
  /** The conformity watch since the current release, for a role that reads it (engineers, reviewers). */
  conformity?: { watch: ConformityWatchView; canClose: boolean } | null;
};

export function DeviceView({ device, organizationName, sets, revisions, sheetHref, review, canWithdraw, upload, canEdit, conformity }: DeviceViewProps) {
  const supersedable = sets
    .filter((s) => !s.supersededById)
    .map((s) => ({ id: s.id, kind: s.kind, fileName: s.fileName, serial: s.conditions.serial }));
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-3 text-sm text-ink-muted">
        <Link href="/devices">Devices</Link> <span aria-hidden="true">/</span> <span className="figure">{device.partNumber}</span>
      </nav>
      <PageHeader runningHead={organizationName} title={device.partNumber} lead={<p>{device.title}</p>} />
      <div className="-mt-4 mb-10 space-y-4">
        <DeviceKeyConditions device={device} />
        {device.description ? <p className="max-w-prose text-[0.9375rem] text-ink-muted">{device.description}</p> : null}
        {canEdit ? (
          <details className="max-w-3xl border-t border-rule pt-3" data-testid="edit-device">
            <summary className="cursor-pointer text-[0.9375rem] font-semibold">Edit device</summary>
            <div className="pt-4">
              <DeviceForm device={device} />
            </div>
          </details>
        ) : null}
      </div>

      <section aria-labelledby="sets-title" className="mb-12">
        <h2 id="sets-title" className="mb-4 text-xl font-semibold">
          Measurement sets
        </h2>
        {sets.length === 0 ? (
          <EmptyState title="No measurements yet" testId="no-measurement-sets">
            <p>
              {upload
                ? "Upload the bench files below: each becomes a measurement set with its conditions, derived parameters and curves, waiting for a reviewer."
                : "An engineer uploads the bench files here; each becomes a measurement set that a reviewer approves or rejects."}
            </p>
          </EmptyState>
        ) : (
          <MeasurementSetsTable deviceId={device.id} sets={sets} />
        )}
      </section>

      <div className="mb-12">
        <RevisionHistory
          revisions={revisions}
          canWithdraw={canWithdraw}
          emptyText="No revision of this device's sheet has been released yet. Each release appears here, newest first, with its signers, notes and PDF."
        />
        {sheetHref ? (
          <p className="mt-3 flex flex-wrap items-center gap-x-3 gap-y-1 text-[0.9375rem]" data-testid="device-sheet-state">
            {review ? <SheetStateLine review={review} /> : null}
            <Link href={sheetHref}>Sheet draft, review and release</Link>
          </p>
        ) : null}
      </div>

      {conformity ? <ConformitySection watch={conformity.watch} canClose={conformity.canClose} /> : null}

      {upload ? <UploadPanel deviceId={device.id} deviceClass={device.deviceClass} instruments={upload.instruments} supersedable={supersedable} /> : null}
    </>
  );
}

function SheetStateLine({ review }: { review: { open: CandidateSummary | null; latest: CandidateSummary | null } }) {
  const { state, candidate } = sheetReviewStanding(review);
  return (
    <>
      <span className="running-head !text-ink">Sheet</span>
      <ReviewStateBadge state={state} />
      {candidate ? <Link href={`/review/sheets/${candidate.id}`}>Candidate #{candidate.id}</Link> : null}
    </>
  );
}
