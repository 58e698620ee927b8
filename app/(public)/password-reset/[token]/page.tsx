import type { Metadata } from "next";
import { AuthFrame } from "@/components/auth/auth-frame";
import { CompleteResetForm } from "@/components/auth/complete-reset-form";

export const metadata: Metadata = { title: "New password", referrer: "no-referrer" };

export default async function CompletePasswordResetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <AuthFrame runningHead="Account" title="Set a new password" lead="Setting it signs you out everywhere else.">
      <CompleteResetForm token={token} />
    </AuthFrame>
  );
}
