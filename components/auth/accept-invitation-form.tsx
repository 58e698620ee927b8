"use client";

import { signIn } from "next-auth/react";
import { useState } from "react";
import { acceptInvitationBodySchema } from "@/lib/schemas/accounts";
import { ApiError, messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PasswordFields, readPasswordPair } from "./password-fields";
import { fieldErrorsOf, fieldErrorsOfApi } from "./zod-errors";

export function AcceptInvitationForm({ token, email }: { token: string; email: string }) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const form = new FormData(event.currentTarget);
    const { password, confirmError } = readPasswordPair(form);
    const parsed = acceptInvitationBodySchema.safeParse({ token, name: form.get("name"), password });
    const nextErrors = parsed.success ? {} : fieldErrorsOf(parsed.error);
    if (confirmError) nextErrors.confirm = confirmError;
    setErrors(nextErrors);
    if (!parsed.success || confirmError) return;

    setPending(true);
    try {
      await requestJson("/api/invitations/accept", { method: "POST", body: parsed.data });
      const result = await signIn("credentials", { email, password, redirect: false });
      window.location.assign("/sign-in" + (result?.ok ? "" : "?welcome=1"));
    } catch (error) {
      if (error instanceof ApiError) setErrors(fieldErrorsOfApi(error));
      setFormError(messageOf(error));
      setPending(false);
    }
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid="accept-invitation-form">
      <Field label="E-mail address" name="email-shown" type="email" value={email} readOnly hint="The address the invitation was sent to." />
      <Field label="Your name" name="name" autoComplete="name" error={errors.name} required />
      <PasswordFields errors={errors} />
      <div aria-live="assertive" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Joining…" : "Join the organization"}
      </button>
    </form>
  );
}
