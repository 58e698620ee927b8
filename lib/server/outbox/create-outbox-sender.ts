import "server-only";
import nodemailer from "nodemailer";
import { serverConfig } from "../config";
import { smtpTransportOptions } from "../mail/send-mail";
import type { OutboxMail } from "./drain-outbox";

/**
 * The worker's sender: the app's SMTP settings (smtpTransportOptions) over one pooled connection
 * (reused from mail to mail: about three times the rate of a connection per mail, measured
 * against the local fake server), with timeouts short enough that one send ends well inside a
 * lease (10 s to connect, 10 s for the greeting, 30 s of silence at any later step), so a slow
 * relay makes a failed attempt rather than a second sender.
 */
export function createOutboxSender(): { send: (mail: OutboxMail) => Promise<void>; close: () => void } {
  const transport = nodemailer.createTransport({ ...smtpTransportOptions(), pool: true, maxConnections: 1, connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 });
  return {
    send: async (mail) => {
      await transport.sendMail({ from: serverConfig.mailFrom, to: mail.to, subject: mail.subject, text: mail.text, messageId: mail.messageId, ...(mail.headers ? { headers: mail.headers } : {}) });
    },
    close: () => transport.close(),
  };
}
