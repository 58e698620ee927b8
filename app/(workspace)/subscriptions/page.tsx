import type { Metadata } from "next";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { NotBuiltView } from "@/components/workspace/not-built-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "Change notices" };

export default async function SubscriptionsPage() {
  const access = await requirePageUser({ permission: "subscription:manage", path: "/subscriptions" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="change notices" />;
  return (
    <NotBuiltView
      runningHead={access.user.organizationName}
      title="Change notices"
      lead="Parts you follow. When a new revision of one of their sheets is released, you hear about it by e-mail, with what changed."
      emptyTitle="You follow no parts yet"
    >
      <p>No sheet has been released yet, so there is nothing to follow. Following a part from its catalog page arrives with the first released sheets.</p>
    </NotBuiltView>
  );
}
