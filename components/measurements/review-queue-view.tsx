import type { MeasurementSetSummary } from "@/lib/domain/measurements";
import type { CandidateSummary } from "@/lib/domain/reviews";
import { SheetReviewQueue } from "@/components/review/sheet-review-queue";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { kindLabel } from "@/lib/domain/measurements";
import { ScrollTable } from "@/components/ui/scroll-table";
import { SetFileCell, SetLink, SetUploadedCell } from "./set-cells";
import { isPlausibilityWarning } from "@/lib/ingest/plausibility-warning";

type ReviewQueueViewProps = {
  organizationName: string;
  sets: MeasurementSetSummary[];
  /** Sheet candidates waiting for the viewer, or null for a role that does not review sheets. */
  sheets: CandidateSummary[] | null;
};

/** The reviewer's queue: sheets submitted for review and measurement sets, oldest first, never their own. */
export function ReviewQueueView({ organizationName, sets, sheets }: ReviewQueueViewProps) {
  return (
    <>
      <PageHeader
        runningHead={organizationName}
        title="Review queue"
        lead="Sheets and measurement sets waiting for a second person's decision, oldest first. Open a sheet to read it as it will print beside what changed since its last release; open a set to see its conditions, derived figures and curves."
      />
      {sheets ? <SheetReviewQueue candidates={sheets} /> : null}
      <section aria-labelledby="pending-sets-title" className="mb-12">
        <h2 id="pending-sets-title" className="mb-4 text-xl font-semibold">
          Measurement sets <span className="figure text-base font-normal text-ink-muted">({sets.length})</span>
        </h2>
        {sets.length === 0 ? (
          <EmptyState title="Nothing to review" testId="review-empty">
            <p>No measurement set is waiting. Sets you uploaded yourself never appear here: another reviewer decides on them.</p>
          </EmptyState>
        ) : (
          <ScrollTable label="Pending measurement sets" testId="review-queue-table">
            <thead>
              <tr>
                <th scope="col">Set</th>
                <th scope="col">Device</th>
                <th scope="col">Kind</th>
                <th scope="col">File</th>
                <th scope="col">Uploaded</th>
                <th scope="col" className="num">
                  Warnings
                </th>
              </tr>
            </thead>
            <tbody>
              {sets.map((set) => {
                return (
                  <tr key={set.id} data-testid={`review-row-${set.id}`}>
                    <th scope="row">
                      <SetLink deviceId={set.deviceId} setId={set.id} />
                    </th>
                    <td className="figure whitespace-nowrap">{set.partNumber}</td>
                    <td className="whitespace-nowrap">{kindLabel(set.kind)}</td>
                    <SetFileCell fileName={set.fileName} maxWidthClass="max-w-[18rem]" />
                    <SetUploadedCell set={set} />
                    <td className="num">
                      <span className={`figure ${set.warnings.length ? "font-semibold text-signal-deep" : "text-ink-muted"}`}>{set.warnings.length}</span>
                      <PlausibilityCount warnings={set.warnings} />
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </ScrollTable>
        )}
      </section>
    </>
  );
}

/** How many of a set's warnings are plausibility warnings: values a passive part should not show, for the reviewer to weigh. */
function PlausibilityCount({ warnings }: { warnings: string[] }) {
  const count = warnings.filter(isPlausibilityWarning).length;
  if (count === 0) return null;
  return (
    <span className="block whitespace-nowrap text-[0.8125rem] text-signal-deep" data-testid="plausibility-count">
      <span className="figure">{count}</span> plausibility
    </span>
  );
}
