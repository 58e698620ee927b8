"use client";

import { useState } from "react";
import { inviteUserBodySchema } from "@/lib/schemas/accounts";
import type { Role } from "@/lib/server/auth/permissions";
import { ApiError, messageOf, requestJson } from "@/components/api-client";
import { roleLabels } from "@/components/role-label";
import { buttonClass } from "@/components/ui/button";
import { Field, selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";

export function InviteForm({ onInvited }: { onInvited: () => void }) {
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<Role>("engineer");
  const [pending, setPending] = useState(false);
  const [fieldError, setFieldError] = useState<string | undefined>();
  const [result, setResult] = useState<{ tone: "error" | "success"; text: string } | null>(null);

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setResult(null);
    setFieldError(undefined);
    const parsed = inviteUserBodySchema.safeParse({ email, role });
    if (!parsed.success) {
      setFieldError(parsed.error.issues[0]?.message);
      return;
    }
    setPending(true);
    try {
      await requestJson("/api/admin/invitations", { method: "POST", body: parsed.data });
      setResult({ tone: "success", text: `Invitation sent to ${parsed.data.email} as ${roleLabels[role].toLowerCase()}.` });
      setEmail("");
      onInvited();
    } catch (error) {
      if (error instanceof ApiError && error.fieldError("email")) setFieldError(error.fieldError("email"));
      setResult({ tone: "error", text: messageOf(error) });
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-5" data-testid="invite-form">
      <Field label="E-mail address" name="email" type="email" autoComplete="off" value={email} onChange={setEmail} error={fieldError} required />
      <div className="space-y-1.5">
        <label htmlFor="invite-role" className="block text-[0.9375rem] font-semibold">
          Role
        </label>
        <select id="invite-role" value={role} onChange={(e) => setRole(e.target.value as Role)} className={selectClass}>
          {(Object.entries(roleLabels) as [Role, string][]).map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </select>
      </div>
      <div aria-live="polite" className="empty:hidden">
        {result ? <Notice tone={result.tone}>{result.text}</Notice> : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Sending…" : "Send invitation"}
      </button>
    </form>
  );
}
