"use client";

import Link from "next/link";
import { useState } from "react";
import { resetPasswordBodySchema, type ResetPasswordBody } from "@/lib/schemas/accounts";
import { ApiError, messageOf } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { checkInput, useJsonForm } from "@/components/use-json-form";
import { PasswordFields, readPasswordPair } from "./password-fields";

export function CompleteResetForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const { errors, formError, pending, submit } = useJsonForm<ResetPasswordBody>({
    url: "/api/password-resets/complete",
    check: (form) => {
      const { password, confirmError } = readPasswordPair(form);
      return checkInput(resetPasswordBodySchema, { token, password }, { confirm: confirmError });
    },
    onSuccess: () => setDone(true),
    errorMessage: (error) =>
      error instanceof ApiError && error.status === 404 ? "This link is unknown, used or expired. Ask for a new one." : messageOf(error),
  });

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
