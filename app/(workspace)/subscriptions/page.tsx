import type { Metadata } from "next";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { NotBuiltView } from "@/components/workspace/not-built-view";

export const metadata: Metadata = { title: "Change notices" };

export default async function SubscriptionsPage() {
  const user = await requirePageUser({ resource: "subscriptions", path: "/subscriptions" });
  return (
    <NotBuiltView
      runningHead={user.organizationName}
      title="Change notices"
      lead="Parts you follow. When a new revision of one of their sheets is released, you hear about it by e-mail, with what changed."
      emptyTitle="You follow no parts yet"
    >
      <p>No sheet has been released yet, so there is nothing to follow. Following a part from its catalog page arrives with the first released sheets.</p>
    </NotBuiltView>
  );
}
