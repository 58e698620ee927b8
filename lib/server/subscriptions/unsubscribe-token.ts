import "server-only";
import { createHmac, timingSafeEqual } from "node:crypto";

/**
 * The unsubscribe link's token: it names one subscription and its follower, signed with
 * HMAC-SHA256 (RFC 2104) under the app's secret, so it works without signing in and cannot be
 * made for someone else's subscription. Form: "<subscriptionId>.<userId>.<signature>", the
 * signature base64url without padding. The comparison is of the whole signature *text*, so a
 * character changed in a base64url digit's unused low bits (which would decode to the same bytes)
 * is refused too.
 */
const purpose = "benchfold:unsubscribe:v1";
const tokenPattern = /^([1-9][0-9]{0,9})\.([1-9][0-9]{0,9})\.([A-Za-z0-9_-]{43})$/;

export type UnsubscribeClaim = { subscriptionId: number; userId: number };

function signature(claim: UnsubscribeClaim, secret: string): string {
  return createHmac("sha256", secret).update(`${purpose}:${claim.subscriptionId}:${claim.userId}`).digest("base64url");
}

/** The secret the app signs with: BENCHFOLD_UNSUBSCRIBE_SECRET, or else NEXTAUTH_SECRET. */
export function unsubscribeSecret(env: Record<string, string | undefined> = process.env): string {
  const secret = env.BENCHFOLD_UNSUBSCRIBE_SECRET || env.NEXTAUTH_SECRET;
  if (!secret) throw new Error("Set NEXTAUTH_SECRET (or BENCHFOLD_UNSUBSCRIBE_SECRET) to sign unsubscribe links.");
  return secret;
}

export function makeUnsubscribeToken(claim: UnsubscribeClaim, secret = unsubscribeSecret()): string {
  return `${claim.subscriptionId}.${claim.userId}.${signature(claim, secret)}`;
}

/** The claim of a token this app signed, or null for anything else (altered, truncated, foreign). */
export function readUnsubscribeToken(token: string, secret = unsubscribeSecret()): UnsubscribeClaim | null {
  const match = tokenPattern.exec(token);
  if (!match) return null;
  const claim = { subscriptionId: Number(match[1]), userId: Number(match[2]) };
  const expected = Buffer.from(signature(claim, secret));
  const given = Buffer.from(match[3]);
  return expected.length === given.length && timingSafeEqual(expected, given) ? claim : null;
}
