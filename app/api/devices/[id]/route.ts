import { deviceBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { getDevice } from "@/lib/server/devices/get-device";
import { saveDevice } from "@/lib/server/devices/save-device";
import { readIdParam } from "@/lib/server/route-params";

export const GET = route({ resource: "devices" }, async ({ user, params }) => ({
  device: await getDevice({ viewer: user, deviceId: readIdParam(params.id, "device") }),
}));

export const PATCH = route({ resource: "device-edit", body: deviceBodySchema }, async ({ user, params, body }) => ({
  device: await saveDevice({ actor: user, input: body, deviceId: readIdParam(params.id, "device") }),
}));
