import type { Metadata } from "next";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { NotBuiltView } from "@/components/workspace/not-built-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewPage() {
  const access = await requirePageUser({ permission: "sheet:review", path: "/review" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="the review queue" />;
  return (
    <NotBuiltView
      runningHead={access.user.organizationName}
      title="Review queue"
      lead="Sheets submitted for sign-off, each shown against its last released revision."
      emptyTitle="Nothing to review"
    >
      <p>No sheet can be submitted yet: drafting sheets arrives in a later release, and review with electronic sign-off after it.</p>
      <p>When it does, a submission you made yourself will never appear in your own queue.</p>
    </NotBuiltView>
  );
}
