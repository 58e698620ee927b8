/**
 * Signs a person in to a running Benchfold the way the sign-in form does (next-auth's CSRF token,
 * then the credentials callback) and returns the session cookie ("name=value") for later requests.
 * Used by the demo loader and the load benchmark.
 */
export async function signInOverHttp(appUrl: string, credentials: { email: string; password: string }): Promise<string> {
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const cookies = csrf.headers.getSetCookie().map((c) => c.split(";")[0]);
  const r = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookies.join("; "), origin: new URL(appUrl).origin },
    body: new URLSearchParams({ csrfToken, email: credentials.email, password: credentials.password, json: "true" }),
  });
  const session = r.headers.getSetCookie().map((c) => c.split(";")[0]).find((c) => c.includes("session-token"));
  if (!session) throw new Error(`sign-in as ${credentials.email} failed (${r.status})`);
  return session;
}
