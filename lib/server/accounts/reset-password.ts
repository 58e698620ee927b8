import "server-only";
import { Op } from "sequelize";
import { AppError } from "@/lib/errors";
import type { ResetPasswordBody } from "@/lib/schemas/accounts";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { hashToken } from "../crypto";
import { hashPassword } from "./hash-password";

/** Sets the new password, spends the token and ends every existing session of the user. */
export async function resetPassword(input: ResetPasswordBody): Promise<void> {
  const { PasswordReset, User, sequelize } = db();
  const passwordHash = await hashPassword(input.password);
  await sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({
      where: { tokenHash: hashToken(input.token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!reset) throw new AppError("not-found", "This reset link is unknown, used or expired.");
    const user = await User.findByPk(reset.userId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!user || user.disabledAt) throw new AppError("not-found", "This reset link is unknown, used or expired.");
    await user.update({ passwordHash, tokenVersion: user.tokenVersion + 1 }, { transaction });
    await reset.update({ usedAt: new Date() }, { transaction });
    await recordAuditEvent(
      { organizationId: user.organizationId, actorUserId: user.id, action: "account.password-reset", subjectType: "user", subjectId: user.id },
      transaction,
    );
  });
}
