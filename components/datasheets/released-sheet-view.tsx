import Link from "next/link";
import type { ReactNode } from "react";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { formatDate } from "@/lib/format";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
// The table alone: the public page offers no withdrawal, so it ships none of that form's code.
import { RevisionHistoryTable } from "@/components/review/revision-history-table";
import { RevisionStandingBadge } from "@/components/review/review-state";

type ReleasedSheetViewProps = {
  summary: RevisionSummary;
  history: RevisionSummary[];
  organizationName: string;
  partNumber: string;
  /** Reached through ".../current" rather than the revision's letter. */
  addressedAsCurrent: boolean;
  /** The web sheet of the frozen model, drawn on the server. */
  sheetView: ReactNode;
  /** "Follow this part" for a customer, a sign-in line for a visitor (components/subscriptions/follow-button.tsx). */
  follow?: ReactNode;
  /** The design-in calculator (components/datasheets/design-in-calculator.tsx), for a multiplier or a mixer. */
  designIn?: ReactNode;
  /** The revision's data as files (components/datasheets/released-downloads.tsx). */
  downloads?: ReactNode;
};

/**
 * The public page of one released revision: which revision it is and how it stands, the other
 * revisions, the stored PDF, then the sheet itself and the revision history.
 */
export function ReleasedSheetView({ summary, history, organizationName, partNumber, addressedAsCurrent, sheetView, follow, designIn, downloads }: ReleasedSheetViewProps) {
  const current = history.find((r) => r.standing === "current") ?? null;
  return (
    <div data-testid="released-sheet">
      <div className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-rule pb-4 print:hidden">
        <div>
          <p className="running-head mb-1">{organizationName} · released datasheet</p>
          <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-[1.0625rem]">
            <span className="figure font-semibold">
              {partNumber} Rev. {summary.letter}
            </span>
            <RevisionStandingBadge standing={summary.standing} />
            <span className="text-[0.9375rem] text-ink-muted">
              released <span className="figure">{formatDate(summary.releasedAt)}</span>
              {addressedAsCurrent ? " · the current revision" : null}
            </span>
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <a href={`${summary.pdfPath}?download=1`} className={buttonClass.primary} data-testid="download-pdf">
            Download PDF
          </a>
          <a href={summary.pdfPath} className="text-[0.9375rem]">
            Open PDF
          </a>
        </div>
      </div>

      <nav aria-label="Revisions" className="mb-6 text-[0.9375rem] print:hidden" data-testid="revision-picker">
        <span className="running-head mr-3 !text-ink">Revisions</span>
        <ul className="inline-flex flex-wrap gap-x-4 gap-y-1">
          {history.map((r) => (
            <li key={r.id}>
              {r.letter === summary.letter ? (
                <span aria-current="page" className="figure font-semibold">
                  Rev. {r.letter}
                </span>
              ) : (
                <Link href={r.publicPath} className="figure">
                  Rev. {r.letter}
                </Link>
              )}{" "}
              <span className="text-[0.8125rem] text-ink-muted">({r.standing})</span>
            </li>
          ))}
        </ul>
      </nav>

      {follow ? <div className="mb-6 print:hidden">{follow}</div> : null}

      {downloads}

      {summary.standing === "superseded" && current ? (
        <div className="mb-6 max-w-prose print:hidden" data-testid="superseded-notice">
          <Notice>
            Rev. {summary.letter} is superseded. The current revision is <Link href={current.publicPath}>Rev. {current.letter}</Link>.
          </Notice>
        </div>
      ) : null}

      {designIn}

      <div className="border border-rule bg-paper-bright" data-testid="released-web-sheet">
        {sheetView}
      </div>

      <div className="mt-12 print:hidden">
        <RevisionHistoryTable revisions={history} shownLetter={summary.letter} emptyText="No revision has been released." />
      </div>
    </div>
  );
}
