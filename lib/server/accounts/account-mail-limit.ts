import "server-only";
import { Op } from "sequelize";
import type { AccountMailKind } from "@/lib/domain/accounts";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { serverConfig } from "../config";

/**
 * Counts a sign-up or reset mail asked for, and refuses (429) once the recipient or the client
 * address has asked for its share of the window. The count is of requests, whether or not the
 * address has an account, so the refusal tells nothing about accounts either. Old rows (and
 * expired sign-up requests) are pruned on the way.
 */
export async function takeAccountMailAllowance(kind: AccountMailKind, email: string, ipAddress: string): Promise<void> {
  const { AccountMailRequest, SignUpRequest } = db();
  const { windowMs, perRecipient, perAddress } = serverConfig.accountMailLimit;
  const now = Date.now();
  const since = new Date(now - windowMs);
  await Promise.all([
    AccountMailRequest.destroy({ where: { createdAt: { [Op.lt]: new Date(now - 24 * windowMs) } } }),
    SignUpRequest.destroy({ where: { expiresAt: { [Op.lt]: new Date(now - 24 * 60 * 60 * 1000) } } }),
  ]);
  const [toRecipient, fromAddress] = await Promise.all([
    AccountMailRequest.count({ where: { email, createdAt: { [Op.gte]: since } } }),
    AccountMailRequest.count({ where: { ipAddress, createdAt: { [Op.gte]: since } } }),
  ]);
  if (toRecipient >= perRecipient || fromAddress >= perAddress) {
    throw new AppError("rate-limited", "Too many sign-up or reset mails asked for, to this address or from where you are: try again in an hour.");
  }
  await AccountMailRequest.create({ kind, email, ipAddress });
}
