import type { Metadata } from "next";
import { listDevices } from "@/lib/server/devices/list-devices";
import { listPendingMeasurementSets } from "@/lib/server/measurements/list-pending-measurement-sets";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { ReviewQueueView } from "@/components/measurements/review-queue-view";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewPage() {
  const user = await requirePageUser({ permission: "sheet:review", path: "/review" });
  const { organizationId, id: userId } = user;
  const [pending, devices] = await Promise.all([listPendingMeasurementSets(organizationId), listDevices(organizationId)]);
  // Four eyes: a reviewer's own upload is someone else's to decide.
  const sets = pending.filter((s) => s.uploadedById !== userId);
  return <ReviewQueueView organizationName={user.organizationName} sets={sets} devices={devices} />;
}
