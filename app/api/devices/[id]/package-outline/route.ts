import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { readOutlineUpload, removePackageOutline, savePackageOutline } from "@/lib/server/sheets/save-package-outline";

export const POST = route({ resource: "sheet-edit" }, async ({ user, params, request }) => {
  const deviceId = readIdParam(params.id, "device");
  const upload = await readOutlineUpload(request);
  const packageOutline = await savePackageOutline({ actor: user, deviceId, upload });
  return Response.json({ packageOutline }, { status: 201 });
});

export const DELETE = route({ resource: "sheet-edit" }, async ({ user, params }) => {
  await removePackageOutline({ actor: user, deviceId: readIdParam(params.id, "device") });
  return { ok: true };
});
