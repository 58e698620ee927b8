"use client";

import { useState } from "react";

/**
 * A plain form posting to /api/auth/sign-out: it works from the moment the page is drawn,
 * before React has hydrated it (a script-driven button clicked too early did nothing), and
 * the full page load that follows draws the header from the server, signed out.
 */
export function SignOutButton() {
  const [pending, setPending] = useState(false);
  return (
    <form method="post" action="/api/auth/sign-out" onSubmit={() => setPending(true)}>
      <button
        type="submit"
        disabled={pending}
        className="rounded border border-rule-strong px-3 py-1.5 text-[0.9375rem] hover:border-ink disabled:opacity-60"
      >
        {pending ? "Signing out…" : "Sign out"}
      </button>
    </form>
  );
}
