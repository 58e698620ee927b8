import "server-only";
import { Op } from "sequelize";
import { AppError } from "@/lib/errors";
import type { InviteUserBody } from "@/lib/schemas/accounts";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { serverConfig } from "../config";
import { createOneTimeToken } from "../crypto";
import { invitationExistingAccountMail, invitationMail } from "../mail/messages";
import { sendMail } from "../mail/send-mail";

export const invitationLifetimeMs = 7 * 24 * 60 * 60 * 1000;

/**
 * Invites a colleague into the admin's organization and e-mails the link. The row and the
 * audit event commit only when the mail was handed to the SMTP server. An address with an
 * account in another organization gets the same answer, row and audit event, but its mail
 * explains that an address holds one account and carries no link.
 */
export async function createInvitation(opts: { actor: SessionUser; input: InviteUserBody }): Promise<{ id: number; email: string; role: string; expiresAt: string }> {
  const { Invitation, User, sequelize } = db();
  const { actor, input } = opts;
  authorize(actor, "people");
  if (input.role === "customer") {
    throw new AppError("invalid", "Customers sign up themselves; invite admins, engineers or reviewers.", { field: "role" });
  }
  return sequelize.transaction(async (transaction) => {
    // Someone of this organization is on the admin's people list anyway; an account elsewhere is
    // not the admin's to learn of: it is invited like a new address and only its owner is told.
    const existing = await User.findOne({ where: { email: input.email }, attributes: ["id", "organizationId"], transaction });
    if (existing && existing.organizationId === actor.organizationId) {
      throw new AppError("conflict", `${input.email} is a member of your organization already.`, { field: "email" });
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
      const about = { to: input.email, organizationName: actor.organizationName, inviterName: actor.name, role: input.role };
      await sendMail(existing ? invitationExistingAccountMail(about) : invitationMail({ ...about, link, expiresAt }));
    } catch (error) {
      console.error("[benchfold] invitation mail failed", error);
      throw new AppError("unavailable", "The invitation e-mail could not be sent; nothing was saved. Try again later.");
    }
    return { id: invitation.id, email: invitation.email, role: invitation.role, expiresAt: expiresAt.toISOString() };
  });
}
