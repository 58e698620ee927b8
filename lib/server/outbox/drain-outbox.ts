import "server-only";
import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import { db } from "@/models";
import { claimOutboxBatch } from "./claim-outbox-batch";
import type { OutboxSettings } from "./outbox-settings";
import { outboxRetryDelayMs } from "./retry-delay";
import { retryOnDeadlock } from "./retry-on-deadlock";

export type OutboxMail = { to: string; subject: string; text: string; messageId: string; headers?: Record<string, string> };
export type DrainResult = { claimed: number; sent: number; failed: number; lostLease: number };

function describeError(error: unknown): string {
  const e = error as { code?: unknown; responseCode?: unknown; message?: unknown };
  const parts = [e?.code, e?.responseCode, typeof e?.message === "string" ? e.message : String(error)].filter((p) => p !== undefined && p !== "");
  return parts.join(" ").replace(/\s+/g, " ").slice(0, 500);
}

/**
 * One pass of the outbox worker over its lane: claims a batch (claimOutboxBatch), then for each
 * row moves the claim to a token of this send's own, renewing the lease (a row that another
 * worker claimed after this pass's lease ran out is left to that worker), sends it with the row's
 * own Message-ID and marks it sent. A failed send counts an attempt, records the error and sets
 * the next attempt after a capped exponential delay (outboxRetryDelayMs); the claim is released
 * either way. When `shouldStop` answers true (SIGTERM), the rows not yet sent are released for the
 * next worker at once.
 *
 * A crash (or lost database) between a successful send and the UPDATE that marks it sent leaves
 * the row claimed; when the lease ends it is sent again, with the same Message-ID: at most one
 * duplicate per crash, never a lost notice. See DEVELOPERS.md, "Notices (outbox)".
 */
export async function drainOutbox(options: {
  settings: Pick<OutboxSettings, "lane" | "batchSize" | "leaseMs" | "retryBaseMs" | "retryCapMs">;
  send: (mail: OutboxMail) => Promise<void>;
  shouldStop?: () => boolean;
}): Promise<DrainResult> {
  const { settings, send, shouldStop = () => false } = options;
  const { sequelize } = db();
  const { claimToken, rows } = await claimOutboxBatch(settings);
  const result: DrainResult = { claimed: rows.length, sent: 0, failed: 0, lostLease: 0 };
  const update = (sql: string, replacements: Record<string, unknown>) =>
    retryOnDeadlock(() => sequelize.query(sql, { type: QueryTypes.UPDATE, replacements: { claimToken, ...replacements } })).then(([, affected]) => Number(affected));

  for (const row of rows) {
    if (shouldStop()) {
      await update(`UPDATE outbox_messages SET claim_token = NULL, claimed_until = NULL, updated_at = NOW(3) WHERE claim_token = :claimToken AND sent_at IS NULL`, {});
      break;
    }
    // The row moves from the batch's token to one of this send's own: the UPDATE changes the row
    // exactly when it is still ours (MariaDB counts changed rows, and a lease renewed within the
    // same millisecond as the claim would change nothing).
    const sendToken = randomUUID();
    const stillOurs = await update(
      `UPDATE outbox_messages SET claim_token = :sendToken, claimed_until = NOW(3) + INTERVAL :leaseUs MICROSECOND, updated_at = NOW(3)
        WHERE id = :id AND claim_token = :claimToken AND sent_at IS NULL`,
      { id: row.id, sendToken, leaseUs: settings.leaseMs * 1000 },
    );
    if (stillOurs === 0) {
      result.lostLease += 1;
      continue;
    }
    let failure: unknown = null;
    try {
      await send({ to: row.recipient, subject: row.subject, text: row.bodyText, messageId: row.messageId, ...(row.headers ? { headers: row.headers } : {}) });
    } catch (error) {
      failure = error ?? new Error("send failed");
    }
    if (failure === null) {
      await update(
        `UPDATE outbox_messages SET sent_at = NOW(3), attempts = attempts + 1, last_error = NULL, claim_token = NULL, claimed_until = NULL, updated_at = NOW(3)
          WHERE id = :id AND claim_token = :sendToken`,
        { id: row.id, sendToken },
      );
      result.sent += 1;
    } else {
      const attempts = row.attempts + 1;
      await update(
        `UPDATE outbox_messages SET attempts = :attempts, last_error = :lastError, next_attempt_at = NOW(3) + INTERVAL :delayUs MICROSECOND,
                claim_token = NULL, claimed_until = NULL, updated_at = NOW(3)
          WHERE id = :id AND claim_token = :sendToken`,
        { id: row.id, sendToken, attempts, lastError: describeError(failure), delayUs: outboxRetryDelayMs(attempts, settings) * 1000 },
      );
      result.failed += 1;
    }
  }
  return result;
}
