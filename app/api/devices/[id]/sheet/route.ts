import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { buildDraftSheet } from "@/lib/server/sheets/load-draft-sheet";

export const GET = route({ resource: "sheet-drafts" }, async ({ user, params }) => ({
  sheet: await buildDraftSheet(user, readIdParam(params.id, "device")),
}));
