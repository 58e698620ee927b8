import { deviceBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { listDevices } from "@/lib/server/devices/list-devices";
import { saveDevice } from "@/lib/server/devices/save-device";

export const GET = route({ resource: "devices" }, async ({ user }) => ({ devices: await listDevices(user) }));

export const POST = route({ resource: "device-edit", body: deviceBodySchema }, async ({ user, body }) =>
  Response.json({ device: await saveDevice({ actor: user, input: body }) }, { status: 201 }),
);
