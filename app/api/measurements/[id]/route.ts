import { route } from "@/lib/server/auth/guard";
import { getMeasurementSet } from "@/lib/server/measurements/get-measurement-set";
import { readIdParam } from "@/lib/server/route-params";

export const GET = route({ access: "device:read" }, async ({ user, params }) => ({
  measurementSet: await getMeasurementSet({ organizationId: user.organizationId, setId: readIdParam(params.id, "measurement set") }),
}));
