const mailboxUrl = `http://127.0.0.1:${process.env.BENCHFOLD_MAILBOX_PORT ?? 2581}`;

export type CaughtMail = { to: string; subject: string; text: string; messageId: string | null; listUnsubscribe?: string | null };

/** Every message the run's fake SMTP server caught to this address, newest first. */
export async function mailsTo(to: string): Promise<CaughtMail[]> {
  const { messages } = (await (await fetch(`${mailboxUrl}/messages`)).json()) as { messages: CaughtMail[] };
  return messages.filter((m) => m.to.split(", ").includes(to));
}

/** Closes (false) or opens (true) the fake SMTP server's SMTP port; its read-out stays up. */
export async function setFakeSmtpListening(listening: boolean): Promise<void> {
  const response = await fetch(`${mailboxUrl}/smtp`, { method: listening ? "PUT" : "DELETE" });
  if (!response.ok) throw new Error(`fake SMTP answered ${response.status} to ${listening ? "PUT" : "DELETE"} /smtp`);
}

/** Waits for the fake SMTP server to catch a message to this address. */
export async function waitForMail(to: string, timeoutMs = 10_000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const { messages } = (await (await fetch(`${mailboxUrl}/messages`)).json()) as { messages: CaughtMail[] };
    const found = messages.find((m) => m.to.split(", ").includes(to));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
}

export function firstLink(text: string): URL {
  const match = text.match(/https?:\/\/\S+/);
  if (!match) throw new Error(`no link in: ${text}`);
  return new URL(match[0]);
}
