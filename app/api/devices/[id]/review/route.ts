import { route } from "@/lib/server/auth/guard";
import { findDeviceReview } from "@/lib/server/reviews/list-pending-candidates";
import { readIdParam } from "@/lib/server/route-params";

/** Where the device's sheet stands in review: its open candidate, if any, and the latest one. */
export const GET = route({ resource: "sheet-comments" }, async ({ user, params }) =>
  findDeviceReview({ viewer: user, deviceId: readIdParam(params.id, "device") }),
);
