import type { Metadata } from "next";
import { headers } from "next/headers";
import { notFound } from "next/navigation";
import { readDevMailbox } from "@/lib/server/mail/read-dev-mailbox";
import { MailboxView } from "@/components/mailbox/mailbox-view";

export const metadata: Metadata = { title: "Caught mail", robots: { index: false } };
export const dynamic = "force-dynamic";

// Only while the local fake SMTP server catches mail, and only for a request made on this machine.
export default async function DevMailboxPage() {
  const messages = await readDevMailbox(await headers());
  if (!messages) notFound();
  return <MailboxView messages={messages} />;
}
