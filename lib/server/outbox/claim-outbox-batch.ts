import "server-only";
import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import { db } from "@/models";

export type ClaimedNotice = {
  id: number;
  recipient: string;
  subject: string;
  bodyText: string;
  messageId: string;
  attempts: number;
};

/**
 * Claims up to `batchSize` due, unsent rows of a lane for `leaseMs`, oldest first, and reads
 * them back by the claim's token. The claim is one UPDATE: InnoDB locks each row it changes and
 * re-reads the condition of a row another claim held, so two workers never hold the same row
 * while its lease lasts. Every time is the database's own NOW(3), so workers on machines with
 * different clocks agree on when a lease ends.
 */
export async function claimOutboxBatch(options: { lane: string; batchSize: number; leaseMs: number }): Promise<{ claimToken: string; rows: ClaimedNotice[] }> {
  const { sequelize } = db();
  const claimToken = randomUUID();
  await sequelize.query(
    `UPDATE outbox_messages
        SET claim_token = :claimToken, claimed_until = NOW(3) + INTERVAL :leaseUs MICROSECOND, updated_at = NOW(3)
      WHERE lane = :lane AND sent_at IS NULL AND next_attempt_at <= NOW(3)
        AND (claimed_until IS NULL OR claimed_until < NOW(3))
      ORDER BY id
      LIMIT :batchSize`,
    { type: QueryTypes.UPDATE, replacements: { claimToken, leaseUs: options.leaseMs * 1000, lane: options.lane, batchSize: options.batchSize } },
  );
  const rows = await sequelize.query<ClaimedNotice>(
    `SELECT id, recipient, subject, body_text AS bodyText, message_id AS messageId, attempts
       FROM outbox_messages
      WHERE claim_token = :claimToken AND sent_at IS NULL
      ORDER BY id`,
    { type: QueryTypes.SELECT, replacements: { claimToken } },
  );
  return { claimToken, rows };
}
