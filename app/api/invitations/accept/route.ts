import { acceptInvitationBodySchema } from "@/lib/schemas/accounts";
import { route } from "@/lib/server/auth/guard";
import { acceptInvitation } from "@/lib/server/invitations/accept-invitation";

export const POST = route({ resource: "account", body: acceptInvitationBodySchema }, async ({ body }) =>
  Response.json(await acceptInvitation(body), { status: 201 }),
);
