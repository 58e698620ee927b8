import { instrumentBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { saveInstrument } from "@/lib/server/instruments/save-instrument";

export const POST = route({ access: "instrument:manage", body: instrumentBodySchema }, async ({ user, body }) =>
  Response.json({ instrument: await saveInstrument({ actor: user, input: body }) }, { status: 201 }),
);
