"use client";

import { useState } from "react";
import { requestPasswordResetBodySchema, type RequestPasswordResetBody } from "@/lib/schemas/accounts";
import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { checkInput, useJsonForm } from "@/components/use-json-form";

export function RequestResetForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { errors, formError, pending, submit } = useJsonForm<RequestPasswordResetBody>({
    url: "/api/password-resets",
    check: (form) => checkInput(requestPasswordResetBodySchema, { email: form.get("email") }),
    onSuccess: (_, body) => setSentTo(body.email),
  });

  if (sentTo) {
    return (
      <Notice tone="success">
        A message is on its way to <strong>{sentTo}</strong>: if an active account uses the address, a link to choose a new password is on its way. It works once, for a limited time.
      </Notice>
    );
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid="request-reset-form">
      <Field label="E-mail address" name="email" type="email" autoComplete="email" error={errors.email} required />
      <div aria-live="assertive" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Sending…" : "Send the link"}
      </button>
    </form>
  );
}
