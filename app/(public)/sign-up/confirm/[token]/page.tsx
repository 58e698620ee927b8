import type { Metadata } from "next";
import { AuthFrame } from "@/components/auth/auth-frame";
import { ConfirmSignUpForm } from "@/components/auth/confirm-sign-up-form";

export const metadata: Metadata = { title: "Confirm your account", referrer: "no-referrer" };

export default async function ConfirmSignUpPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <AuthFrame runningHead="Account" title="Confirm your account" lead="The address is yours: create the customer account you asked for.">
      <ConfirmSignUpForm token={token} />
    </AuthFrame>
  );
}
