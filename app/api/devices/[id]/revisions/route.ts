import { route } from "@/lib/server/auth/guard";
import { listDeviceRevisions } from "@/lib/server/reviews/list-revisions";
import { readIdParam } from "@/lib/server/route-params";

/** The device's released revisions, newest first (letter, date, signers, standing, notes, download). */
export const GET = route({ resource: "devices" }, async ({ user, params }) => ({
  revisions: await listDeviceRevisions({ viewer: user, deviceId: readIdParam(params.id, "device") }),
}));
