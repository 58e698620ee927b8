import type { Metadata } from "next";
import { listDevices } from "@/lib/server/devices/list-devices";
import { listPendingMeasurementSets } from "@/lib/server/measurements/list-pending-measurement-sets";
import { ReviewQueueView } from "@/components/measurements/review-queue-view";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewPage() {
  const access = await requirePageUser({ permission: "sheet:review", path: "/review" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="the review queue" />;
  const { organizationId, id: userId } = access.user;
  const [pending, devices] = await Promise.all([listPendingMeasurementSets(organizationId), listDevices(organizationId)]);
  // Four eyes: a reviewer's own upload is someone else's to decide.
  const sets = pending.filter((s) => s.uploadedById !== userId);
  return <ReviewQueueView organizationName={access.user.organizationName} sets={sets} devices={devices} />;
}
