import { route } from "@/lib/server/auth/guard";
import { listDevices } from "@/lib/server/devices/list-devices";

export const GET = route({ access: "device:read" }, async ({ user }) => ({ devices: await listDevices(user.organizationId) }));
