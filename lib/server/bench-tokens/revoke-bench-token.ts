import "server-only";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { toBenchTokenSummary, type BenchTokenSummary } from "./bench-token-summary";
import { lockOwnRow } from "../auth/own-row";

export async function revokeBenchToken(opts: { actor: SessionUser; tokenId: number }): Promise<BenchTokenSummary> {
  const { BenchToken, sequelize } = db();
  authorize(opts.actor, "bench-tokens");
  return sequelize.transaction(async (transaction) => {
    const row = await lockOwnRow(BenchToken, opts.tokenId, opts.actor, transaction, "bench token");
    if (!row.revokedAt) {
      row.revokedAt = new Date();
      await row.save({ transaction });
      await recordAuditEvent(
        { organizationId: row.organizationId, actorUserId: opts.actor.id, action: "bench-token.revoke", subjectType: "bench-token", subjectId: row.id, before: { revoked: false }, after: { revoked: true } },
        transaction,
      );
    }
    return toBenchTokenSummary(row);
  });
}
