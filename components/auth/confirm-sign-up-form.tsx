"use client";

import Link from "next/link";
import { useState } from "react";
import { confirmSignUpBodySchema, type ConfirmSignUpBody } from "@/lib/schemas/accounts";
import { ApiError, messageOf } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { checkInput, useJsonForm } from "@/components/use-json-form";

/** One button: a mail scanner that opens the link does not make the account, only a person does. */
export function ConfirmSignUpForm({ token }: { token: string }) {
  const [email, setEmail] = useState<string | null>(null);
  const { formError, pending, submit } = useJsonForm<ConfirmSignUpBody, { email: string }>({
    url: "/api/accounts/confirm",
    check: () => checkInput(confirmSignUpBodySchema, { token }),
    onSuccess: (result) => setEmail(result.email),
    errorMessage: (error) =>
      error instanceof ApiError && error.status === 404 ? "This link is unknown, used or expired. Sign up again for a new one." : messageOf(error),
  });

  if (email) {
    return (
      <Notice tone="success">
        Your customer account for <strong>{email}</strong> is ready. <Link href="/sign-in">Sign in</Link> with the password you chose.
      </Notice>
    );
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid="confirm-sign-up-form">
      <div aria-live="assertive" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Creating account…" : "Create my account"}
      </button>
    </form>
  );
}
