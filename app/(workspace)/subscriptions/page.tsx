import type { Metadata } from "next";
import { loadForPage, requirePageUser } from "@/lib/server/auth/require-page-user";
import { listSubscriptions } from "@/lib/server/subscriptions/subscriptions";
import { SubscriptionsView } from "@/components/subscriptions/subscriptions-view";

export const metadata: Metadata = { title: "Change notices" };

export default async function SubscriptionsPage() {
  const user = await requirePageUser({ resource: "subscriptions", path: "/subscriptions" });
  const page = await loadForPage(() => listSubscriptions(user));
  return <SubscriptionsView runningHead={user.organizationName} initial={page} />;
}
