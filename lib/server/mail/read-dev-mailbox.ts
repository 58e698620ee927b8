import "server-only";
import { serverConfig } from "../config";
import type { CaughtMessage } from "@/lib/domain/dev-mailbox";
import { isFromThisMachine } from "../auth/request-network";

/**
 * What the local fake SMTP server caught, for a request made on this machine (see
 * isFromThisMachine: the socket's address, never a forwarded header). Null — the caller answers
 * 404 — for any other request, and whenever mail is not being caught locally (never in production).
 */
export async function readDevMailbox(requestHeaders: Headers): Promise<CaughtMessage[] | null> {
  const url = serverConfig.mailboxUrl;
  if (!url || !isFromThisMachine(requestHeaders)) return null;
  const response = await fetch(`${url}/messages`, { cache: "no-store" }).catch(() => null);
  // The fake SMTP server is not running: nothing is caught.
  if (!response) return null;
  if (!response.ok) throw new Error(`fake SMTP read-out answered ${response.status}`);
  const body = (await response.json()) as { messages: CaughtMessage[] };
  return body.messages;
}
