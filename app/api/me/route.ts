import { route } from "@/lib/server/auth/guard";
import { permissionsOf } from "@/lib/domain/permissions";

export const GET = route({ resource: "session" }, async ({ user }) => ({ user, permissions: permissionsOf(user.role) }));
