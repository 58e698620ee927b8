import { resetPasswordBodySchema } from "@/lib/schemas/accounts";
import { resetPassword } from "@/lib/server/accounts/reset-password";
import { route } from "@/lib/server/auth/guard";

export const POST = route({ resource: "account", body: resetPasswordBodySchema }, async ({ body }) => {
  await resetPassword(body);
  return { ok: true };
});
