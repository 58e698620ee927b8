import Link from "next/link";
import { isRole } from "@/lib/domain/permissions";
import { formatDateTime } from "@/lib/format";
import { roleLabels } from "@/lib/domain/accounts";
import { AcceptInvitationForm } from "./accept-invitation-form";
import { AuthFrame } from "./auth-frame";

type Invitation = { email: string; role: string; organizationName: string; expiresAt: string };

export function InvitationView({ token, invitation }: { token: string; invitation: Invitation }) {
  const role = isRole(invitation.role) ? roleLabels[invitation.role] : invitation.role;
  return (
    <AuthFrame
      runningHead="Invitation"
      title={`Join ${invitation.organizationName}`}
      lead="Choose the name your colleagues will see and a password. The account is ready as soon as you submit."
      aside={
        <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2" data-testid="invitation-details">
          <dt className="running-head pt-0.5">Organization</dt>
          <dd className="text-ink">{invitation.organizationName}</dd>
          <dt className="running-head pt-0.5">E-mail</dt>
          <dd className="text-ink">{invitation.email}</dd>
          <dt className="running-head pt-0.5">Role</dt>
          <dd className="text-ink">{role}</dd>
          <dt className="running-head pt-0.5">Link expires</dt>
          <dd className="figure text-ink">{formatDateTime(invitation.expiresAt)}</dd>
        </dl>
      }
    >
      <AcceptInvitationForm token={token} email={invitation.email} />
    </AuthFrame>
  );
}

export function InvitationUnavailableView() {
  return (
    <AuthFrame
      runningHead="Invitation"
      title="This invitation cannot be used"
      lead="The link is unknown, has been used already, or has expired. For your safety we do not say which."
    >
      <p>
        Ask the administrator who invited you to send a new invitation. If you already accepted it, <Link href="/sign-in">sign in</Link>.
      </p>
    </AuthFrame>
  );
}
