import "server-only";
import { Op } from "sequelize";
import { AppError } from "@/lib/errors";
import { openCandidateStates } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import { db } from "@/models";
import type { SheetCandidate } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { buildCandidateModel } from "./candidate-model";
import { describeSheetChange } from "./describe-change";
import { queueCandidateNotice } from "./notices";

/**
 * Whether what the candidate froze is still what the sheet shows: the candidate model is built
 * again from today's data with the candidate's own date and compared by digest. A changed
 * sheet closes the candidate as stale, with the changes as the reason, and tells the submitter
 * and the reviewers who acted on it.
 */
export async function checkCandidateFreshness(candidate: SheetCandidate): Promise<{ fresh: true } | { fresh: false; reason: string }> {
  const current = await buildCandidateModel({ organizationId: candidate.organizationId, deviceId: candidate.deviceId, date: candidate.modelDate });
  if (current.digest === candidate.modelDigest) return { fresh: true };
  const before = JSON.parse(candidate.modelJson) as SheetModel;
  const lines = describeSheetChange(before, current.model);
  const reason = `The sheet changed after it was submitted: ${lines.join("; ")}. The review starts over with a new submission.`;
  await markStale(candidate.id, reason);
  return { fresh: false, reason };
}

/** Refuses to act on a candidate whose sheet changed since submission (409), after marking it stale. */
export async function requireFreshCandidate(candidate: SheetCandidate): Promise<void> {
  const check = await checkCandidateFreshness(candidate);
  if (!check.fresh) throw new AppError("conflict", check.reason, { stale: true });
}

/**
 * After a change that may alter sheets (limits, prose, ratings, an approved set, the device, an
 * instrument): checks every open candidate of the device, or of the organization when no device
 * is named. Called after the change commits; a failure here never undoes the change.
 */
export async function refreshOpenCandidates(opts: { organizationId: number; deviceId?: number }): Promise<void> {
  const { SheetCandidate } = db();
  try {
    const open = await SheetCandidate.findAll({
      where: {
        organizationId: opts.organizationId,
        ...(opts.deviceId !== undefined ? { deviceId: opts.deviceId } : {}),
        state: { [Op.in]: [...openCandidateStates] },
      },
    });
    for (const candidate of open) await checkCandidateFreshness(candidate);
  } catch (error) {
    console.error("[benchfold] could not check open sheet candidates", error);
  }
}

async function markStale(candidateId: number, reason: string): Promise<void> {
  const { SheetCandidate, sequelize } = db();
  await sequelize.transaction(async (transaction) => {
    const candidate = await SheetCandidate.findByPk(candidateId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!candidate || !openCandidateStates.includes(candidate.state)) return;
    const before = { state: candidate.state };
    candidate.state = "stale";
    candidate.staleReason = reason;
    candidate.openDeviceId = null;
    candidate.closedAt = new Date();
    await candidate.save({ transaction });
    await recordAuditEvent(
      { organizationId: candidate.organizationId, actorUserId: null, action: "sheet-candidate.stale", subjectType: "sheet-candidate", subjectId: candidate.id, before, after: { state: "stale", reason } },
      transaction,
    );
    await queueCandidateNotice({ event: "stale", candidate, reason }, transaction);
  });
}
