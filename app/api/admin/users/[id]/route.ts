import { AppError } from "@/lib/errors";
import { updateUserBodySchema } from "@/lib/schemas/accounts";
import { route } from "@/lib/server/auth/guard";
import { updateOrganizationUser } from "@/lib/server/users/update-organization-user";

export const PATCH = route({ access: "user:manage", body: updateUserBodySchema }, async ({ user, body, params }) => {
  const userId = Number(params.id);
  if (!Number.isInteger(userId) || userId <= 0) throw new AppError("not-found", "No such person in your organization.");
  return { user: await updateOrganizationUser({ actor: user, userId, changes: body }) };
});
