import "server-only";
import { randomUUID } from "node:crypto";
import { QueryTypes, Transaction } from "sequelize";
import { db } from "@/models";
import { retryOnDeadlock } from "./retry-on-deadlock";

export type ClaimedNotice = {
  id: number;
  recipient: string;
  subject: string;
  bodyText: string;
  messageId: string;
  /** Extra mail headers (List-Unsubscribe), or null. */
  headers: Record<string, string> | null;
  attempts: number;
};

/**
 * Claims up to `batchSize` due, unsent rows of a lane for `leaseMs`, oldest first, and returns
 * them with the claim's token. The rows are picked with SELECT … FOR UPDATE SKIP LOCKED in a
 * short READ COMMITTED transaction and stamped with the token and the lease's end before it
 * commits, so two workers never hold the same row while its lease lasts, and a worker passes
 * over rows another is claiming or marking instead of waiting for them. (One UPDATE … ORDER BY id
 * LIMIT n did the same with less code, but four workers at once made InnoDB deadlock on it.)
 * Every time is the database's own NOW(3), so workers on machines with different clocks agree on
 * when a lease ends.
 */
export async function claimOutboxBatch(options: { lane: string; batchSize: number; leaseMs: number }): Promise<{ claimToken: string; rows: ClaimedNotice[] }> {
  const { sequelize } = db();
  const claimToken = randomUUID();
  const rows = await retryOnDeadlock(() =>
    sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED }, async (transaction) => {
      const picked = await sequelize.query<Omit<ClaimedNotice, "headers"> & { headers: string | Record<string, string> | null }>(
        `SELECT id, recipient, subject, body_text AS bodyText, message_id AS messageId, headers, attempts
           FROM outbox_messages
          WHERE lane = :lane AND sent_at IS NULL AND next_attempt_at <= NOW(3)
            AND (claimed_until IS NULL OR claimed_until < NOW(3))
          ORDER BY id
          LIMIT :batchSize
          FOR UPDATE SKIP LOCKED`,
        { type: QueryTypes.SELECT, transaction, replacements: { lane: options.lane, batchSize: options.batchSize } },
      );
      if (picked.length > 0) {
        await sequelize.query(
          `UPDATE outbox_messages SET claim_token = :claimToken, claimed_until = NOW(3) + INTERVAL :leaseUs MICROSECOND, updated_at = NOW(3) WHERE id IN (:ids)`,
          { type: QueryTypes.UPDATE, transaction, replacements: { claimToken, leaseUs: options.leaseMs * 1000, ids: picked.map((row) => row.id) } },
        );
      }
      // MariaDB's JSON is LONGTEXT: a raw query reads it back as text.
      return picked.map((row) => ({ ...row, headers: typeof row.headers === "string" ? (JSON.parse(row.headers) as Record<string, string> | null) : row.headers }));
    }),
  );
  return { claimToken, rows };
}
