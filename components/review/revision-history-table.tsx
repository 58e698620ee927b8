import Link from "next/link";
import type { ReactNode } from "react";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { formatByteSize, formatDate, formatDateTime } from "@/lib/format";
import { ScrollTable } from "@/components/ui/scroll-table";
import { Notation } from "@/components/sheet/notation";
import { RevisionStandingBadge } from "./review-state";

export type RevisionHistoryTableProps = {
  revisions: RevisionSummary[];
  /** The revision the page shows, marked in the table (the public sheet). */
  shownLetter?: string;
  /** What to say when nothing has been released yet. */
  emptyText: string;
  headingLevel?: "h2" | "h3";
  /**
   * The control to withdraw a revision still standing, when the viewer may (RevisionHistory passes the
   * form). A slot rather than an import, so the public sheet page ships no form code (and no zod).
   */
  withdrawControl?: (revision: RevisionSummary) => ReactNode;
};

/**
 * A part's released revisions, newest first: letter, date, signers, standing (a withdrawn one
 * keeps its place, with its reason), notes, and the stored PDF and public page of each.
 */
export function RevisionHistoryTable({ revisions, shownLetter, emptyText, headingLevel = "h2", withdrawControl }: RevisionHistoryTableProps) {
  const Heading = headingLevel;
  return (
    <section aria-labelledby="revision-history-title" data-testid="revision-history">
      <Heading id="revision-history-title" className={headingLevel === "h2" ? "mb-4 text-xl font-semibold" : "mb-3 text-lg font-semibold"}>
        Revision history <span className="figure text-base font-normal text-ink-muted">({revisions.length})</span>
      </Heading>
      {revisions.length === 0 ? (
        <p className="max-w-prose text-ink-muted">{emptyText}</p>
      ) : (
        <ScrollTable label="Released revisions, newest first" testId="revision-history-table">
          <thead>
            <tr>
              <th scope="col">Revision</th>
              <th scope="col">Released</th>
              <th scope="col">Signed by</th>
              <th scope="col">Standing</th>
              <th scope="col">Notes</th>
              <th scope="col">Downloads</th>
            </tr>
          </thead>
          <tbody>
            {revisions.map((r) => (
              <tr key={r.id} data-testid={`revision-${r.letter}`} aria-current={r.letter === shownLetter ? "page" : undefined}>
                <th scope="row" className="whitespace-nowrap">
                  <Link href={r.publicPath} className="figure font-semibold">
                    Rev. {r.letter}
                  </Link>
                  {r.letter === shownLetter ? <span className="block text-[0.8125rem] font-normal text-ink-muted">shown here</span> : null}
                </th>
                <td className="whitespace-nowrap">
                  <span className="figure">{formatDate(r.releasedAt)}</span>
                  <span className="block text-[0.8125rem] text-ink-muted">by {r.releasedBy.name}</span>
                </td>
                <td className="min-w-[12rem]">
                  {r.signers.length === 0 ? (
                    "—"
                  ) : (
                    <ul className="space-y-1">
                      {r.signers.map((s, i) => (
                        <li key={i}>
                          {s.name}, {s.roleWord}
                          <span className="figure block text-[0.8125rem] text-ink-muted">{formatDateTime(s.signedAt)}</span>
                        </li>
                      ))}
                    </ul>
                  )}
                </td>
                <td className="min-w-[10rem]">
                  <RevisionStandingBadge standing={r.standing} />
                  {r.withdrawal ? (
                    <p className="mt-1 max-w-[22rem] text-[0.875rem]" data-testid="withdrawal-reason">
                      {formatDate(r.withdrawal.withdrawnAt)}, {r.withdrawal.by}: {r.withdrawal.reason}
                    </p>
                  ) : (
                    (withdrawControl?.(r) ?? null)
                  )}
                </td>
                <td className="min-w-[16rem] max-w-[28rem] text-[0.875rem]">
                  {r.notes.length === 0 ? (
                    "—"
                  ) : (
                    <ul className="list-disc space-y-0.5 pl-4">
                      {r.notes.map((note, i) => (
                        <li key={i}>
                          <Notation text={note} />
                        </li>
                      ))}
                    </ul>
                  )}
                </td>
                <td className="whitespace-nowrap text-[0.875rem]">
                  <a href={r.pdfPath} data-testid="revision-pdf">
                    PDF
                  </a>{" "}
                  <span className="figure text-ink-muted">({formatByteSize(r.pdfBytes)})</span>
                  <br />
                  <Link href={r.publicPath}>Public page</Link>
                  <span className="figure block text-[0.75rem] text-ink-muted" title={`SHA-256 ${r.pdfSha256}`}>
                    ref. {r.reference}
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

