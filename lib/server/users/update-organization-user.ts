import "server-only";
import { Op } from "sequelize";
import { AppError } from "@/lib/errors";
import type { UpdateUserBody } from "@/lib/schemas/accounts";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import type { UserSummary } from "./list-organization-users";
import { lockOwnRow } from "../auth/own-row";

/**
 * Changes a colleague's role or disables/enables the account. Disabling bumps the
 * token version, so every session of that user ends on its next request.
 */
export async function updateOrganizationUser(opts: { actor: SessionUser; userId: number; changes: UpdateUserBody }): Promise<UserSummary> {
  const { User, sequelize } = db();
  const { actor, userId, changes } = opts;
  authorize(actor, "people");
  return sequelize.transaction(async (transaction) => {
    const user = await lockOwnRow(User, userId, actor, transaction, "person");
    if (user.id === actor.id) throw new AppError("conflict", "You cannot change your own role or disable yourself.");
    if (changes.role === "customer" && user.role !== "customer") {
      throw new AppError("invalid", "Customers sign up themselves; a member cannot become a customer.", { field: "role" });
    }
    const before = { role: user.role, disabled: Boolean(user.disabledAt) };
    const losingAdmin = user.role === "admin" && (changes.role && changes.role !== "admin" || changes.disabled === true);
    if (losingAdmin) {
      const otherAdmins = await User.count({
        where: { organizationId: actor.organizationId, role: "admin", disabledAt: null, id: { [Op.ne]: user.id } },
        transaction,
      });
      if (otherAdmins === 0) throw new AppError("conflict", "The organization must keep at least one active admin.");
    }
    if (changes.role) user.role = changes.role;
    if (changes.disabled === true && !user.disabledAt) {
      user.disabledAt = new Date();
      user.tokenVersion = user.tokenVersion + 1;
    }
    if (changes.disabled === false) user.disabledAt = null;
    await user.save({ transaction });
    const after = { role: user.role, disabled: Boolean(user.disabledAt) };
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: "user.update", subjectType: "user", subjectId: user.id, before, after },
      transaction,
    );
    return {
      id: user.id,
      name: user.name,
      email: user.email,
      role: user.role,
      disabled: Boolean(user.disabledAt),
      lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
    };
  });
}
