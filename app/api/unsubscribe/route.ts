import { AppError } from "@/lib/errors";
import { unsubscribeBodySchema } from "@/lib/schemas/subscriptions";
import { route } from "@/lib/server/auth/guard";
import { unsubscribeByToken } from "@/lib/server/subscriptions/subscriptions";

/**
 * Stops the notices of one subscription by the signed token of its mail, without signing in:
 * `{ "token": "…" }` as JSON (the unsubscribe page), or `?token=…` with any body (a mail
 * client's one-click POST, RFC 8058, whose body is `List-Unsubscribe=One-Click`). An altered or
 * cut token is a 422; a token used before answers 200 again.
 */
export const POST = route({ resource: "unsubscribe" }, async ({ request }) => {
  const inQuery = new URL(request.url).searchParams.get("token");
  let token: string;
  if (inQuery !== null) {
    token = unsubscribeBodySchema.parse({ token: inQuery }).token;
  } else {
    if (!(request.headers.get("content-type") ?? "").includes("application/json")) throw new AppError("unsupported-media-type", "Send { token } as application/json, or the token in the query.");
    const text = await request.text();
    if (text.length > 4096) throw new AppError("payload-too-large", "Request body over 4096 bytes.");
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch {
      throw new AppError("bad-request", "The body is not valid JSON.");
    }
    token = unsubscribeBodySchema.parse(json).token;
  }
  const result = await unsubscribeByToken(token);
  return { unsubscribed: true, ...result };
});
