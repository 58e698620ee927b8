"use client";

import { useState } from "react";
import { inviteUserBodySchema, type InviteUserBody } from "@/lib/schemas/accounts";
import type { Role } from "@/lib/domain/permissions";
import { roleLabels } from "@/lib/domain/accounts";
import { buttonClass } from "@/components/ui/button";
import { Field, selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { checkInput, useJsonForm } from "@/components/use-json-form";

export function InviteForm({ onInvited }: { onInvited: () => void }) {
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<Role>("engineer");
  const [sent, setSent] = useState<string | null>(null);
  const { errors, formError, pending, submit } = useJsonForm<InviteUserBody>({
    url: "/api/admin/invitations",
    check: () => checkInput(inviteUserBodySchema, { email, role }),
    onSuccess: (_, body) => {
      setSent(`Invitation sent to ${body.email} as ${roleLabels[body.role].toLowerCase()}.`);
      setEmail("");
      onInvited();
    },
  });

  return (
    <form
      onSubmit={(event) => {
        setSent(null);
        void submit(event);
      }}
      noValidate
      className="space-y-5"
      data-testid="invite-form"
    >
      <Field label="E-mail address" name="email" type="email" autoComplete="off" value={email} onChange={setEmail} error={errors.email} required />
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
        {formError ? <Notice tone="error">{formError}</Notice> : sent ? <Notice tone="success">{sent}</Notice> : null}
      </div>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Sending…" : "Send invitation"}
      </button>
    </form>
  );
}
