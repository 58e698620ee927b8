import "server-only";
import bcrypt from "bcryptjs";
import { AppError } from "@/lib/errors";
import { roleLabels } from "@/lib/domain/accounts";
import type { CandidateDecisionBody } from "@/lib/schemas/reviews";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import { lockOwnRow } from "../auth/own-row";
import { isSignInThrottled, recordSignInAttempt } from "../auth/rate-limit";
import type { SessionUser } from "../auth/session-user";
import { requireFreshCandidate } from "./freshness";
import { getCandidate, type CandidateDetail } from "./get-candidate";
import { queueCandidateNotice } from "./notices";

/**
 * A reviewer's decision on a candidate in review. Four eyes: the submitter can never decide,
 * whatever their role is now (the check is on the person, on the locked row). Requesting changes
 * needs a reason. Approving is an electronic signature: the reviewer's password again (a wrong one
 * is refused and counts toward the sign-in limit), a stated meaning, and the candidate's digest
 * recorded with name, role, organization and UTC time (21 CFR Part 11 §11.50, §11.70, §11.200(a)).
 * With the organization's required number of signatures, the candidate is approved.
 */
export async function decideCandidate(opts: { reviewer: SessionUser; candidateId: number; body: CandidateDecisionBody; clientAddress: string }): Promise<CandidateDetail> {
  const { SheetCandidate, SheetSignature, User, sequelize } = db();
  const { reviewer, candidateId, body } = opts;
  authorize(reviewer, "sheet-review");
  const existing = await SheetCandidate.findOne({ where: { id: candidateId, organizationId: reviewer.organizationId } });
  if (!existing) throw new AppError("not-found", "No such sheet candidate in your organization.");
  refuseOwn(existing.submittedById, reviewer);
  if (body.decision === "approve") {
    await verifySigningPassword(reviewer, body.password, opts.clientAddress);
    await requireFreshCandidate(existing);
  }

  await sequelize.transaction(async (transaction) => {
    const candidate = await lockOwnRow(SheetCandidate, candidateId, reviewer, transaction, "sheet candidate");
    refuseOwn(candidate.submittedById, reviewer);
    if (candidate.state !== "in-review") throw new AppError("conflict", `Candidate #${candidate.id} is not in review (it is ${candidate.state}).`);
    const before = { state: candidate.state };
    if (body.decision === "request-changes") {
      candidate.state = "changes-requested";
      candidate.changeRequest = body.reason;
      candidate.decidedById = reviewer.id;
      candidate.decidedAt = new Date();
      await candidate.save({ transaction });
      await recordAuditEvent(
        { organizationId: reviewer.organizationId, actorUserId: reviewer.id, action: "sheet-candidate.changes-requested", subjectType: "sheet-candidate", subjectId: candidate.id, before, after: { state: candidate.state, reason: body.reason } },
        transaction,
      );
      await queueCandidateNotice({ event: "changes-requested", candidate, reason: body.reason }, transaction);
      return;
    }
    const signedBefore = await SheetSignature.count({ where: { candidateId: candidate.id, signerId: reviewer.id }, transaction });
    if (signedBefore > 0) throw new AppError("conflict", "You have signed this candidate already; it needs another reviewer's signature.");
    const signer = await User.findByPk(reviewer.id, { attributes: ["name", "role"], transaction });
    const signature = await SheetSignature.create(
      {
        organizationId: reviewer.organizationId,
        candidateId: candidate.id,
        signerId: reviewer.id,
        printedName: signer?.name ?? reviewer.name,
        roleWord: roleLabels[signer?.role ?? reviewer.role],
        organizationName: reviewer.organizationName,
        meaning: body.meaning,
        candidateDigest: candidate.modelDigest,
        signedAt: new Date(),
      },
      { transaction },
    );
    const count = await SheetSignature.count({ where: { candidateId: candidate.id }, transaction });
    const approved = count >= candidate.requiredSignatures;
    if (approved) {
      candidate.state = "approved";
      candidate.decidedById = reviewer.id;
      candidate.decidedAt = new Date();
      await candidate.save({ transaction });
    }
    await recordAuditEvent(
      {
        organizationId: reviewer.organizationId,
        actorUserId: reviewer.id,
        action: "sheet-candidate.signed",
        subjectType: "sheet-candidate",
        subjectId: candidate.id,
        before: { ...before, signatures: count - 1 },
        after: { state: candidate.state, signatures: count, signatureId: signature.id, meaning: body.meaning, digest: candidate.modelDigest },
      },
      transaction,
    );
    await queueCandidateNotice({ event: "signed", candidate, signerName: signature.printedName, approved }, transaction);
  });
  return getCandidate({ viewer: reviewer, candidateId });
}

function refuseOwn(submittedById: number, reviewer: SessionUser): void {
  if (submittedById === reviewer.id) throw new AppError("forbidden", "You submitted this sheet; another reviewer must decide on it.");
}

/**
 * The second identification component at the moment of signing: the signed-in account's password,
 * checked as sign-in checks it, throttled and counted with sign-in failures.
 */
async function verifySigningPassword(reviewer: SessionUser, password: string, address: string): Promise<void> {
  const { User } = db();
  if (await isSignInThrottled(reviewer.email, address)) {
    throw new AppError("rate-limited", "Too many wrong passwords: wait a quarter of an hour before signing again.");
  }
  const user = await User.findByPk(reviewer.id, { attributes: ["passwordHash"] });
  const ok = user ? await bcrypt.compare(password, user.passwordHash) : false;
  await recordSignInAttempt(reviewer.email, address, ok);
  if (!ok) {
    throw new AppError("invalid", "The password is not correct: the signature was not recorded.", {
      fields: [{ field: "password", message: "The password is not correct." }],
    });
  }
}
