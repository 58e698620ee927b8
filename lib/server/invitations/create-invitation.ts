import "server-only";
import { Op } from "sequelize";
import { AppError } from "@/lib/errors";
import type { InviteUserBody } from "@/lib/schemas/accounts";
import { Invitation, User, getSequelize } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import type { SessionUser } from "../auth/session-user";
import { serverConfig } from "../config";
import { createOneTimeToken } from "../crypto";
import { invitationMail } from "../mail/messages";
import { sendMail } from "../mail/send-mail";

export const invitationLifetimeMs = 7 * 24 * 60 * 60 * 1000;

/**
 * Invites a colleague into the admin's organization and e-mails the link. The row and the
 * audit event commit only when the mail was handed to the SMTP server.
 */
export async function createInvitation(opts: { actor: SessionUser; input: InviteUserBody }): Promise<{ id: number; email: string; role: string; expiresAt: string }> {
  const { actor, input } = opts;
  if (input.role === "customer") {
    throw new AppError("invalid", "Customers sign up themselves; invite admins, engineers or reviewers.", { field: "role" });
  }
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    if (await User.findOne({ where: { email: input.email }, transaction })) {
      throw new AppError("conflict", `${input.email} already has a Benchfold account.`, { field: "email" });
    }
    const pending = await Invitation.findOne({
      where: { organizationId: actor.organizationId, email: input.email, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction,
    });
    if (pending) throw new AppError("conflict", `${input.email} has a pending invitation already.`, { field: "email" });
    const { token, tokenHash } = createOneTimeToken();
    const expiresAt = new Date(Date.now() + invitationLifetimeMs);
    const invitation = await Invitation.create(
      { organizationId: actor.organizationId, invitedById: actor.id, email: input.email, role: input.role, tokenHash, expiresAt },
      { transaction },
    );
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: "invitation.create", subjectType: "invitation", subjectId: invitation.id, after: { email: input.email, role: input.role } },
      transaction,
    );
    const link = `${serverConfig.appUrl}/invitations/${token}`;
    try {
      await sendMail(invitationMail({ to: input.email, organizationName: actor.organizationName, inviterName: actor.name, role: input.role, link, expiresAt }));
    } catch (error) {
      console.error("[benchfold] invitation mail failed", error);
      throw new AppError("unavailable", "The invitation e-mail could not be sent; nothing was saved. Try again later.");
    }
    return { id: invitation.id, email: invitation.email, role: invitation.role, expiresAt: expiresAt.toISOString() };
  });
}
