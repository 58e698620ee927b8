import { Field } from "@/components/ui/field";

/** New password twice; the length and strength rules come from the shared schema (lib/schemas/password.ts), checked again on the server. */
export function PasswordFields({ errors }: { errors: { password?: string; confirm?: string } }) {
  return (
    <>
      <Field
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters; common and easily guessed passwords are refused. A short sentence of uncommon words works well."
        error={errors.password}
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
