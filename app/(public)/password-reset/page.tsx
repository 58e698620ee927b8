import type { Metadata } from "next";
import Link from "next/link";
import { AuthFrame } from "@/components/auth/auth-frame";
import { RequestResetForm } from "@/components/auth/request-reset-form";

export const metadata: Metadata = { title: "New password" };

export default function PasswordResetPage() {
  return (
    <AuthFrame
      runningHead="Account"
      title="Choose a new password"
      lead="Give the address you sign in with. We send a link to it; the link works once and expires."
      aside={
        <p>
          Remembered it? <Link href="/sign-in">Sign in</Link>.
        </p>
      }
    >
      <RequestResetForm />
    </AuthFrame>
  );
}
