import "server-only";
import bcrypt from "bcryptjs";
import { randomBytes } from "node:crypto";
import { AppError } from "@/lib/errors";
import type { SignUpBody } from "@/lib/schemas/accounts";
import { Organization, User, getSequelize } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";

/**
 * A customer signs up alone: a customer organization named after their company is made
 * for them, so they never land inside a vendor's or a lab's organization.
 */
export async function signUpCustomer(input: SignUpBody): Promise<{ userId: number; email: string }> {
  const passwordHash = await bcrypt.hash(input.password, 11);
  return getSequelize().transaction(async (transaction) => {
    if (await User.findOne({ where: { email: input.email }, transaction })) {
      throw new AppError("conflict", `${input.email} already has a Benchfold account. Sign in or reset the password.`, { field: "email" });
    }
    const base = input.company.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "customer";
    const organization = await Organization.create(
      { slug: `${base}-${randomBytes(3).toString("hex")}`, name: input.company, kind: "customer" },
      { transaction },
    );
    const user = await User.create(
      { organizationId: organization.id, email: input.email, name: input.name, role: "customer", passwordHash },
      { transaction },
    );
    await recordAuditEvent(
      { organizationId: organization.id, actorUserId: user.id, action: "account.sign-up", subjectType: "user", subjectId: user.id, after: { email: user.email, role: "customer" } },
      transaction,
    );
    return { userId: user.id, email: user.email };
  });
}
