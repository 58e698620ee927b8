import "server-only";
import { db } from "@/models";

export async function listColumnMappings(organizationId: number) {
  const { ColumnMapping } = db();
  const rows = await ColumnMapping.findAll({ where: { organizationId }, order: [["name", "ASC"]] });
  return rows.map((r) => ({ id: r.id, name: r.name, kind: r.kind, mapping: r.mapping, updatedAt: r.updatedAt.toISOString() }));
}
