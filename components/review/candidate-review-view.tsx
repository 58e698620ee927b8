import Link from "next/link";
import type { ReactNode } from "react";
import { signatureMeaningWords, type CandidateDetail, type SignatureMeaning } from "@/lib/domain/reviews";
import { formatDateTime } from "@/lib/format";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import type { CommentAnchorOption } from "./comment-anchors";
import { CommentThreads } from "./comment-threads";
import { DecisionPanel } from "./decision-panel";
import { ReviewStateBadge } from "./review-state";

type CandidateReviewViewProps = {
  candidate: CandidateDetail;
  organizationName: string;
  viewerId: number;
  /** The viewer reviews sheets (the queue is theirs); otherwise the way back is the sheet workspace. */
  isReviewer: boolean;
  anchors: CommentAnchorOption[];
  /** The candidate as it will print: the web sheet of its frozen model, drawn on the server. */
  sheetView: ReactNode;
  /** What changed since the last release. */
  changes: ReactNode;
};

/**
 * One candidate under review: the sheet as it will print beside what changed since the last
 * release, the engineer's note and acknowledged issues, comment threads, signatures so far, and
 * at the foot the decision (for a reviewer who may decide).
 */
export function CandidateReviewView({ candidate, organizationName, viewerId, isReviewer, anchors, sheetView, changes }: CandidateReviewViewProps) {
  const compared = candidate.comparedRevision ? `Rev. ${candidate.comparedRevision}` : null;
  return (
    <div data-testid="candidate-review">
      <nav aria-label="Breadcrumb" className="mb-3 text-sm text-ink-muted">
        {isReviewer ? <Link href="/review">Review queue</Link> : <Link href={`/sheets/${candidate.deviceId}`}>Sheet workspace</Link>} <span aria-hidden="true">/</span>{" "}
        <span className="figure">{candidate.partNumber}</span> <span aria-hidden="true">/</span> candidate <span className="figure">#{candidate.id}</span>
      </nav>
      <PageHeader
        runningHead={`${organizationName} · Sheet review`}
        title={`${candidate.partNumber} — candidate #${candidate.id}`}
        lead={
          <>
            <p>{candidate.title}.</p>
            <p className="mt-2 flex flex-wrap items-center gap-x-3 gap-y-1 text-[0.9375rem]">
              <ReviewStateBadge state={candidate.state} />
              <span>
                Submitted by {candidate.submittedBy.name}, <span className="figure">{formatDateTime(candidate.submittedAt)}</span>;{" "}
                {compared ? `compared with ${compared}` : "a first release, compared against nothing"}; signatures{" "}
                <span className="figure">
                  {candidate.signatureCount} of {candidate.requiredSignatures}
                </span>
                .
              </span>
            </p>
          </>
        }
        actions={
          <Link href={`/sheets/${candidate.deviceId}`} className="text-[0.9375rem]">
            Sheet workspace
          </Link>
        }
      />

      <CandidateStatus candidate={candidate} isReviewer={isReviewer} />
      <EngineerNotes candidate={candidate} />

      <section
        aria-label="The candidate beside its changes and comments"
        className="relative left-1/2 mb-12 w-screen max-w-[120rem] -translate-x-1/2 px-4 sm:px-8"
      >
        {/* Side by side on a wide screen; on a narrower one the changes and comments come first, then the sheet. */}
        <div className="grid gap-8 2xl:grid-cols-[minmax(0,1.15fr)_minmax(0,1fr)]">
          <div className="min-w-0">
            <h2 className="running-head mb-2">As it will print · candidate #{candidate.id}</h2>
            <div className="border border-rule bg-paper-bright" data-testid="candidate-sheet">
              {sheetView}
            </div>
          </div>
          <div className="order-first min-w-0 space-y-12 2xl:order-none">
            <div data-testid="review-changes">{changes}</div>
            <CommentThreads candidateId={candidate.id} comments={candidate.comments} anchors={anchors} viewerId={viewerId} canComment={candidate.can.comment} />
          </div>
        </div>
      </section>

      <Signatures candidate={candidate} />

      {isReviewer ? (
        <section aria-labelledby="decision-title" className="mt-12 border-t-2 border-ink pt-6" data-testid="decision">
          <h2 id="decision-title" className="mb-4 text-xl font-semibold">
            Your decision
          </h2>
          <DecisionPanel
            candidateId={candidate.id}
            canDecide={candidate.can.decide}
            blockedBecause={candidate.decideBlockedBecause}
            digest={candidate.digest}
            signatureCount={candidate.signatureCount}
            requiredSignatures={candidate.requiredSignatures}
          />
        </section>
      ) : null}
    </div>
  );
}

