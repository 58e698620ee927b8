import { route } from "@/lib/server/auth/guard";
import { listInstruments } from "@/lib/server/instruments/list-instruments";

// Every member may see the instrument list (engineers pick from it at upload); only admins change it.
export const GET = route({ access: "device:read" }, async ({ user }) => ({ instruments: await listInstruments(user.organizationId) }));
