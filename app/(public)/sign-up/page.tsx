import type { Metadata } from "next";
import Link from "next/link";
import { AuthFrame } from "@/components/auth/auth-frame";
import { SignUpForm } from "@/components/auth/sign-up-form";

export const metadata: Metadata = { title: "Customer account" };

export default function SignUpPage() {
  return (
    <AuthFrame
      runningHead="Account"
      title="Customer account"
      lead="For engineers who design parts in. Released sheets are public; an account lets you follow parts and hear when a new revision is released."
      aside={
        <>
          <p>Vendors and test labs do not sign up here: their administrator invites each person into the organization.</p>
          <p className="mt-4">
            Already have an account? <Link href="/sign-in">Sign in</Link>.
          </p>
        </>
      }
    >
      <SignUpForm />
    </AuthFrame>
  );
}
