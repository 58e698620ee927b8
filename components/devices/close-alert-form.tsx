"use client";

import { useRouter } from "next/navigation";
import { useId } from "react";
import { closeConformityAlertBodySchema, type CloseConformityAlertBody } from "@/lib/schemas/reviews";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { checkInput, useJsonForm } from "@/components/use-json-form";

/** Closes an open conformity alert with a reason ("new lot, limit revision planned"); audited on the server. */
export function CloseAlertForm({ alertId }: { alertId: number }) {
  const router = useRouter();
  const id = useId();
  const { errors, formError, pending, submit } = useJsonForm<CloseConformityAlertBody, { alert: { id: number } }>({
    url: `/api/conformity-alerts/${alertId}/close`,
    check: (form) => checkInput(closeConformityAlertBodySchema, { reason: String(form.get("reason") ?? "") }),
    onSuccess: () => router.refresh(),
  });
  return (
    <details className="mt-2" data-testid={`close-alert-${alertId}`}>
      <summary className="cursor-pointer text-[0.8125rem] text-ink-muted">Close with a reason…</summary>
      <form onSubmit={(e) => void submit(e)} noValidate className="mt-2 max-w-[28rem] space-y-2">
        <label htmlFor={`${id}-reason`} className="block text-[0.8125rem] font-semibold">
          Why alert #{alertId} may be closed
        </label>
        <textarea
          id={`${id}-reason`}
          name="reason"
          rows={3}
          required
          minLength={10}
          maxLength={2000}
          placeholder="New lot, limit revision planned"
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
          {pending ? "Closing…" : `Close alert #${alertId}`}
        </button>
        <div aria-live="polite" className="empty:hidden">
          {formError ? <Notice tone="error">{formError}</Notice> : null}
        </div>
      </form>
    </details>
  );
}
