import "server-only";
import { createHash, randomBytes } from "node:crypto";

/** A URL-safe one-time token and the SHA-256 that is all the database keeps of it. */
export function createOneTimeToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}
