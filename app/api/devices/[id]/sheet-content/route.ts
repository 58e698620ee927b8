import { sheetContentBodySchema } from "@/lib/schemas/sheets";
import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { saveSheetContent } from "@/lib/server/sheets/save-sheet-content";

export const PUT = route({ resource: "sheet-edit", body: sheetContentBodySchema, maxBodyBytes: 256 * 1024 }, async ({ user, params, body }) => {
  await saveSheetContent({ actor: user, deviceId: readIdParam(params.id, "device"), input: body });
  return { ok: true };
});
