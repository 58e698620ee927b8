import "server-only";
import { AppError } from "@/lib/errors";
import type { AcceptInvitationBody } from "@/lib/schemas/accounts";
import { db } from "@/models";
import { hashPassword } from "../accounts/hash-password";
import { recordAuditEvent } from "../audit/record-audit-event";
import { findOpenInvitation } from "./find-open-invitation";

export async function acceptInvitation(input: AcceptInvitationBody): Promise<{ userId: number; email: string }> {
  const { User, sequelize } = db();
  const passwordHash = await hashPassword(input.password);
  return sequelize.transaction(async (transaction) => {
    const { invitation } = await findOpenInvitation(input.token, transaction);
    if (await User.findOne({ where: { email: invitation.email }, transaction })) {
      throw new AppError("conflict", `${invitation.email} already has a Benchfold account.`);
    }
    const user = await User.create(
      { organizationId: invitation.organizationId, email: invitation.email, name: input.name, role: invitation.role, passwordHash },
      { transaction },
    );
    invitation.acceptedAt = new Date();
    await invitation.save({ transaction });
    await recordAuditEvent(
      { organizationId: invitation.organizationId, actorUserId: user.id, action: "invitation.accept", subjectType: "user", subjectId: user.id, after: { email: user.email, role: user.role } },
      transaction,
    );
    return { userId: user.id, email: user.email };
  });
}
