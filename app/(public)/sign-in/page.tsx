import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { getSessionUser } from "@/lib/server/auth/session";
import { navigationFor } from "@/lib/domain/permissions";
import { AuthFrame } from "@/components/auth/auth-frame";
import { safeNextPath } from "@/components/auth/safe-next";
import { SignInForm } from "@/components/auth/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function SignInPage({ searchParams }: Props) {
  const params = await searchParams;
  const next = safeNextPath(params.next);
  const user = await getSessionUser();
  // Signed in already: go where the person was headed, or to the first page of their role.
  if (user) redirect(next ?? navigationFor(user.role)[0]?.href ?? "/");
  const error = typeof params.error === "string" ? params.error : null;
  return (
    <AuthFrame
      runningHead="Account"
      title="Sign in"
      lead="Engineers, reviewers and administrators of a vendor or test lab, and customers following released parts."
      aside={
        <>
          <p>
            Designing a part in? <Link href="/sign-up">Create a customer account</Link> to follow parts and hear when their sheets change.
          </p>
          <p className="mt-4">
            Joining a vendor or lab? Your administrator sends you an invitation by e-mail; its link sets up your account.
          </p>
        </>
      }
    >
      <SignInForm next={next} initialErrorCode={error} />
    </AuthFrame>
  );
}
