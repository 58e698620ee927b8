"use client";

import { useRouter } from "next/navigation";
import { useId } from "react";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { withdrawBodySchema, type WithdrawBody } from "@/lib/schemas/reviews";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
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
        <label htmlFor={`${id}-reason`} className="block text-[0.8125rem] font-semibold">
          Why Rev. {letter} is withdrawn
        </label>
        <textarea
          id={`${id}-reason`}
          name="reason"
          rows={3}
          required
          minLength={10}
          maxLength={2000}
          aria-invalid={errors.reason ? true : undefined}
          aria-describedby={errors.reason ? `${id}-reason-error` : undefined}
          className={`${selectClass} text-[0.875rem]`}
        />
        {errors.reason ? (
          <p id={`${id}-reason-error`} className="text-sm text-signal-deep">
            {errors.reason}
          </p>
        ) : null}
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
