import "server-only";
import { Op, type Transaction } from "sequelize";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import type { Invitation, Organization } from "@/models";
import { hashToken } from "../crypto";

/** The unused, unexpired invitation behind a token, or a 404 that does not say which of the three it was. */
export async function findOpenInvitation(token: string, transaction?: Transaction) {
  const { Invitation, Organization } = db();
  const invitation = await Invitation.findOne({
    where: { tokenHash: hashToken(token), acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [Organization],
    lock: transaction ? transaction.LOCK.UPDATE : undefined,
    transaction,
  });
  if (!invitation) throw new AppError("not-found", "This invitation link is unknown, used or expired.");
  const organization = (invitation as Invitation & { Organization?: Organization }).Organization!;
  return { invitation, organization };
}

export async function describeInvitation(token: string) {
  const { invitation, organization } = await findOpenInvitation(token);
  return { email: invitation.email, role: invitation.role, organizationName: organization.name, expiresAt: invitation.expiresAt.toISOString() };
}
