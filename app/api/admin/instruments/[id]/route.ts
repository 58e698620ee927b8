import { instrumentBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { saveInstrument } from "@/lib/server/instruments/save-instrument";
import { readIdParam } from "@/lib/server/route-params";

export const PATCH = route({ resource: "instrument-admin", body: instrumentBodySchema }, async ({ user, body, params }) => ({
  instrument: await saveInstrument({ actor: user, input: body, instrumentId: readIdParam(params.id, "instrument") }),
}));