function CandidateStatus({ candidate, isReviewer }: { candidate: CandidateDetail; isReviewer: boolean }) {
  if (candidate.state === "changes-requested" && candidate.changeRequest) {
    return (
      <div className="mb-8 max-w-prose" data-testid="change-request">
        <Notice>
          <strong>Changes requested:</strong> {candidate.changeRequest}
        </Notice>
      </div>
    );
  }
  if (candidate.state === "stale") {
    return (
      <div className="mb-8 max-w-prose" data-testid="stale-reason">
        <Notice tone="error">{candidate.staleReason ?? "The sheet changed after this candidate was submitted."}</Notice>
      </div>
    );
  }
  if (candidate.state === "approved" && !isReviewer) {
    return (
      <div className="mb-8 max-w-prose">
        <Notice tone="success">
          Approved. {candidate.can.release ? <Link href={`/sheets/${candidate.deviceId}`}>Release it from the sheet workspace.</Link> : "An engineer releases it."}
        </Notice>
      </div>
    );
  }
  return null;
}

function EngineerNotes({ candidate }: { candidate: CandidateDetail }) {
  return (
    <section aria-labelledby="engineer-notes-title" className="mb-10 max-w-[60rem]" data-testid="engineer-notes">
      <h2 id="engineer-notes-title" className="mb-3 text-xl font-semibold">
        From the engineer
      </h2>
      {candidate.note ? (
        <blockquote className="mb-4 whitespace-pre-line border-l-2 border-rule-strong pl-4 text-[0.9375rem]" data-testid="engineer-note">
          {candidate.note}
        </blockquote>
      ) : (
        <p className="mb-4 text-[0.9375rem] text-ink-muted">No note.</p>
      )}
      <h3 className="running-head mb-2 !text-ink">
        Open issues acknowledged <span className="figure">({candidate.acknowledgements.length})</span>
      </h3>
      {candidate.acknowledgements.length === 0 ? (
        <p className="text-[0.9375rem] text-ink-muted">The sheet listed no open issues when it was submitted.</p>
      ) : (
        <dl className="space-y-3 border-l-2 border-signal pl-4" data-testid="acknowledgements">
          {candidate.acknowledgements.map((a, i) => (
            <div key={i}>
              <dt className="text-[0.9375rem] font-semibold">{a.message}</dt>
              <dd className="text-[0.9375rem]">
                <span className="text-ink-muted">Why it may stand: </span>
                {a.reason}
              </dd>
            </div>
          ))}
        </dl>
      )}
    </section>
  );
}

function Signatures({ candidate }: { candidate: CandidateDetail }) {
  return (
    <section aria-labelledby="signatures-title" className="max-w-[60rem]" data-testid="signatures">
      <h2 id="signatures-title" className="mb-3 text-xl font-semibold">
        Signatures{" "}
        <span className="figure text-base font-normal text-ink-muted">
          ({candidate.signatures.length} of {candidate.requiredSignatures})
        </span>
      </h2>
      {candidate.signatures.length === 0 ? (
        <p className="text-[0.9375rem] text-ink-muted">Not signed yet.</p>
      ) : (
        <ol className="space-y-3">
          {candidate.signatures.map((s) => (
            <li key={s.id} className="border-l-2 border-ink pl-4 text-[0.9375rem]" data-testid="signature">
              <p>
                <span className="font-semibold">{s.printedName}</span>, {s.roleWord}, {s.organizationName}
              </p>
              <p>
                {signatureMeaningWords[s.meaning as SignatureMeaning] ?? s.meaning} ·{" "}
                <span className="figure">{formatDateTime(s.signedAt)}</span>
              </p>
              <p className="text-[0.75rem] text-ink-muted">
                SHA-256 <span className="figure break-all">{s.candidateDigest}</span>
              </p>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
