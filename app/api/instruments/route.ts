import { route } from "@/lib/server/auth/guard";
import { listInstruments } from "@/lib/server/instruments/list-instruments";

// Whoever reads devices reads the register their sets cite (engineers pick from it at upload); only admins change it.
export const GET = route({ resource: "devices" }, async ({ user }) => ({ instruments: await listInstruments(user.organizationId) }));
