"use client";

import { useState } from "react";
import { requestPasswordResetBodySchema } from "@/lib/schemas/accounts";
import { messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";

export function RequestResetForm() {
  const [error, setError] = useState<string | undefined>();
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const parsed = requestPasswordResetBodySchema.safeParse({ email: new FormData(event.currentTarget).get("email") });
    setError(parsed.success ? undefined : parsed.error.issues[0]?.message);
    if (!parsed.success) return;
    setPending(true);
    try {
      await requestJson("/api/password-resets", { method: "POST", body: parsed.data });
      setSentTo(parsed.data.email);
    } catch (e) {
      setFormError(messageOf(e));
    } finally {
      setPending(false);
    }
  }

  if (sentTo) {
    return (
      <Notice tone="success">
        If an account uses <strong>{sentTo}</strong>, a link to choose a new password is on its way. It works once, for a limited time.
      </Notice>
    );
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid="request-reset-form">
      <Field label="E-mail address" name="email" type="email" autoComplete="email" error={error} required />
      <div aria-live="assertive" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Sending…" : "Send the link"}
      </button>
    </form>
  );
}
