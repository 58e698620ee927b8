import { inviteUserBodySchema } from "@/lib/schemas/accounts";
import { route } from "@/lib/server/auth/guard";
import { createInvitation } from "@/lib/server/invitations/create-invitation";
import { listPendingInvitations } from "@/lib/server/invitations/list-pending-invitations";

export const GET = route({ resource: "people" }, async ({ user }) => ({ invitations: await listPendingInvitations(user.organizationId) }));

export const POST = route({ resource: "people", body: inviteUserBodySchema }, async ({ user, body }) =>
  Response.json({ invitation: await createInvitation({ actor: user, input: body }) }, { status: 201 }),
);
