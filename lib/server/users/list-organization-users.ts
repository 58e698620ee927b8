import "server-only";
import { db } from "@/models";
import type { User } from "@/models";

export type UserSummary = { id: number; name: string; email: string; role: User["role"]; disabled: boolean; lastSignInAt: string | null };

export async function listOrganizationUsers(organizationId: number): Promise<UserSummary[]> {
  const { User } = db();
  const users = await User.findAll({ where: { organizationId }, order: [["name", "ASC"]] });
  return users.map((u) => ({
    id: u.id,
    name: u.name,
    email: u.email,
    role: u.role,
    disabled: Boolean(u.disabledAt),
    lastSignInAt: u.lastSignInAt ? u.lastSignInAt.toISOString() : null,
  }));
}
