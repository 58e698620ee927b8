import { instrumentBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { listInstruments } from "@/lib/server/instruments/list-instruments";
import { saveInstrument } from "@/lib/server/instruments/save-instrument";

// The register as the admin page shows it; engineers pick from GET /api/instruments.
export const GET = route({ resource: "instrument-admin" }, async ({ user }) => ({ instruments: await listInstruments(user.organizationId) }));

export const POST = route({ resource: "instrument-admin", body: instrumentBodySchema }, async ({ user, body }) =>
  Response.json({ instrument: await saveInstrument({ actor: user, input: body }) }, { status: 201 }),
);
