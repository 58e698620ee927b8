import { deviceBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { getDevice } from "@/lib/server/devices/get-device";
import { saveDevice } from "@/lib/server/devices/save-device";
import { readIdParam } from "@/lib/server/route-params";

export const GET = route({ access: "device:read" }, async ({ user, params }) => ({
  device: await getDevice({ organizationId: user.organizationId, deviceId: readIdParam(params.id, "device") }),
}));

export const PATCH = route({ access: "device:write", body: deviceBodySchema }, async ({ user, params, body }) => ({
  device: await saveDevice({ actor: user, input: body, deviceId: readIdParam(params.id, "device") }),
}));
