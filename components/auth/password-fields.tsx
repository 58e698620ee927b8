"use client";

import { useDeferredValue, useState } from "react";
import { Field } from "@/components/ui/field";
import { judgePassword, maxPasswordBytes, minPasswordLength, passwordBytes } from "@/lib/schemas/password";

const baseHint = `At least ${minPasswordLength} characters; common and easily guessed passwords are refused. A short sentence of uncommon words works well.`;

/** What the strength estimator says while the password is typed; the server checks the same rule again. */
function strengthHint(password: string): string {
  if (password.length < minPasswordLength) return baseHint;
  if (passwordBytes(password) > maxPasswordBytes) return `Too long: at most ${maxPasswordBytes} bytes (${maxPasswordBytes} plain letters, fewer accented ones).`;
  const verdict = judgePassword(password);
  return verdict.ok ? `Strong enough (estimated strength ${verdict.score} of 4).` : `${verdict.message} (estimated strength ${verdict.score} of 4)`;
}

/** New password twice; the length and strength rules come from the shared schema (lib/schemas/password.ts). */
export function PasswordFields({ errors }: { errors: { password?: string; confirm?: string } }) {
  const [password, setPassword] = useState("");
  const typed = useDeferredValue(password);
  return (
    <>
      <Field
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint={strengthHint(typed)}
        error={errors.password}
        value={password}
        onChange={setPassword}
        required
      />
      <Field label="Repeat the password" name="confirm" type="password" autoComplete="new-password" error={errors.confirm} required />
    </>
  );
}

export function readPasswordPair(form: FormData): { password: string; confirmError?: string } {
  const password = String(form.get("password") ?? "");
  const confirm = String(form.get("confirm") ?? "");
  return { password, confirmError: password === confirm ? undefined : "The two passwords differ." };
}
