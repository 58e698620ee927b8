import { route } from "@/lib/server/auth/guard";
import { getMeasurementSet } from "@/lib/server/measurements/get-measurement-set";
import { readIdParam } from "@/lib/server/route-params";

export const GET = route({ resource: "devices" }, async ({ user, params }) => ({
  measurementSet: await getMeasurementSet({ viewer: user, setId: readIdParam(params.id, "measurement set") }),
}));
