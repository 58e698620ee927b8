"use client";

import { useState } from "react";
import { signUpBodySchema, type SignUpBody } from "@/lib/schemas/accounts";
import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { checkInput, useJsonForm } from "@/components/use-json-form";
import { PasswordFields, readPasswordPair } from "./password-fields";

export function SignUpForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { errors, formError, pending, submit } = useJsonForm<SignUpBody>({
    url: "/api/accounts",
    check: (form) => {
      const { password, confirmError } = readPasswordPair(form);
      return checkInput(
        signUpBodySchema,
        { name: form.get("name"), email: form.get("email"), company: form.get("company"), password },
        { confirm: confirmError },
      );
    },
    // The same answer whether or not the address has an account: the mail says which it is.
    onSuccess: (_, body) => setSentTo(body.email),
  });

  if (sentTo) {
    return (
      <Notice tone="success">
        A message is on its way to <strong>{sentTo}</strong>. Follow its link to confirm the address and finish; it works once, within 24 hours.
      </Notice>
    );
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid="sign-up-form">
      <Field label="Your name" name="name" autoComplete="name" error={errors.name} required />
      <Field label="Work e-mail address" name="email" type="email" autoComplete="email" error={errors.email} required />
      <Field label="Company or institution" name="company" autoComplete="organization" error={errors.company} required />
      <PasswordFields errors={errors} />
      <div aria-live="assertive" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Creating account…" : "Create customer account"}
      </button>
    </form>
  );
}
