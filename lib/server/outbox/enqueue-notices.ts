import "server-only";
import { randomUUID } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { db } from "@/models";
import { serverConfig } from "../config";
import { defaultOutboxLane, lanePattern } from "./outbox-settings";

export type Notice = {
  organizationId: number | null;
  /** What happened, once per event, e.g. "sheet-candidate:12:submitted". */
  eventKey: string;
  to: string;
  subject: string;
  text: string;
  /** Extra mail headers, e.g. List-Unsubscribe (names from `allowedNoticeHeaders`, one-line values). */
  headers?: Record<string, string>;
  /** The worker lane; leave it out ("mail"). Tests use a lane of their own so the shared worker leaves their rows alone. */
  lane?: string;
};

/** The headers a notice may add: the rest (From, To, Message-ID…) are the sender's. */
export const allowedNoticeHeaders = ["List-Unsubscribe", "List-Unsubscribe-Post"] as const;

const singleAddress = /^[^\s@,;:<>()[\]"\\]+@[^\s@,;:<>()[\]"\\]+\.[^\s@,;:<>()[\]"\\]+$/;
const limits = { eventKey: 191, to: 254, subject: 255, text: 4 * 1024 * 1024 } as const;

/** The Message-ID's domain: the sender address's, so replies and threading stay with Benchfold's mail. */
function messageIdDomain(): string {
  const match = serverConfig.mailFrom.match(/@([A-Za-z0-9.-]+)>?\s*$/);
  return match ? match[1].toLowerCase() : "benchfold.invalid";
}

/**
 * Queues notices in the caller's transaction: they exist exactly when the event commits, and the
 * outbox worker mails them afterwards. A notice whose (eventKey, recipient) is queued already,
 * in this call or an earlier one, is left out, so repeating an event's enqueue is harmless.
 * Recipients are compared in lower case, as accounts store them.
 */
export async function enqueueNotices(transaction: Transaction, notices: Notice[]): Promise<void> {
  if (notices.length === 0) return;
  const { sequelize } = db();
  const domain = messageIdDomain();
  const rows = notices.map((notice) => {
    const to = notice.to.trim().toLowerCase();
    for (const [field, value] of [["eventKey", notice.eventKey], ["to", to], ["subject", notice.subject], ["text", notice.text]] as const) {
      if (value.length === 0 || value.length > limits[field]) throw new Error(`notice ${field} must be 1–${limits[field]} characters (event ${notice.eventKey})`);
    }
    if (notice.lane !== undefined && !lanePattern.test(notice.lane)) throw new Error(`notice lane '${notice.lane}' is not a lane name (event ${notice.eventKey})`);
    if (/[\r\n]/.test(notice.subject)) throw new Error(`notice subject must be one line (event ${notice.eventKey})`);
    // One bare address: nodemailer would read "a@x.example, b@y.example" as two recipients.
    if (!singleAddress.test(to)) throw new Error(`notice recipient must be one bare e-mail address (event ${notice.eventKey})`);
    const headers = notice.headers && Object.keys(notice.headers).length ? notice.headers : null;
    for (const [name, value] of Object.entries(headers ?? {})) {
      if (!(allowedNoticeHeaders as readonly string[]).includes(name)) throw new Error(`notice header '${name}' is not one a notice may set (event ${notice.eventKey})`);
      if (/[\r\n]/.test(value) || value.length === 0 || value.length > 2000) throw new Error(`notice header '${name}' must be one line of 1–2000 characters (event ${notice.eventKey})`);
    }
    return [notice.lane ?? defaultOutboxLane, notice.organizationId, notice.eventKey, to, notice.subject, notice.text, headers ? JSON.stringify(headers) : null, `<outbox.${randomUUID()}@${domain}>`];
  });
  // ON DUPLICATE KEY rather than INSERT IGNORE: IGNORE would also turn a too-long value into a
  // silently truncated one. The unique key (event_key, recipient) is what makes a row a repeat.
  await sequelize.query(
    `INSERT INTO outbox_messages
       (lane, organization_id, event_key, recipient, subject, body_text, headers, message_id, attempts, next_attempt_at, created_at, updated_at)
     VALUES ${rows.map(() => "(?, ?, ?, ?, ?, ?, ?, ?, 0, NOW(3), NOW(3), NOW(3))").join(", ")}
     ON DUPLICATE KEY UPDATE id = id`,
    { type: QueryTypes.INSERT, transaction, replacements: rows.flat() },
  );
}
