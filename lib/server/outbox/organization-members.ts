import "server-only";
import { Op, type Transaction } from "sequelize";
import type { Role } from "@/lib/domain/permissions";
import { db } from "@/models";

/**
 * The e-mail addresses of an organization's active (not disabled) members holding one of the
 * roles, in address order: the recipients of a notice such as "a candidate awaits review".
 * Read in the event's transaction, so the list matches the state the event committed.
 */
export async function organizationMembers(organizationId: number, roles: readonly Role[], transaction: Transaction): Promise<string[]> {
  if (roles.length === 0) return [];
  const { User } = db();
  const users = await User.findAll({
    attributes: ["email"],
    where: { organizationId, role: { [Op.in]: [...roles] }, disabledAt: null },
    order: [["email", "ASC"]],
    transaction,
  });
  return users.map((user) => user.email);
}
