import "server-only";
import { db } from "@/models";
import { serverConfig } from "../config";
import { createOneTimeToken } from "../crypto";
import { passwordResetMail, passwordResetNoAccountMail } from "../mail/messages";
import { sendMail } from "../mail/send-mail";
import { takeAccountMailAllowance } from "./account-mail-limit";

export const passwordResetLifetimeMs = 60 * 60 * 1000;

/**
 * Sends a reset link when the account exists and is active, and otherwise a mail saying there
 * is no active account with the address. The caller's answer is the same either way, and both
 * paths send one mail, so neither the answer nor its timing tells whether the account exists.
 */
export async function requestPasswordReset(email: string, clientAddress: string): Promise<void> {
  const { PasswordReset, User } = db();
  await takeAccountMailAllowance("password-reset", email, clientAddress);
  const user = await User.findOne({ where: { email } });
  if (!user || user.disabledAt) {
    await sendMail(passwordResetNoAccountMail({ to: email, signUpLink: `${serverConfig.appUrl}/sign-up` }));
    return;
  }
  const { token, tokenHash } = createOneTimeToken();
  const expiresAt = new Date(Date.now() + passwordResetLifetimeMs);
  const reset = await PasswordReset.create({ userId: user.id, tokenHash, expiresAt });
  try {
    await sendMail(passwordResetMail({ to: user.email, link: `${serverConfig.appUrl}/password-reset/${token}`, expiresAt }));
  } catch (error) {
    await reset.destroy();
    throw error;
  }
}
