import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import type SMTPTransport from "nodemailer/lib/smtp-transport";
import { serverConfig } from "../config";

export type OutgoingMail = { to: string; subject: string; text: string; html?: string };

/** The one SMTP configuration: the app's direct mails and the outbox worker both send with it. */
export function smtpTransportOptions(): SMTPTransport.Options {
  return {
    host: process.env.SMTP_HOST ?? "127.0.0.1",
    port: Number(process.env.SMTP_PORT ?? 2525),
    secure: process.env.SMTP_SECURE === "1",
    // The local fake server speaks plain SMTP; a real relay is configured with SMTP_SECURE/SMTP_USER.
    ignoreTLS: serverConfig.fakeSmtp,
    auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASSWORD ?? "" } : undefined,
  };
}

let transporter: Transporter | undefined;

function getTransporter(): Transporter {
  transporter ??= nodemailer.createTransport(smtpTransportOptions());
  return transporter;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await getTransporter().sendMail({ from: serverConfig.mailFrom, ...mail });
}
