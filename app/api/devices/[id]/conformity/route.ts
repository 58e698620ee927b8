import { route } from "@/lib/server/auth/guard";
import { getConformityWatch } from "@/lib/server/conformity/get-conformity-watch";
import { readIdParam } from "@/lib/server/route-params";

/** The device's conformity watch since its current release: limits, control charts (Vega-Lite specs), alerts. */
export const GET = route({ resource: "conformity" }, async ({ user, params }) => ({
  conformity: await getConformityWatch({ viewer: user, deviceId: readIdParam(params.id, "device") }),
}));
