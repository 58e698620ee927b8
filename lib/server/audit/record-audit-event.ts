import "server-only";
import type { Transaction } from "sequelize";
import { db } from "@/models";

export type AuditInput = {
  organizationId: number | null;
  actorUserId: number | null;
  action: string;
  subjectType: string;
  subjectId: string | number;
  before?: unknown;
  after?: unknown;
};

/** Appends one event to the audit trail, inside the caller's transaction when given. */
export async function recordAuditEvent(input: AuditInput, transaction?: Transaction): Promise<void> {
  const { AuditEvent } = db();
  await AuditEvent.create(
    {
      organizationId: input.organizationId,
      actorUserId: input.actorUserId,
      action: input.action,
      subjectType: input.subjectType,
      subjectId: String(input.subjectId),
      before: input.before ?? null,
      after: input.after ?? null,
    },
    { transaction },
  );
}
