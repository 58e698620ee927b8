import { requestPasswordResetBodySchema } from "@/lib/schemas/accounts";
import { requestPasswordReset } from "@/lib/server/accounts/request-password-reset";
import { route } from "@/lib/server/auth/guard";
import { clientAddress } from "@/lib/server/auth/rate-limit";

// Always 202: the answer never tells whether an account exists.
export const POST = route({ resource: "account", body: requestPasswordResetBodySchema }, async ({ body, request }) => {
  await requestPasswordReset(body.email, clientAddress(request.headers));
  return Response.json({ ok: true }, { status: 202 });
});
