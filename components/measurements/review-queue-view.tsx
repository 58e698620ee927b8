import type { MeasurementSetSummary } from "@/lib/domain/measurements";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { kindLabel } from "@/lib/domain/measurements";
import { ScrollTable } from "@/components/ui/scroll-table";
import { SetFileCell, SetLink, SetUploadedCell } from "./set-cells";

type ReviewQueueViewProps = { organizationName: string; sets: MeasurementSetSummary[] };

/** The reviewer's queue: submitted measurement sets, oldest first, never their own uploads. */
export function ReviewQueueView({ organizationName, sets }: ReviewQueueViewProps) {
  return (
    <>
      <PageHeader
        runningHead={organizationName}
        title="Review queue"
        lead="Measurement sets waiting for a second engineer's decision, oldest first. Open a set to see its conditions, derived figures and curves, then approve it or reject it with a reason."
      />
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
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </ScrollTable>
        )}
      </section>
      <div className="max-w-prose">
        <Notice>Datasheet reviews, with the difference from the last release and an electronic signature, arrive with the sheets feature; only measurement sets are reviewed here for now.</Notice>
      </div>
    </>
  );
}
