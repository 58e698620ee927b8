import type { Metadata } from "next";
import { allows } from "@/lib/access/matrix";
import { listPendingCandidates } from "@/lib/server/reviews/list-pending-candidates";
import { listPendingMeasurementSets } from "@/lib/server/measurements/list-pending-measurement-sets";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { ReviewQueueView } from "@/components/measurements/review-queue-view";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewPage() {
  const user = await requirePageUser({ resource: "measurement-review", path: "/review" });
  // The same queue as GET /api/measurements/pending: four eyes are in its query.
  // Sheets as GET /api/sheet-candidates/pending lists them, for a role that reviews sheets.
  const [sets, sheets] = await Promise.all([
    listPendingMeasurementSets(user),
    allows(user.role, "sheet-review") ? listPendingCandidates(user) : Promise.resolve(null),
  ]);
  return <ReviewQueueView organizationName={user.organizationName} sets={sets} sheets={sheets} />;
}
