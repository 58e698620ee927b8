import { signUpBodySchema } from "@/lib/schemas/accounts";
import { signUpCustomer } from "@/lib/server/accounts/sign-up-customer";
import { route } from "@/lib/server/auth/guard";

export const POST = route({ access: "public", body: signUpBodySchema }, async ({ body }) =>
  Response.json(await signUpCustomer(body), { status: 201 }),
);
