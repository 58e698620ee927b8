import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { readDevMailbox } from "@/lib/server/mail/read-dev-mailbox";
import { MailboxView } from "@/components/mailbox/mailbox-view";

export const metadata: Metadata = { title: "Caught mail", robots: { index: false } };
export const dynamic = "force-dynamic";

export default async function DevMailboxPage() {
  const messages = await readDevMailbox();
  if (!messages) notFound();
  return <MailboxView messages={messages} />;
}
