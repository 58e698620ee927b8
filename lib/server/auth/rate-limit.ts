import "server-only";
import { Op } from "sequelize";
import { SignInAttempt } from "@/models";
import { serverConfig } from "../config";

/** True when recent failures for this account or this address have reached the limit. */
export async function isSignInThrottled(email: string, ipAddress: string): Promise<boolean> {
  const since = new Date(Date.now() - serverConfig.signInLimit.windowMs);
  const [byAccount, byAddress] = await Promise.all([
    SignInAttempt.count({ where: { email, succeeded: false, createdAt: { [Op.gte]: since } } }),
    SignInAttempt.count({ where: { ipAddress, succeeded: false, createdAt: { [Op.gte]: since } } }),
  ]);
  return byAccount >= serverConfig.signInLimit.perAccount || byAddress >= serverConfig.signInLimit.perAddress;
}

export async function recordSignInAttempt(email: string, ipAddress: string, succeeded: boolean): Promise<void> {
  await SignInAttempt.create({ email, ipAddress, succeeded });
}

/** The client address: the proxy's header only when a trusted proxy sets it. */
export function clientAddress(headers: Headers | Record<string, string | string[] | undefined> | undefined): string {
  const get = (name: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const value = headers[name];
    return Array.isArray(value) ? value[0] : value;
  };
  const forwarded = get("x-forwarded-for");
  if (!forwarded) return "unknown";
  const hops = forwarded.split(",").map((s) => s.trim()).filter(Boolean);
  // Without a trusted proxy the nearest hop (appended by the Next server itself) is the only honest one.
  return (serverConfig.trustProxy ? hops[0] : hops[hops.length - 1]) ?? "unknown";
}
