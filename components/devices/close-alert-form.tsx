"use client";

import { useRouter } from "next/navigation";
import { useId } from "react";
import { closeConformityAlertBodySchema, type CloseConformityAlertBody } from "@/lib/schemas/reviews";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { ReasonField } from "@/components/ui/reason-field";
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
        <ReasonField id={id} label={`Why alert #${alertId} may be closed`} error={errors.reason} placeholder="New lot, limit revision planned" />
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
