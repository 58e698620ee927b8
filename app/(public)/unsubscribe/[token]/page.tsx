import type { Metadata } from "next";
import { describeUnsubscribeToken } from "@/lib/server/subscriptions/subscriptions";
import { UnsubscribeView } from "@/components/subscriptions/unsubscribe-view";

export const metadata: Metadata = { title: "Stop notices", robots: { index: false } };

type Props = { params: Promise<{ token: string }> };

/** Public: a notice's unsubscribe link works without signing in; its signed token is the proof. */
export default async function UnsubscribePage({ params }: Props) {
  const token = decodeURIComponent((await params).token).slice(0, 200);
  const { valid, label } = await describeUnsubscribeToken(token);
  return <UnsubscribeView token={token} valid={valid} label={label} />;
}
