import "server-only";
import { AppError } from "@/lib/errors";
import type { ReviewMeasurementBody } from "@/lib/schemas/measurements";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetSummary } from "./measurement-set-summary";
import { lockOwnRow } from "../auth/own-row";
import { refreshOpenCandidates } from "../reviews/freshness";
import { raiseConformityAlerts } from "../conformity/raise-conformity-alerts";

/**
 * Approves or rejects a submitted set. Four eyes: whoever uploaded it cannot decide on it.
 * Organization, state and uploader are checked on the locked row inside the transaction.
 */
export async function reviewMeasurementSet(opts: { reviewer: SessionUser; setId: number; body: ReviewMeasurementBody }): Promise<MeasurementSetSummary> {
  const { MeasurementSet, sequelize } = db();
  const { reviewer, setId, body } = opts;
  authorize(reviewer, "measurement-review");
  await sequelize.transaction(async (transaction) => {
    const set = await lockOwnRow(MeasurementSet, setId, reviewer, transaction, "measurement set");
    if (set.uploadedById === reviewer.id) throw new AppError("forbidden", "You uploaded this set; another reviewer must decide on it.");
    if (set.state !== "submitted") throw new AppError("conflict", `Measurement set #${set.id} is already ${set.state}.`);
    const before = { state: set.state };
    set.state = body.decision === "approve" ? "approved" : "rejected";
    set.reviewedById = reviewer.id;
    set.reviewedAt = new Date();
    set.rejectionReason = body.decision === "reject" ? body.reason : null;
    await set.save({ transaction });
    await recordAuditEvent(
      {
        organizationId: reviewer.organizationId,
        actorUserId: reviewer.id,
        action: `measurement-set.${body.decision}`,
        subjectType: "measurement-set",
        subjectId: set.id,
        before,
        after: { state: set.state, reason: set.rejectionReason },
      },
      transaction,
    );
    // After a release, the set is also read against the current revision (the conformity watch).
    if (set.state === "approved") await raiseConformityAlerts({ set, reviewer, transaction });
  });
  const [summary] = await loadMeasurementSets({ id: setId, organizationId: reviewer.organizationId });
  // An approved set feeds the sheet: an open review of it is now of an out-of-date candidate.
  if (summary.state === "approved") await refreshOpenCandidates({ organizationId: reviewer.organizationId, deviceId: summary.deviceId });
  return summary;
}
