import "server-only";
import { Op } from "sequelize";
import { db } from "@/models";
import { serverConfig } from "../config";

/**
 * Ends one session on the server: its id is refused from now on (getSessionUser), while the
 * person's other sessions (another browser, another machine) stay signed in. The row is kept
 * until the session would have expired anyway; expired rows are pruned here.
 */
export async function revokeSession(session: { sessionId: string; userId: number; startedAt: number }): Promise<void> {
  const { RevokedSession } = db();
  const expiresAt = new Date((session.startedAt + serverConfig.sessionMaxAgeSeconds) * 1000);
  await RevokedSession.bulkCreate([{ sessionId: session.sessionId, userId: session.userId, expiresAt }], { ignoreDuplicates: true });
  await RevokedSession.destroy({ where: { expiresAt: { [Op.lt]: new Date() } } });
}

export async function isSessionRevoked(sessionId: string): Promise<boolean> {
  const { RevokedSession } = db();
  return (await RevokedSession.count({ where: { sessionId } })) > 0;
}
