import "server-only";
import type { SignUpBody } from "@/lib/schemas/accounts";
import { db } from "@/models";
import { serverConfig } from "../config";
import { createOneTimeToken } from "../crypto";
import { signUpConfirmationMail, signUpExistingAccountMail } from "../mail/messages";
import { sendMail } from "../mail/send-mail";
import { hashPassword } from "./hash-password";
import { takeAccountMailAllowance } from "./account-mail-limit";

export const signUpLifetimeMs = 24 * 60 * 60 * 1000;

/**
 * A customer asks for an account. The answer never says whether the address has one: a new
 * address gets a link that creates the account (confirmSignUp), an address with an account gets
 * a notice telling its owner to sign in or reset the password, and nothing else changes. Both
 * paths hash the password and send one mail, so they also take about as long.
 */
export async function signUpCustomer(input: SignUpBody, clientAddress: string): Promise<void> {
  const { SignUpRequest, User } = db();
  await takeAccountMailAllowance("sign-up", input.email, clientAddress);
  const passwordHash = await hashPassword(input.password);
  const existing = await User.findOne({ where: { email: input.email }, attributes: ["id"] });
  if (existing) {
    await sendMail(signUpExistingAccountMail({ to: input.email, signInLink: `${serverConfig.appUrl}/sign-in`, resetLink: `${serverConfig.appUrl}/password-reset` }));
    return;
  }
  const { token, tokenHash } = createOneTimeToken();
  const expiresAt = new Date(Date.now() + signUpLifetimeMs);
  const request = await SignUpRequest.create({ email: input.email, name: input.name, company: input.company, passwordHash, tokenHash, expiresAt });
  try {
    await sendMail(signUpConfirmationMail({ to: input.email, link: `${serverConfig.appUrl}/sign-up/confirm/${token}`, expiresAt }));
  } catch (error) {
    await request.destroy();
    throw error;
  }
}
