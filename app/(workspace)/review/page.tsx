import type { Metadata } from "next";
import { listPendingMeasurementSets } from "@/lib/server/measurements/list-pending-measurement-sets";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { ReviewQueueView } from "@/components/measurements/review-queue-view";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewPage() {
  const user = await requirePageUser({ resource: "measurement-review", path: "/review" });
  // The same queue as GET /api/measurements/pending: four eyes are in its query.
  const sets = await listPendingMeasurementSets(user);
  return <ReviewQueueView organizationName={user.organizationName} sets={sets} />;
}
