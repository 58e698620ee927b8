import { route } from "@/lib/server/auth/guard";
import { listPendingMeasurementSets } from "@/lib/server/measurements/list-pending-measurement-sets";

export const GET = route({ resource: "measurement-review" }, async ({ user }) => ({
  measurementSets: await listPendingMeasurementSets(user),
}));
