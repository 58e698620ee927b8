import type { Metadata } from "next";
import { isAppError } from "@/lib/errors";
import { describeInvitation } from "@/lib/server/invitations/find-open-invitation";
import { InvitationView, InvitationUnavailableView } from "@/components/auth/invitation-view";

export const metadata: Metadata = { title: "Invitation", referrer: "no-referrer" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  try {
    const invitation = await describeInvitation(token);
    return <InvitationView token={token} invitation={invitation} />;
  } catch (error) {
    if (isAppError(error) && error.code === "not-found") return <InvitationUnavailableView />;
    throw error;
  }
}
