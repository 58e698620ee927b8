import "server-only";
import { serverConfig } from "../config";
import type { CaughtMessage } from "@/lib/domain/dev-mailbox";

/** What the local fake SMTP server caught; null when it is not running (never in production). */
export async function readDevMailbox(): Promise<CaughtMessage[] | null> {
  const url = serverConfig.mailboxUrl;
  if (!url) return null;
  const response = await fetch(`${url}/messages`, { cache: "no-store" });
  if (!response.ok) throw new Error(`fake SMTP read-out answered ${response.status}`);
  const body = (await response.json()) as { messages: CaughtMessage[] };
  return body.messages;
}
