import { columnMappingBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { listColumnMappings } from "@/lib/server/column-mappings/list-column-mappings";
import { saveColumnMapping } from "@/lib/server/column-mappings/save-column-mapping";

export const GET = route({ resource: "measurement-upload" }, async ({ user }) => ({ columnMappings: await listColumnMappings(user.organizationId) }));

export const POST = route({ resource: "measurement-upload", body: columnMappingBodySchema }, async ({ user, body }) =>
  Response.json({ columnMapping: await saveColumnMapping({ actor: user, input: body }) }, { status: 201 }),
);
