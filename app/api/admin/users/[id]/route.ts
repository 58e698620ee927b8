import { updateUserBodySchema } from "@/lib/schemas/accounts";
import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { updateOrganizationUser } from "@/lib/server/users/update-organization-user";

export const PATCH = route({ resource: "people", body: updateUserBodySchema }, async ({ user, body, params }) => {
  const userId = readIdParam(params.id, "person");
  return { user: await updateOrganizationUser({ actor: user, userId, changes: body }) };
});
