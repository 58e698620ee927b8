import { route } from "@/lib/server/auth/guard";
import { listPendingMeasurementSets } from "@/lib/server/measurements/list-pending-measurement-sets";

export const GET = route({ access: "measurement:approve" }, async ({ user }) => ({
  measurementSets: await listPendingMeasurementSets(user.organizationId),
}));
