import { confirmSignUpBodySchema } from "@/lib/schemas/accounts";
import { confirmSignUp } from "@/lib/server/accounts/confirm-sign-up";
import { route } from "@/lib/server/auth/guard";

export const POST = route({ resource: "account", body: confirmSignUpBodySchema }, async ({ body }) =>
  Response.json(await confirmSignUp(body.token), { status: 201 }),
);
