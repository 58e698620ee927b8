import { requestPasswordResetBodySchema } from "@/lib/schemas/accounts";
import { requestPasswordReset } from "@/lib/server/accounts/request-password-reset";
import { route } from "@/lib/server/auth/guard";

// Always 202: the answer never tells whether an account exists.
export const POST = route({ resource: "account", body: requestPasswordResetBodySchema }, async ({ body }) => {
  await requestPasswordReset(body.email);
  return Response.json({ ok: true }, { status: 202 });
});
