import "server-only";
import type { ValueTable } from "@/lib/analysis/tables";
import { db } from "@/models";
import { tabulateStoredSet } from "./get-measurement-set";

/** The per-point tables of a set just stored (the bench API's answer): the caller has the organization already. */
export async function loadSetTables(opts: { organizationId: number; setId: number }): Promise<ValueTable[]> {
  const { MeasurementSet } = db();
  const row = await MeasurementSet.unscoped().findOne({ where: { id: opts.setId, organizationId: opts.organizationId }, attributes: ["kind", "parsed", "conditions"] });
  return row ? tabulateStoredSet(row) : [];
}
