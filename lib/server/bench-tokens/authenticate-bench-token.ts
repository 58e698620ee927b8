import "server-only";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { hashToken } from "../crypto";

/** The organization and token behind `Authorization: Bearer <token>`; revoked or unknown tokens get 401. */
export async function authenticateBenchToken(request: Request): Promise<{ organizationId: number; tokenId: number }> {
  const { BenchToken } = db();
  const header = request.headers.get("authorization") ?? "";
  const match = /^Bearer\s+(\S+)$/i.exec(header);
  if (!match) throw new AppError("unauthenticated", "Send a bench token as Authorization: Bearer <token>.");
  const row = await BenchToken.findOne({ where: { tokenHash: hashToken(match[1]) } });
  if (!row || row.revokedAt) throw new AppError("unauthenticated", "This bench token is unknown or revoked.");
  await BenchToken.update({ lastUsedAt: new Date() }, { where: { id: row.id } });
  return { organizationId: row.organizationId, tokenId: row.id };
}
