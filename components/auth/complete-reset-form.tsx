"use client";

import Link from "next/link";
import { useState } from "react";
import { resetPasswordBodySchema } from "@/lib/schemas/accounts";
import { ApiError, messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { PasswordFields, readPasswordPair } from "./password-fields";
import { fieldErrorsOf, fieldErrorsOfApi } from "./zod-errors";

export function CompleteResetForm({ token }: { token: string }) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const [pending, setPending] = useState(false);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const { password, confirmError } = readPasswordPair(new FormData(event.currentTarget));
    const parsed = resetPasswordBodySchema.safeParse({ token, password });
    const nextErrors = parsed.success ? {} : fieldErrorsOf(parsed.error);
    if (confirmError) nextErrors.confirm = confirmError;
    setErrors(nextErrors);
    if (!parsed.success || confirmError) return;
    setPending(true);
    try {
      await requestJson("/api/password-resets/complete", { method: "POST", body: parsed.data });
      setDone(true);
    } catch (error) {
      if (error instanceof ApiError) {
        setErrors(fieldErrorsOfApi(error));
        setFormError(error.status === 404 ? "This link is unknown, used or expired. Ask for a new one." : error.message);
      } else {
        setFormError(messageOf(error));
      }
    } finally {
      setPending(false);
    }
  }

  if (done) {
    return (
      <Notice tone="success">
        Your password is changed, and any other sessions of yours have ended. <Link href="/sign-in">Sign in</Link> with the new one.
      </Notice>
    );
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid="complete-reset-form">
      <PasswordFields errors={errors} />
      <div aria-live="assertive" className="empty:hidden">
        {formError ? (
          <Notice tone="error">
            {formError} {formError.includes("new one") ? <Link href="/password-reset">Request a new link</Link> : null}
          </Notice>
        ) : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Saving…" : "Set the new password"}
      </button>
    </form>
  );
}
