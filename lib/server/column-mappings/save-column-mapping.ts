import "server-only";
import { createHash } from "node:crypto";
import { AppError } from "@/lib/errors";
import { findMappingProblems, headerKey } from "@/lib/ingest/column-mapping";
import type { ColumnMappingBody } from "@/lib/schemas/measurements";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";

export function headerSignature(headers: string[]): string {
  return createHash("sha256").update(headerKey(headers)).digest("hex");
}

/** Saves (or replaces) the organization's mapping for files with exactly these headers. */
export async function saveColumnMapping(opts: { actor: SessionUser; input: ColumnMappingBody }): Promise<{ id: number; name: string; kind: string }> {
  const { ColumnMapping, sequelize } = db();
  const { actor, input } = opts;
  authorize(actor, "measurement-upload");
  const problems = findMappingProblems(input.kind, input.headers, input.mapping);
  if (problems.length) throw new AppError("invalid", `The mapping does not fit: ${problems.join("; ")}.`, { field: "mapping", problems });
  const signature = headerSignature(input.headers);
  return sequelize.transaction(async (transaction) => {
    const existing = await ColumnMapping.findOne({ where: { organizationId: actor.organizationId, headerSignature: signature }, lock: transaction.LOCK.UPDATE, transaction });
    const stored = { entries: input.mapping, metadata: input.metadata };
    const row = existing
      ? await existing.update({ name: input.name, kind: input.kind, mapping: stored }, { transaction })
      : await ColumnMapping.create({ organizationId: actor.organizationId, createdById: actor.id, name: input.name, kind: input.kind, headerSignature: signature, mapping: stored }, { transaction });
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: existing ? "column-mapping.update" : "column-mapping.create", subjectType: "column-mapping", subjectId: row.id, after: { name: row.name, kind: row.kind, headers: input.headers, mapping: stored } },
      transaction,
    );
    return { id: row.id, name: row.name, kind: row.kind };
  });
}
