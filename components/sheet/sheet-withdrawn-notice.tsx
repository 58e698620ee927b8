import { formatDate } from "@/lib/format/date";

/**
 * A released revision that was withdrawn: the page says so when it shows it. The frozen sheet
 * model never changes, so this comes from the revision's standing, passed in at view time.
 */
export interface SheetWithdrawal {
  /** Why the revision was withdrawn, in the withdrawer's words. */
  reason: string;
  /** ISO date (YYYY-MM-DD) or ISO 8601 time of the withdrawal; printed as its UTC date. */
  withdrawnOn: string;
}

/** A circle struck through: the notice's mark, so the state is told by a word and a shape, not by colour alone. */
function WithdrawnMark() {
  return (
    <svg viewBox="0 0 24 24" width="28" height="28" aria-hidden="true" focusable="false" className="shrink-0">
      <circle cx="12" cy="12" r="9.5" fill="none" stroke="currentColor" strokeWidth="2.5" />
      <line x1="5.3" y1="18.7" x2="18.7" y2="5.3" stroke="currentColor" strokeWidth="2.5" />
    </svg>
  );
}

/** Plain and prominent, above everything else on the sheet, and printed with it. */
export function SheetWithdrawnNotice({ withdrawn, revisionText }: { withdrawn: SheetWithdrawal; revisionText: string }) {
  return (
    <section
      aria-labelledby="sheet-withdrawn"
      className="sheet-withdrawn sheet-keep mb-6 flex gap-3 border-2 border-ink bg-paper-deep px-4 py-3"
      data-testid="sheet-withdrawn"
    >
      <WithdrawnMark />
      <div>
        <h2 id="sheet-withdrawn" className="text-lg font-semibold tracking-[0.08em] uppercase">
          Withdrawn
        </h2>
        <p>
          {revisionText} was withdrawn on{" "}
          <time dateTime={withdrawn.withdrawnOn} className="figure">
            {formatDate(withdrawn.withdrawnOn)}
          </time>
          . Do not design in from it; it stays here as it was released.
        </p>
        <p className="mt-1">
          <span className="font-semibold">Reason:</span> {withdrawn.reason}
        </p>
      </div>
    </section>
  );
}
