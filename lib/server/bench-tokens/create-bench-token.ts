import "server-only";
import { randomBytes } from "node:crypto";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { hashToken } from "../crypto";
import { toBenchTokenSummary, type BenchTokenSummary } from "./bench-token-summary";

/** The plaintext token is returned once, here; the database keeps its SHA-256 and a short prefix to recognise it by. */
export async function createBenchToken(opts: { actor: SessionUser; name: string }): Promise<{ token: string; benchToken: BenchTokenSummary }> {
  const { BenchToken, sequelize } = db();
  authorize(opts.actor, "bench-tokens");
  const token = `bfd_${randomBytes(30).toString("base64url")}`;
  return sequelize.transaction(async (transaction) => {
    const row = await BenchToken.create(
      { organizationId: opts.actor.organizationId, createdById: opts.actor.id, name: opts.name, tokenPrefix: token.slice(0, 10), tokenHash: hashToken(token) },
      { transaction },
    );
    await recordAuditEvent(
      { organizationId: opts.actor.organizationId, actorUserId: opts.actor.id, action: "bench-token.create", subjectType: "bench-token", subjectId: row.id, after: { name: row.name, prefix: row.tokenPrefix } },
      transaction,
    );
    return { token, benchToken: toBenchTokenSummary(row) };
  });
}
