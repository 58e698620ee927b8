import Link from "next/link";
import type { CandidateSummary } from "@/lib/domain/reviews";
import { formatDateTime } from "@/lib/format";
import { EmptyState } from "@/components/ui/empty-state";
import { ScrollTable } from "@/components/ui/scroll-table";

/** The sheet candidates waiting for the viewer's decision, oldest first (never their own, nor one they signed). */
export function SheetReviewQueue({ candidates }: { candidates: CandidateSummary[] }) {
  return (
    <section aria-labelledby="pending-sheets-title" className="mb-12" data-testid="sheet-review-queue">
      <h2 id="pending-sheets-title" className="mb-4 text-xl font-semibold">
        Sheets <span className="figure text-base font-normal text-ink-muted">({candidates.length})</span>
      </h2>
      {candidates.length === 0 ? (
        <EmptyState title="No sheet to review" testId="sheet-review-empty">
          <p>No sheet waits for your decision. Sheets you submitted yourself, or have signed already, never appear here: another reviewer decides on them.</p>
        </EmptyState>
      ) : (
        <ScrollTable label="Sheets waiting for review" testId="sheet-review-table">
          <thead>
            <tr>
              <th scope="col">Candidate</th>
              <th scope="col">Device</th>
              <th scope="col">Compared with</th>
              <th scope="col">Submitted</th>
              <th scope="col" className="num">
                Signatures
              </th>
            </tr>
          </thead>
          <tbody>
            {candidates.map((c) => (
              <tr key={c.id} data-testid={`sheet-review-row-${c.id}`}>
                <th scope="row">
                  <Link href={`/review/sheets/${c.id}`} className="figure font-semibold">
                    #{c.id}
                  </Link>
                </th>
                <td>
                  <span className="figure">{c.partNumber}</span>
                  <span className="block max-w-[22rem] truncate text-[0.875rem] text-ink-muted" title={c.title}>
                    {c.title}
                  </span>
                </td>
                <td className="whitespace-nowrap">{c.comparedRevision ? `Rev. ${c.comparedRevision}` : "Nothing (first release)"}</td>
                <td className="whitespace-nowrap text-[0.875rem]">
                  {c.submittedBy.name}
                  <br />
                  <span className="figure text-ink-muted">{formatDateTime(c.submittedAt)}</span>
                </td>
                <td className="num">
                  <span className="figure">
                    {c.signatureCount} of {c.requiredSignatures}
                  </span>
                </td>
              </tr>
            ))}
          </tbody>
        </ScrollTable>
      )}
    </section>
  );
}
