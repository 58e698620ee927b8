import { specLimitsBodySchema } from "@/lib/schemas/sheets";
import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { saveSpecLimits } from "@/lib/server/sheets/save-spec-limits";

export const PUT = route({ resource: "sheet-edit", body: specLimitsBodySchema, maxBodyBytes: 256 * 1024 }, async ({ user, params, body }) => ({
  saved: await saveSpecLimits({ actor: user, deviceId: readIdParam(params.id, "device"), input: body }),
}));
