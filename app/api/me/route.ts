import { route } from "@/lib/server/auth/guard";
import { permissionsOf } from "@/lib/server/auth/permissions";

export const GET = route({ access: "signed-in" }, async ({ user }) => ({ user, permissions: permissionsOf(user.role) }));
