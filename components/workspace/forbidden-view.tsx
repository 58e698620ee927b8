import Link from "next/link";
import { navigationFor, type Role } from "@/lib/domain/permissions";
import { roleLabels } from "@/lib/domain/accounts";

/** What a signed-in person sees on a page their role does not open (served with HTTP 403). */
export function ForbiddenView({ role }: { role: Role | null }) {
  const home = navigationFor(role)[0];
  return (
    <section aria-labelledby="forbidden-title" className="max-w-prose" data-testid="forbidden">
      <p className="running-head mb-2">
        <span className="figure text-signal-deep">403</span> · Not allowed
      </p>
      <h1 id="forbidden-title" className="text-[2rem] font-semibold leading-tight">
        Your role does not open this page
      </h1>
      {role ? (
        <p className="mt-4 text-[1.0625rem] text-ink-muted">
          {`You are signed in as ${/^[AEIOU]/.test(roleLabels[role]) ? "an" : "a"} ${roleLabels[role].toLowerCase()}.`}{" "}
          {role === "customer"
            ? "Customer accounts see the public catalog and their change notices; workspace pages belong to the vendors and labs that write sheets."
            : "This page belongs to another role in your organization; if you need it, ask your administrator to change your role."}
        </p>
      ) : null}
      {home ? (
        <p className="mt-6">
          <Link href={home.href}>{`Go to ${home.label.toLowerCase()}`}</Link>
        </p>
      ) : null}
    </section>
  );
}
