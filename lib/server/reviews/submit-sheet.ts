import "server-only";
import { AppError } from "@/lib/errors";
import type { SubmitCandidateBody } from "@/lib/schemas/reviews";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import { lockOwnRow } from "../auth/own-row";
import type { SessionUser } from "../auth/session-user";
import { buildCandidateModel } from "./candidate-model";
import { getCandidate, type CandidateDetail } from "./get-candidate";
import { queueCandidateNotice } from "./notices";
import { utcDate } from "./utc-date";

/**
 * An engineer submits a device's draft for review. Every issue the sheet lists must be
 * acknowledged with a reason (the reviewer sees them); the sheet model as it stands is frozen as
 * the candidate with its digest. An open candidate of the device that asked for changes, or that
 * the sheet has moved past, is closed as replaced; an identical one still in review is a 409.
 */
export async function submitSheet(opts: { engineer: SessionUser; deviceId: number; body: SubmitCandidateBody }): Promise<CandidateDetail> {
  const { Device, Organization, SheetCandidate, SheetRevision, sequelize } = db();
  const { engineer, deviceId, body } = opts;
  authorize(engineer, "sheet-release");
  const date = utcDate(new Date());
  const frozen = await buildCandidateModel({ organizationId: engineer.organizationId, deviceId, date });
  const acknowledgements = matchAcknowledgements(frozen.model.issues, body.acknowledgements);

  const candidateId = await sequelize.transaction(async (transaction) => {
    await lockOwnRow(Device, deviceId, engineer, transaction, "device");
    const open = await SheetCandidate.findOne({ where: { openDeviceId: deviceId }, lock: transaction.LOCK.UPDATE, transaction });
    if (open) {
      if (open.modelDigest === frozen.digest && (open.state === "in-review" || open.state === "approved")) {
        throw new AppError("conflict", `This sheet is already ${open.state === "approved" ? "approved; release it" : "in review"} exactly as it stands (candidate #${open.id}).`);
      }
      const before = { state: open.state };
      open.state = "stale";
      open.staleReason = `Replaced by a new submission on ${date}.`;
      open.openDeviceId = null;
      open.closedAt = new Date();
      await open.save({ transaction });
      await recordAuditEvent(
        { organizationId: engineer.organizationId, actorUserId: engineer.id, action: "sheet-candidate.replaced", subjectType: "sheet-candidate", subjectId: open.id, before, after: { state: "stale", reason: open.staleReason } },
        transaction,
      );
    }
    const organization = await Organization.findByPk(engineer.organizationId, { attributes: ["requiredSignatures"], transaction });
    const previous = await SheetRevision.findOne({ where: { deviceId }, order: [["sequence", "DESC"]], attributes: ["id"], transaction });
    const candidate = await SheetCandidate.create(
      {
        organizationId: engineer.organizationId,
        deviceId,
        openDeviceId: deviceId,
        state: "in-review",
        modelJson: frozen.json,
        modelDigest: frozen.digest,
        modelDate: date,
        acknowledgements,
        note: body.note,
        requiredSignatures: organization?.requiredSignatures ?? 1,
        comparedRevisionId: previous?.id ?? null,
        submittedById: engineer.id,
        submittedAt: new Date(),
      },
      { transaction },
    );
    await recordAuditEvent(
      {
        organizationId: engineer.organizationId,
        actorUserId: engineer.id,
        action: "sheet-candidate.submitted",
        subjectType: "sheet-candidate",
        subjectId: candidate.id,
        before: open ? { replacedCandidateId: open.id } : null,
        after: { state: "in-review", deviceId, digest: frozen.digest, acknowledgements, note: body.note },
      },
      transaction,
    );
    await queueCandidateNotice({ event: "submitted", candidate }, transaction);
    return candidate.id;
  });
  return getCandidate({ viewer: engineer, candidateId });
}

/** Every issue acknowledged, and only issues the sheet lists: otherwise a 422 naming them. */
function matchAcknowledgements(issues: { code: string; message: string }[], given: SubmitCandidateBody["acknowledgements"]) {
  const reasons = new Map(given.map((a) => [a.issue, a.reason]));
  const missing = issues.filter((issue) => !reasons.has(issue.message));
  if (missing.length) {
    throw new AppError("invalid", `The sheet lists ${missing.length} open issue${missing.length === 1 ? "" : "s"}: fix each, or acknowledge it with a reason.`, {
      fields: missing.map((issue) => ({ field: "acknowledgements", message: issue.message })),
      issues: missing,
    });
  }
  const known = new Set(issues.map((issue) => issue.message));
  const unknown = given.filter((a) => !known.has(a.issue));
  if (unknown.length) {
    throw new AppError("invalid", "An acknowledgement names an issue the sheet no longer lists: reload the sheet.", {
      fields: unknown.map((a) => ({ field: "acknowledgements", message: a.issue })),
    });
  }
  return issues.map((issue) => ({ code: issue.code, message: issue.message, reason: reasons.get(issue.message)! }));
}
