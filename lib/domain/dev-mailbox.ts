/** One message the local fake SMTP server caught (/dev/mailbox; never in production). Pure type for the view. */
export type CaughtMessage = { id: string; from: string; to: string; subject: string; text: string; html: string | null; date: string };
