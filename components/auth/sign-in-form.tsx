"use client";

import Link from "next/link";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";

const errorMessages: Record<string, string> = {
  "invalid-credentials": "That e-mail and password do not match an active account.",
  "too-many-attempts": "Too many sign-in attempts. Wait a few minutes, then try again.",
};

function signInErrorMessage(code: string | null | undefined): string | null {
  if (!code) return null;
  return errorMessages[code] ?? "Sign-in did not work. Try again.";
}

/** After signing in we land on `next`, or on /sign-in itself, which forwards to the role's first page. */
export function SignInForm({ next, initialErrorCode }: { next: string | null; initialErrorCode: string | null }) {
  const [error, setError] = useState<string | null>(signInErrorMessage(initialErrorCode));
  const [pending, setPending] = useState(false);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setError(null);
    const result = await signIn("credentials", {
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      redirect: false,
    });
    if (!result || result.error || !result.ok) {
      setError(signInErrorMessage(result?.error ?? "unknown"));
      setPending(false);
      return;
    }
    // A full load, so the server-rendered header picks up the new session.
    window.location.assign(next ?? "/sign-in");
  }

  return (
    <form onSubmit={submit} className="space-y-5" data-testid="sign-in-form">
      <Field label="E-mail address" name="email" type="email" autoComplete="username" required />
      <Field label="Password" name="password" type="password" autoComplete="current-password" required />
      <div aria-live="assertive" className="empty:hidden">
        {error ? <Notice tone="error">{error}</Notice> : null}
      </div>
      <div className="flex flex-wrap items-center gap-x-6 gap-y-3">
        <button type="submit" disabled={pending} className={buttonClass.primary}>
          {pending ? "Signing in…" : "Sign in"}
        </button>
        <Link href="/password-reset" className="text-[0.9375rem]">
          Forgotten your password?
        </Link>
      </div>
    </form>
  );
}
