import "server-only";
import { Op } from "sequelize";
import { db } from "@/models";
import { serverConfig } from "../config";
import { readRequestNetwork } from "./request-network";

/** True when recent failures for this account or this address have reached the limit. */
export async function isSignInThrottled(email: string, ipAddress: string): Promise<boolean> {
  const { SignInAttempt } = db();
  const since = new Date(Date.now() - serverConfig.signInLimit.windowMs);
  const [byAccount, byAddress] = await Promise.all([
    SignInAttempt.count({ where: { email, succeeded: false, createdAt: { [Op.gte]: since } } }),
    SignInAttempt.count({ where: { ipAddress, succeeded: false, createdAt: { [Op.gte]: since } } }),
  ]);
  return byAccount >= serverConfig.signInLimit.perAccount || byAddress >= serverConfig.signInLimit.perAddress;
}

export async function recordSignInAttempt(email: string, ipAddress: string, succeeded: boolean): Promise<void> {
  const { SignInAttempt } = db();
  await SignInAttempt.create({ email, ipAddress, succeeded });
}

/**
 * The address the per-address limit counts: the socket peer, or the hop a trusted proxy
 * appended (BENCHFOLD_TRUSTED_PROXIES), as scripts/server.mjs resolved it. A client's own
 * X-Forwarded-For never changes it.
 */
export function clientAddress(headers: Parameters<typeof readRequestNetwork>[0]): string {
  return readRequestNetwork(headers).clientAddress;
}
