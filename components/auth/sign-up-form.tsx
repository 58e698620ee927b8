"use client";

import { signIn } from "next-auth/react";
import { useState } from "react";
import { signUpBodySchema } from "@/lib/schemas/accounts";
import { ApiError, messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PasswordFields, readPasswordPair } from "./password-fields";
import { fieldErrorsOf, fieldErrorsOfApi } from "./zod-errors";

export function SignUpForm() {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const form = new FormData(event.currentTarget);
    const { password, confirmError } = readPasswordPair(form);
    const parsed = signUpBodySchema.safeParse({
      name: form.get("name"),
      email: form.get("email"),
      company: form.get("company"),
      password,
    });
    const nextErrors = parsed.success ? {} : fieldErrorsOf(parsed.error);
    if (confirmError) nextErrors.confirm = confirmError;
    setErrors(nextErrors);
    if (!parsed.success || confirmError) return;

    setPending(true);
    try {
      await requestJson("/api/accounts", { method: "POST", body: parsed.data });
      const result = await signIn("credentials", { email: parsed.data.email, password, redirect: false });
      window.location.assign(result?.ok ? "/catalog" : "/sign-in");
    } catch (error) {
      if (error instanceof ApiError) setErrors(fieldErrorsOfApi(error));
      setFormError(messageOf(error));
      setPending(false);
    }
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
