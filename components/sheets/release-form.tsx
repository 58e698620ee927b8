"use client";

import { useRouter } from "next/navigation";
import { useId } from "react";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { releaseBodySchema, type ReleaseBody } from "@/lib/schemas/reviews";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { checkInput, useJsonForm } from "@/components/use-json-form";

/**
 * Releases the approved candidate: the server gives it the next revision letter, stores the frozen
 * model and its PDF, and writes the release notes from the changes plus this note.
 */
export function ReleaseForm({ candidateId, nextAfter, onReleased }: { candidateId: number; nextAfter: string | null; onReleased: (revision: RevisionSummary) => void }) {
  const router = useRouter();
  const id = useId();
  const { formError, pending, submit } = useJsonForm<ReleaseBody, { revision: RevisionSummary }>({
    url: `/api/sheet-candidates/${candidateId}/release`,
    check: (form) => checkInput(releaseBodySchema, { note: String(form.get("note") ?? "") }),
    onSuccess: ({ revision }) => {
      onReleased(revision);
      router.refresh();
    },
  });

  return (
    <form onSubmit={(e) => void submit(e)} className="mb-6 max-w-[60rem] space-y-3 border-l-2 border-signal bg-paper-bright px-5 py-4" data-testid="release-form" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="text-lg font-semibold">
        Release
      </h3>
      <p className="text-[0.9375rem] text-ink-muted">
        {nextAfter ? `The release supersedes Rev. ${nextAfter}. ` : "This is the sheet's first release. "}
        The revision letter, the frozen sheet and its PDF never change afterwards; the release notes list what changed, then your note.
      </p>
      <div className="space-y-1.5">
        <label htmlFor={`${id}-note`} className="block text-[0.9375rem] font-semibold">
          Release note <span className="font-normal text-ink-muted">(optional)</span>
        </label>
        <textarea id={`${id}-note`} name="note" rows={2} maxLength={4000} className={selectClass} />
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Releasing…" : "Release the sheet"}
      </button>
      <div aria-live="polite" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
    </form>
  );
}
