import { candidateStateLabels, revisionStandingLabels, type CandidateState, type CandidateSummary, type RevisionStanding } from "@/lib/domain/reviews";
import { revisionStateLabels } from "@/lib/domain/sheets";

/** Where a sheet stands in review: a draft with no open candidate, or its latest candidate's state. */
export type SheetReviewState = "draft" | CandidateState;

/** Where a device's sheet stands, from its open candidate and its latest one (findDeviceReview). */
export function sheetReviewStanding(review: { open: CandidateSummary | null; latest: CandidateSummary | null }): {
  state: SheetReviewState;
  candidate: CandidateSummary | null;
} {
  if (review.open) return { state: review.open.state, candidate: review.open };
  if (review.latest?.state === "stale") return { state: "stale", candidate: review.latest };
  return { state: "draft", candidate: null };
}

const stateMarks: Record<SheetReviewState, string> = {
  draft: "○",
  "in-review": "◐",
  "changes-requested": "↺",
  approved: "✓",
  released: "●",
  stale: "⊘",
};

const stateWords: Record<SheetReviewState, string> = { draft: revisionStateLabels.draft, ...candidateStateLabels };

const badgeClass = "inline-flex items-center gap-1.5 whitespace-nowrap rounded border px-1.5 py-px text-[0.8125rem] font-semibold";

/** A sheet's review state in words with a mark; colour only repeats what the word says. */
export function ReviewStateBadge({ state }: { state: SheetReviewState }) {
  const tone =
    state === "approved" || state === "released"
      ? "border-ink text-ink"
      : state === "changes-requested" || state === "stale"
        ? "border-signal text-signal-deep"
        : "border-rule-strong text-ink-muted";
  return (
    <span className={`${badgeClass} ${tone}`} data-state={state} data-testid="review-state">
      <span aria-hidden="true">{stateMarks[state]}</span>
      {stateWords[state]}
    </span>
  );
}

const standingMarks: Record<RevisionStanding, string> = { current: "●", superseded: "○", withdrawn: "⊘" };

/** A released revision's standing: current, superseded or withdrawn, in words with a mark. */
export function RevisionStandingBadge({ standing }: { standing: RevisionStanding }) {
  const tone = standing === "current" ? "border-ink text-ink" : standing === "withdrawn" ? "border-signal text-signal-deep" : "border-rule-strong text-ink-muted";
  return (
    <span className={`${badgeClass} ${tone}`} data-standing={standing}>
      <span aria-hidden="true">{standingMarks[standing]}</span>
      {revisionStandingLabels[standing]}
    </span>
  );
}
