import "server-only";
import { serverConfig } from "../config";
import { revokeSession } from "./revoke-session";
import { getCurrentSession } from "./session";

/** next-auth's session cookie name (its default: `__Secure-` in front when the app is served over HTTPS). */
function sessionCookieName(): string {
  return `${serverConfig.secureCookies ? "__Secure-" : ""}next-auth.session-token`;
}

/**
 * Signs the request's session out: revokes its id on the server (the cookie is refused from now
 * on, even if a copy of it survives) and answers 303 to the home page with the session cookie,
 * and any chunks of it, cleared. Other sessions of the same person stay signed in.
 */
export async function signOutResponse(request: Request): Promise<Response> {
  const session = await getCurrentSession();
  if (session) await revokeSession({ sessionId: session.sessionId, userId: session.user.id, startedAt: session.startedAt });

  const name = sessionCookieName();
  const secure = serverConfig.secureCookies ? "; Secure" : "";
  const present = (request.headers.get("cookie") ?? "")
    .split(";")
    .map((pair) => pair.split("=")[0].trim())
    .filter((cookie) => cookie === name || cookie.startsWith(`${name}.`));
  const response = new Response(null, { status: 303, headers: { location: "/", "cache-control": "no-store" } });
  for (const cookie of new Set([name, ...present])) {
    response.headers.append("set-cookie", `${cookie}=; Path=/; Max-Age=0; HttpOnly; SameSite=Lax${secure}`);
  }
  return response;
}
