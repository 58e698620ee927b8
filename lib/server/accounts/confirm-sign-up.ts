import "server-only";
import { randomBytes } from "node:crypto";
import { Op, UniqueConstraintError } from "sequelize";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { hashToken } from "../crypto";

const alreadyThere = () =>
  new AppError("conflict", "This address has a Benchfold account already. Sign in, or reset the password if it is forgotten.");

/**
 * The mailed sign-up link was followed: the customer organization (named after their company,
 * so they never land inside a vendor's or a lab's organization) and the account are made. Only
 * the holder of the link, who reads the address's mail, learns whether the address was taken.
 */
export async function confirmSignUp(token: string): Promise<{ email: string }> {
  const { Organization, SignUpRequest, User, sequelize } = db();
  try {
    return await sequelize.transaction(async (transaction) => {
      const request = await SignUpRequest.findOne({
        where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
        lock: transaction.LOCK.UPDATE,
        transaction,
      });
      if (!request) throw new AppError("not-found", "This confirmation link is unknown, used or expired. Sign up again for a new one.");
      if (await User.findOne({ where: { email: request.email }, attributes: ["id"], transaction })) throw alreadyThere();
      const base = request.company.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "customer";
      const organization = await Organization.create(
        { slug: `${base}-${randomBytes(3).toString("hex")}`, name: request.company, kind: "customer" },
        { transaction },
      );
      const user = await User.create(
        { organizationId: organization.id, email: request.email, name: request.name, role: "customer", passwordHash: request.passwordHash },
        { transaction },
      );
      await request.update({ usedAt: new Date() }, { transaction });
      await recordAuditEvent(
        { organizationId: organization.id, actorUserId: user.id, action: "account.sign-up", subjectType: "user", subjectId: user.id, after: { email: user.email, role: "customer" } },
        transaction,
      );
      return { email: user.email };
    });
  } catch (error) {
    // Two links for one address followed at once: the unique e-mail index decides.
    if (error instanceof UniqueConstraintError) throw alreadyThere();
    throw error;
  }
}
