"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import type { CandidateDetail } from "@/lib/domain/reviews";
import type { SubmitCandidateBody } from "@/lib/schemas/reviews";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useJsonForm, type FieldErrors } from "@/components/use-json-form";

const minReason = 10;

/**
 * Submits the draft for review: the sheet is frozen as a candidate as it stands. Each open issue
 * needs a written reason why it may stand (the reviewer reads them); the note is optional.
 */
export function SubmitSheetForm({ deviceId, issues, onSubmitted }: { deviceId: number; issues: { code: string; message: string }[]; onSubmitted: (candidateId: number) => void }) {
  const router = useRouter();
  const id = useId();
  const [reasons, setReasons] = useState<string[]>(() => issues.map(() => ""));
  const [note, setNote] = useState("");
  const { errors, formError, pending, submit } = useJsonForm<SubmitCandidateBody, { candidate: CandidateDetail }>({
    url: `/api/devices/${deviceId}/candidates`,
    check: () => {
      const found: FieldErrors = {};
      issues.forEach((_, i) => {
        if ((reasons[i] ?? "").trim().length < minReason) found[`reason-${i}`] = `Say why this issue may stand (at least ${minReason} characters).`;
      });
      if (Object.keys(found).length) return { errors: found };
      return { body: { acknowledgements: issues.map((issue, i) => ({ issue: issue.message, reason: reasons[i].trim() })), note: note.trim() } };
    },
    onSuccess: ({ candidate }) => {
      onSubmitted(candidate.id);
      router.refresh();
    },
  });

  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="max-w-[60rem] space-y-4" data-testid="submit-sheet-form" aria-label="Submit for review">
      <p className="text-[0.9375rem] text-ink-muted">
        The sheet is frozen exactly as it stands now; a reviewer of your organization who is not you reviews that candidate. If the data, limits or prose
        change afterwards, the candidate goes out of date and the review starts over.
      </p>
      {issues.length === 0 ? (
        <p className="text-[0.9375rem]">The sheet lists no open issues.</p>
      ) : (
        <fieldset className="space-y-4 border-l-2 border-signal pl-4">
          <legend className="mb-2 text-[0.9375rem] font-semibold">
            Acknowledge each open issue <span className="figure font-normal text-ink-muted">({issues.length})</span>
          </legend>
          {issues.map((issue, i) => {
            const error = errors[`reason-${i}`];
            return (
              <div key={`${issue.code}-${i}`} className="space-y-1.5" data-testid="issue-acknowledgement">
                <p id={`${id}-issue-${i}`} className="text-[0.9375rem]">
                  {issue.message}
                </p>
                <label htmlFor={`${id}-reason-${i}`} className="block text-[0.875rem] font-semibold">
                  Why it may stand
                </label>
                <textarea
                  id={`${id}-reason-${i}`}
                  rows={2}
                  value={reasons[i] ?? ""}
                  onChange={(e) => setReasons((prev) => prev.map((r, j) => (j === i ? e.target.value : r)))}
                  required
                  minLength={minReason}
                  aria-invalid={error ? true : undefined}
                  aria-describedby={[`${id}-issue-${i}`, error ? `${id}-reason-${i}-error` : ""].filter(Boolean).join(" ")}
                  className={selectClass}
                />
                {error ? (
                  <p id={`${id}-reason-${i}-error`} className="text-sm text-signal-deep">
                    {error}
                  </p>
                ) : null}
              </div>
            );
          })}
        </fieldset>
      )}
      <div className="space-y-1.5">
        <label htmlFor={`${id}-note`} className="block text-[0.9375rem] font-semibold">
          Note to the reviewer <span className="font-normal text-ink-muted">(optional)</span>
        </label>
        <textarea id={`${id}-note`} rows={2} value={note} onChange={(e) => setNote(e.target.value)} className={selectClass} maxLength={4000} />
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Submitting…" : "Submit for review"}
      </button>
      <div aria-live="polite" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
    </form>
  );
}
