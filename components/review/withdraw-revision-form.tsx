"use client";

import { useRouter } from "next/navigation";
import { useId } from "react";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { withdrawBodySchema, type WithdrawBody } from "@/lib/schemas/reviews";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { ReasonField } from "@/components/ui/reason-field";
import { checkInput, useJsonForm } from "@/components/use-json-form";

/** Withdraws a released revision with a reason; it stays readable and downloadable with a withdrawn notice. */
export function WithdrawRevisionForm({ revisionId, letter }: { revisionId: number; letter: string }) {
  const router = useRouter();
  const id = useId();
  const { errors, formError, pending, submit } = useJsonForm<WithdrawBody, { revision: RevisionSummary }>({
    url: `/api/sheet-revisions/${revisionId}/withdraw`,
    check: (form) => checkInput(withdrawBodySchema, { reason: String(form.get("reason") ?? "") }),
    onSuccess: () => router.refresh(),
  });
  return (
    <details className="mt-2" data-testid="withdraw-revision">
      <summary className="cursor-pointer text-[0.8125rem] text-ink-muted">Withdraw…</summary>
      <form onSubmit={(e) => void submit(e)} noValidate className="mt-2 w-[18rem] space-y-2">
        <ReasonField id={id} label={`Why Rev. ${letter} is withdrawn`} error={errors.reason} />
        <button type="submit" disabled={pending} className={buttonClass.secondary}>
          {pending ? "Withdrawing…" : `Withdraw Rev. ${letter}`}
        </button>
        <div aria-live="polite" className="empty:hidden">
          {formError ? <Notice tone="error">{formError}</Notice> : null}
        </div>
      </form>
    </details>
  );
}
