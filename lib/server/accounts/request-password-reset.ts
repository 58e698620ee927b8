import "server-only";
import { PasswordReset, User, getSequelize } from "@/models";
import { serverConfig } from "../config";
import { createOneTimeToken } from "../crypto";
import { passwordResetMail } from "../mail/messages";
import { sendMail } from "../mail/send-mail";

export const passwordResetLifetimeMs = 60 * 60 * 1000;

/** Sends a reset link when the account exists and is active; says nothing either way to the caller. */
export async function requestPasswordReset(email: string): Promise<void> {
  getSequelize();
  const user = await User.findOne({ where: { email } });
  if (!user || user.disabledAt) return;
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
