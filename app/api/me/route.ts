import { route } from "@/lib/server/auth/guard";
import { permissionsOf } from "@/lib/domain/permissions";

export const GET = route({ access: "signed-in" }, async ({ user }) => ({ user, permissions: permissionsOf(user.role) }));
