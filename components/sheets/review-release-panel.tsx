"use client";

import Link from "next/link";
import { useState } from "react";
import type { CandidateSummary, RevisionSummary } from "@/lib/domain/reviews";
import { formatDateTime } from "@/lib/format";
import { Notice } from "@/components/ui/notice";
import { RevisionHistory } from "@/components/review/revision-history";
import { ReviewStateBadge, sheetReviewStanding, type SheetReviewState } from "@/components/review/review-state";
import { ReleaseForm } from "./release-form";
import { SubmitSheetForm } from "./submit-sheet-form";

export type ReviewReleasePanelProps = {
  deviceId: number;
  /** The device's open candidate, and its latest one when none is open (findDeviceReview). */
  review: { open: CandidateSummary | null; latest: CandidateSummary | null };
  revisions: RevisionSummary[];
  /** The draft's open issues as the workspace shows them: each needs a reason before submission. */
  issues: { code: string; message: string }[];
  /** The viewer may submit and release (the "sheet-release" resource). */
  canRelease: boolean;
  /** The viewer may withdraw a released revision (the "revision-withdrawal" resource). */
  canWithdraw: boolean;
};

/**
 * The sheet's way out of the workspace: its state in review, the submission form (every open issue
 * acknowledged with a reason), the release of an approved candidate, and the revisions released so far.
 */
export function ReviewReleasePanel({ deviceId, review, revisions, issues, canRelease, canWithdraw }: ReviewReleasePanelProps) {
  const { state, candidate } = sheetReviewStanding(review);
  const current = revisions.find((r) => r.standing === "current") ?? null;
  // What this visit did, kept here so it stays on screen while the page reloads its data.
  const [done, setDone] = useState<{ submitted: number } | { released: RevisionSummary } | null>(null);
  const onSubmitted = (candidateId: number) => setDone({ submitted: candidateId });
  const onReleased = (revision: RevisionSummary) => setDone({ released: revision });
  return (
    <section aria-labelledby="review-release-title" className="mb-10 border-t border-rule pt-6 print:hidden" data-testid="review-release-panel">
      <h2 id="review-release-title" className="mb-3 text-xl font-semibold">
        Review and release
      </h2>
      {done ? (
        <div className="mb-4 max-w-[60rem]" data-testid="review-action-done">
          {"released" in done ? (
            <Notice tone="success">
              Released as <strong className="figure">Rev. {done.released.letter}</strong>. <Link href={done.released.publicPath}>Its public page</Link> ·{" "}
              <a href={done.released.pdfPath}>PDF</a>
            </Notice>
          ) : (
            <Notice tone="success">
              Submitted as candidate #{done.submitted}. <Link href={`/review/sheets/${done.submitted}`}>Open its review page</Link>
            </Notice>
          )}
        </div>
      ) : null}
      <div className="mb-5 max-w-[60rem] space-y-2" data-testid="review-standing">
        <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <span className="running-head !text-ink">State</span>
          <ReviewStateBadge state={state} />
          <StateSentence state={state} candidate={candidate} current={current?.letter ?? null} />
        </p>
        {state === "changes-requested" && candidate?.changeRequest ? (
          <blockquote className="border-l-2 border-signal pl-4 text-[0.9375rem]" data-testid="change-request">
            <span className="running-head mr-2 !text-signal-deep">Changes requested</span>
            {candidate.changeRequest}
          </blockquote>
        ) : null}
        {state === "stale" && candidate?.staleReason ? (
          <blockquote className="border-l-2 border-signal pl-4 text-[0.9375rem]" data-testid="stale-reason">
            <span className="running-head mr-2 !text-signal-deep">Why</span>
            {candidate.staleReason}
          </blockquote>
        ) : null}
        {candidate ? (
          <p className="text-[0.9375rem]">
            <Link href={`/review/sheets/${candidate.id}`} data-testid="open-review">
              Review page of candidate #{candidate.id}
            </Link>{" "}
            <span className="text-ink-muted">
              · submitted by {candidate.submittedBy.name}, <span className="figure">{formatDateTime(candidate.submittedAt)}</span> · signatures{" "}
              <span className="figure">
                {candidate.signatureCount} of {candidate.requiredSignatures}
              </span>
            </span>
          </p>
        ) : null}
      </div>

      {canRelease && state === "approved" && candidate ? <ReleaseForm candidateId={candidate.id} nextAfter={current?.letter ?? null} onReleased={onReleased} /> : null}

      {canRelease && state !== "approved" ? (
        // Keyed by the state: after a submission the form starts closed and empty again.
        <details key={`${state}-${candidate?.id ?? "none"}`} className="mb-6 max-w-[60rem] border-t border-rule pt-3" data-testid="submit-disclosure">
          <summary className="cursor-pointer text-[0.9375rem] font-semibold">{state === "in-review" ? "Submit the sheet again…" : "Submit for review…"}</summary>
          <div className="pt-3">
            {state === "in-review" ? (
              <p className="mb-3 text-[0.9375rem] text-ink-muted">
                Only when the sheet changed since it was submitted: the candidate in review is then closed as out of date and the review starts over.
              </p>
            ) : null}
            <SubmitSheetForm deviceId={deviceId} issues={issues} onSubmitted={onSubmitted} />
          </div>
        </details>
      ) : null}

      <div className="mt-8">
        <RevisionHistory revisions={revisions} headingLevel="h3" canWithdraw={canWithdraw} emptyText="No revision of this sheet has been released yet. Released revisions appear here, newest first, each with its signers, notes and PDF." />
      </div>
    </section>
  );
}

function StateSentence({ state, candidate, current }: { state: SheetReviewState; candidate: CandidateSummary | null; current: string | null }) {
  const since = current ? `Rev. ${current} is the current release.` : "Nothing has been released yet.";
  const text: Record<SheetReviewState, string> = {
    draft: `Not submitted for review. ${since}`,
    "in-review": `Candidate #${candidate?.id} waits for a reviewer${candidate?.comparedRevision ? `, compared with Rev. ${candidate.comparedRevision}` : ", as a first release"}.`,
    "changes-requested": "The reviewer asked for changes: fix the sheet and submit it again.",
    approved: "Signed and approved: release it to give it its revision letter.",
    released: since,
    stale: "The sheet changed after it was submitted; submit it again to start a new review.",
  };
  return <span className="text-[0.9375rem]">{text[state]}</span>;
}
