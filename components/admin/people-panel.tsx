"use client";

import { useState } from "react";
import type { Role } from "@/lib/domain/permissions";
import { messageOf, requestJson } from "@/components/api-client";
import { formatDate, formatDateTime } from "@/lib/format";
import { roleLabels } from "@/lib/domain/accounts";
import { useJsonResource } from "@/components/use-json-resource";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { InviteForm } from "./invite-form";

export type PersonRow = { id: number; name: string; email: string; role: Role; disabled: boolean; lastSignInAt: string | null };
export type InvitationRow = { id: number; email: string; role: string; expiresAt: string; invitedBy: string };

const roleOptions = Object.entries(roleLabels) as [Role, string][];

type PeoplePanelProps = { currentUserId: number; initialUsers: PersonRow[]; initialInvitations: InvitationRow[] };

export function PeoplePanel({ currentUserId, initialUsers, initialInvitations }: PeoplePanelProps) {
  const users = useJsonResource("/api/admin/users", initialUsers, (body: { users: PersonRow[] }) => body.users);
  const invitations = useJsonResource(
    "/api/admin/invitations",
    initialInvitations,
    (body: { invitations: InvitationRow[] }) => body.invitations,
  );
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);

  async function updateUser(user: PersonRow, change: { role?: Role; disabled?: boolean }) {
    setMessage(null);
    try {
      await requestJson(`/api/admin/users/${user.id}`, { method: "PATCH", body: change });
      const what =
        change.role !== undefined ? `${user.name} is now ${roleLabels[change.role].toLowerCase()}.` : change.disabled ? `${user.name} can no longer sign in.` : `${user.name} can sign in again.`;
      setMessage({ tone: "success", text: what });
    } catch (error) {
      setMessage({ tone: "error", text: messageOf(error) });
    }
    await users.reload();
  }

  return (
    <div className="space-y-14">
      <section aria-labelledby="people-title">
        <h2 id="people-title" className="mb-4 text-xl font-semibold">
          Members
        </h2>
        <div aria-live="polite" className="mb-4 empty:hidden">
          {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
          {users.loadError ? <Notice tone="error">{users.loadError}</Notice> : null}
        </div>
        <div className="overflow-x-auto">
          <table className="sheet-table" data-testid="people-table">
            <thead>
              <tr>
                <th scope="col">Name</th>
                <th scope="col">E-mail</th>
                <th scope="col">Role</th>
                <th scope="col">Status</th>
                <th scope="col" className="num">
                  Last sign-in
                </th>
                <th scope="col">
                  <span className="sr-only">Access</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {users.data.map((user) => (
                <PersonRowView key={user.id} user={user} isSelf={user.id === currentUserId} onUpdate={updateUser} />
              ))}
            </tbody>
          </table>
        </div>
      </section>

      <section aria-labelledby="invitations-title">
        <h2 id="invitations-title" className="mb-1 text-xl font-semibold">
          Pending invitations
        </h2>
        <p className="mb-4 text-ink-muted">An invitation link works once and expires; accepting it creates the account in this organization.</p>
        {invitations.loadError ? <Notice tone="error">{invitations.loadError}</Notice> : null}
        {invitations.data.length === 0 ? (
          <p className="border-y border-rule py-4 text-ink-muted" data-testid="no-invitations">
            No invitations are waiting.
          </p>
        ) : (
          <div className="overflow-x-auto">
            <table className="sheet-table" data-testid="invitations-table">
              <thead>
                <tr>
                  <th scope="col">E-mail</th>
                  <th scope="col">Role</th>
                  <th scope="col">Invited by</th>
                  <th scope="col" className="num">
                    Expires
                  </th>
                </tr>
              </thead>
              <tbody>
                {invitations.data.map((invitation) => (
                  <tr key={invitation.id}>
                    <td>{invitation.email}</td>
                    <td>{roleLabels[invitation.role as Role] ?? invitation.role}</td>
                    <td>{invitation.invitedBy || "—"}</td>
                    <td className="num">
                      <span className="figure">{formatDateTime(invitation.expiresAt)}</span>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      <section aria-labelledby="invite-title" className="max-w-xl">
        <h2 id="invite-title" className="mb-1 text-xl font-semibold">
          Invite someone
        </h2>
        <p className="mb-5 text-ink-muted">They receive an e-mail with a link to choose their name and password.</p>
        <InviteForm onInvited={() => void invitations.reload()} />
      </section>
    </div>
  );
}

type PersonRowViewProps = { user: PersonRow; isSelf: boolean; onUpdate: (user: PersonRow, change: { role?: Role; disabled?: boolean }) => Promise<void> };

function PersonRowView({ user, isSelf, onUpdate }: PersonRowViewProps) {
  const [role, setRole] = useState<Role>(user.role);
  const [pending, setPending] = useState(false);
  const selectId = `role-${user.id}`;

  async function run(change: { role?: Role; disabled?: boolean }) {
    setPending(true);
    await onUpdate(user, change);
    setPending(false);
  }

  return (
    <tr data-testid={`person-${user.email}`}>
      <th scope="row" className="font-semibold">
        {user.name}
        {isSelf ? <span className="ml-1.5 font-normal text-ink-muted">(you)</span> : null}
      </th>
      <td>{user.email}</td>
      <td>
        {isSelf ? (
          roleLabels[user.role]
        ) : (
          <form
            className="flex items-center gap-2"
            onSubmit={(event) => {
              event.preventDefault();
              void run({ role });
            }}
          >
            <label htmlFor={selectId} className="sr-only">
              Role of {user.name}
            </label>
            <select
              id={selectId}
              value={role}
              onChange={(event) => setRole(event.target.value as Role)}
              disabled={pending}
              className="rounded border border-rule-strong bg-paper-bright px-2 py-1 text-[0.9375rem]"
            >
              {roleOptions.map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </select>
            {role !== user.role ? (
              <button type="submit" disabled={pending} className={buttonClass.quiet}>
                Apply
              </button>
            ) : null}
          </form>
        )}
      </td>
      <td>{user.disabled ? <span className="font-semibold text-signal-deep">Disabled</span> : "Active"}</td>
      <td className="num">
        {user.lastSignInAt ? <span className="figure">{formatDate(user.lastSignInAt)}</span> : <span className="text-ink-muted">never</span>}
      </td>
      <td className="num">
        {isSelf ? null : (
          <button type="button" disabled={pending} onClick={() => void run({ disabled: !user.disabled })} className={buttonClass.quiet}>
            {user.disabled ? "Enable" : "Disable"}
            <span className="sr-only"> {user.name}</span>
          </button>
        )}
      </td>
    </tr>
  );
}

