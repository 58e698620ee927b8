import { route } from "@/lib/server/auth/guard";
import { listOrganizationUsers } from "@/lib/server/users/list-organization-users";

export const GET = route({ resource: "people" }, async ({ user }) => ({ users: await listOrganizationUsers(user.organizationId) }));
