"use client";

import { signIn } from "next-auth/react";
import { acceptInvitationBodySchema, type AcceptInvitationBody } from "@/lib/schemas/accounts";
import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { checkInput, useJsonForm } from "@/components/use-json-form";
import { PasswordFields, readPasswordPair } from "./password-fields";

export function AcceptInvitationForm({ token, email }: { token: string; email: string }) {
  const { errors, formError, pending, submit } = useJsonForm<AcceptInvitationBody>({
    url: "/api/invitations/accept",
    check: (form) => {
      const { password, confirmError } = readPasswordPair(form);
      return checkInput(acceptInvitationBodySchema, { token, name: form.get("name"), password }, { confirm: confirmError });
    },
    onSuccess: async (_, body) => {
      const result = await signIn("credentials", { email, password: body.password, redirect: false });
      window.location.assign("/sign-in" + (result?.ok ? "" : "?welcome=1"));
    },
    keepPendingOnSuccess: true,
  });

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
