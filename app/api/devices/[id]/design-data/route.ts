import { designDataBodySchema } from "@/lib/schemas/sheets";
import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { saveDesignData } from "@/lib/server/sheets/save-design-data";

export const PUT = route({ resource: "sheet-edit", body: designDataBodySchema, maxBodyBytes: 256 * 1024 }, async ({ user, params, body }) => {
  await saveDesignData({ actor: user, deviceId: readIdParam(params.id, "device"), input: body });
  return { ok: true };
});
