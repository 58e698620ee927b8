import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { buildDeviceSheet } from "@/lib/server/sheets/build-device-sheet";

export const GET = route({ access: "device:read" }, async ({ user, params }) => ({
  sheet: await buildDeviceSheet({ organizationId: user.organizationId, deviceId: readIdParam(params.id, "device") }),
}));
