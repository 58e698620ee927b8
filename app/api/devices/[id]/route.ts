import { AppError } from "@/lib/errors";
import { route } from "@/lib/server/auth/guard";
import { getDevice } from "@/lib/server/devices/get-device";

export const GET = route({ access: "device:read" }, async ({ user, params }) => {
  const deviceId = Number(params.id);
  if (!Number.isInteger(deviceId) || deviceId <= 0) throw new AppError("not-found", "No such device in your organization.");
  return { device: await getDevice({ organizationId: user.organizationId, deviceId }) };
});
