import Link from "next/link";
import { navigationFor, type Role } from "@/lib/domain/permissions";
import { Logo } from "./logo";
import { NavLinks } from "./nav-links";
import { roleLabels } from "@/lib/domain/accounts";
import { SignOutButton } from "./auth/sign-out-button";

/** Who is signed in (the layout reads the session), or null. */
export type HeaderUser = { name: string; role: Role; organizationName: string } | null;

export function SiteHeader({ user }: { user: HeaderUser }) {
  const items = navigationFor(user?.role ?? null).map(({ href, label }) => ({ href, label }));

  return (
    <header data-site className="border-b border-rule">
      <div className="mx-auto flex w-full max-w-page flex-wrap items-center justify-between gap-x-8 gap-y-3 px-5 pt-4 sm:px-8">
        <Link href="/" className="no-underline" aria-label="Benchfold, home">
          <Logo />
        </Link>
        {user ? (
          <div className="flex items-center gap-5" data-testid="session-identity">
            <div className="text-left leading-tight sm:text-right">
              <p className="font-semibold" data-testid="session-name">
                {user.name}
              </p>
              <p className="text-sm text-ink-muted">
                <span data-testid="session-role">{roleLabels[user.role]}</span>
                <span aria-hidden="true"> · </span>
                <span className="sr-only">, </span>
                <span data-testid="session-organization">{user.organizationName}</span>
              </p>
            </div>
            <SignOutButton />
          </div>
        ) : (
          <div className="flex items-center gap-5 text-[0.9375rem]">
            <Link href="/sign-up" className="no-underline hover:underline">
              Customer account
            </Link>
            <Link
              href="/sign-in"
              className="rounded border border-ink px-3 py-1.5 font-semibold no-underline hover:border-signal hover:text-signal"
            >
              Sign in
            </Link>
          </div>
        )}
      </div>
      <nav aria-label="Main" className="mx-auto mt-3 w-full max-w-page px-5 sm:px-8">
        <NavLinks items={items} />
      </nav>
    </header>
  );
}
