import { signUpBodySchema } from "@/lib/schemas/accounts";
import { signUpCustomer } from "@/lib/server/accounts/sign-up-customer";
import { route } from "@/lib/server/auth/guard";
import { clientAddress } from "@/lib/server/auth/rate-limit";

// Always 202 with the same body: the answer never tells whether the address has an account.
export const POST = route({ resource: "account", body: signUpBodySchema }, async ({ body, request }) => {
  await signUpCustomer(body, clientAddress(request.headers));
  return Response.json({ ok: true }, { status: 202 });
});
