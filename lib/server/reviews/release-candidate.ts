import "server-only";
import { randomInt } from "node:crypto";
import { AppError } from "@/lib/errors";
import { datasheetPath, signatureMeaningWords } from "@/lib/domain/reviews";
import type { ReleaseBody } from "@/lib/schemas/reviews";
import { releaseSheetModel, revisionLetter, serializeSheetModel, type SheetModel } from "@/lib/sheet";
import { db } from "@/models";
import type { Organization } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { indexReleasedRevision } from "../catalog/index-released-revision";
import { authorize } from "../auth/authorize";
import { lockOwnRow } from "../auth/own-row";
import type { SessionUser } from "../auth/session-user";
import { serverConfig } from "../config";
import { sheetPdfRenderPool } from "../pdf/pdf-render-pool";
import { putObject } from "../storage/stored-objects";
import { historySummary, modelDigest } from "./candidate-model";
import { releaseNotesFor } from "./release-notes";
import { requireFreshCandidate } from "./freshness";
import { queueCandidateNotice } from "./notices";
import { utcDate } from "./utc-date";
import { getRevision } from "./list-revisions";
import { retryOnDeadlock } from "../outbox/retry-on-deadlock";
import type { RevisionSummary } from "@/lib/domain/reviews";

/**
 * Releases an approved candidate, all in one MariaDB transaction: the candidate row is locked
 * (so of concurrent requests exactly one proceeds; the others find it released and get 409), the
 * next revision letter is taken, the released model (the candidate plus letter, date, signatures
 * and verification reference) is frozen, its PDF rendered once and written to the file store (its
 * SHA-256, size and key in the row), the
 * release notes written, the previous revision superseded (named as `previous_revision_id`), the
 * audit event and the notices queued. Any failure rolls all of it back: no revision (a PDF already
 * written stays in the store only as an unreferenced copy under its content key).
 */
export async function releaseCandidate(opts: { engineer: SessionUser; candidateId: number; body: ReleaseBody }): Promise<RevisionSummary> {
  const { SheetCandidate, SheetRevision, SheetSignature, Organization, Device, sequelize } = db();
  const { engineer, candidateId, body } = opts;
  authorize(engineer, "sheet-release");
  const existing = await SheetCandidate.findOne({ where: { id: candidateId, organizationId: engineer.organizationId } });
  if (!existing) throw new AppError("not-found", "No such sheet candidate in your organization.");
  if (existing.state !== "approved") throw new AppError("conflict", notApproved(existing.state, existing.id));
  await requireFreshCandidate(existing);

  // Should InnoDB still pick this transaction as a deadlock victim, it runs again from the start.
  const revisionId = await retryOnDeadlock(() => sequelize.transaction(async (transaction) => {
    const candidate = await lockOwnRow(SheetCandidate, candidateId, engineer, transaction, "sheet candidate");
    if (candidate.state !== "approved") throw new AppError("conflict", notApproved(candidate.state, candidate.id));
    // Releases of one device queue on the device's row (a record lock). The latest revision is then
    // read without a lock: a locking read that finds no revision locks the gap of the device index
    // where one would go, the same gap for every device newer than all released ones, and two first
    // releases at once both inserted into it and deadlocked (one answered 500). This plain read is the
    // transaction's first, so its snapshot is taken after the device lock: it sees every revision
    // committed by an earlier holder of that lock.
    await Device.findByPk(candidate.deviceId, { attributes: ["id"], lock: transaction.LOCK.UPDATE, transaction });
    const previous = await SheetRevision.unscoped().findOne({
      where: { deviceId: candidate.deviceId },
      order: [["sequence", "DESC"]],
      attributes: ["id", "sequence", "modelJson"],
      transaction,
    });
    const signatures = await SheetSignature.findAll({ where: { candidateId: candidate.id }, order: [["id", "ASC"]], transaction });
    if (signatures.length < candidate.requiredSignatures) throw new AppError("conflict", "The candidate lacks the signatures its organization requires.");
    const organization = (await Organization.findByPk(candidate.organizationId, { attributes: ["slug"], transaction })) as Organization;
    const candidateModel = JSON.parse(candidate.modelJson) as SheetModel;
    const sequence = (previous?.sequence ?? 0) + 1;
    const letter = revisionLetter(sequence);
    const reference = verificationReference();
    const releasedAt = new Date();
    const notes = releaseNotesFor(previous ? (JSON.parse(previous.modelJson) as SheetModel) : null, candidateModel, body.note);
    const model = releaseSheetModel(candidateModel, {
      revisionLabel: letter,
      releasedOn: utcDate(releasedAt),
      signatures: signatures.map((s) => ({
        name: s.printedName,
        role: s.roleWord,
        organizationName: s.organizationName,
        signedAt: `${s.signedAt.toISOString().slice(0, 19)}Z`,
        meaning: signatureMeaningWords[s.meaning],
        candidateDigest: s.candidateDigest,
      })),
      verificationReference: reference,
      verificationUrl: `${serverConfig.appUrl}/r/${reference}`,
      notes,
      earlierRevisions: candidateModel.revisionHistory,
      summary: historySummary(notes),
    });
    const json = serializeSheetModel(model);
    const pdf = await sheetPdfRenderPool().render(model);
    // To the file store before the revision row: a store that refuses the PDF throws a 503 and the
    // transaction rolls back, so a failed upload leaves no revision.
    const storedPdf = await putObject({ bytes: pdf, contentType: "application/pdf" }, transaction);
    const revision = await SheetRevision.create(
      {
        organizationId: candidate.organizationId,
        deviceId: candidate.deviceId,
        candidateId: candidate.id,
        sequence,
        letter,
        previousRevisionId: previous?.id ?? null,
        modelJson: json,
        modelDigest: modelDigest(json),
        pdfSha256: storedPdf.sha256,
        pdfBytes: storedPdf.sizeBytes,
        reference,
        releaseNotes: notes,
        engineerNote: body.note,
        releasedById: engineer.id,
        releasedAt,
      },
      { transaction },
    );
    const device = await Device.findByPk(candidate.deviceId, { attributes: ["keyConditions"], transaction });
    await indexReleasedRevision(
      { revisionId: revision.id, organizationId: candidate.organizationId, deviceId: candidate.deviceId, letter, releasedAt, model, keyConditions: device?.keyConditions ?? {} },
      transaction,
    );
    candidate.state = "released";
    candidate.openDeviceId = null;
    candidate.closedAt = releasedAt;
    await candidate.save({ transaction });
    await recordAuditEvent(
      {
        organizationId: engineer.organizationId,
        actorUserId: engineer.id,
        action: "sheet.released",
        subjectType: "sheet-revision",
        subjectId: revision.id,
        before: { candidateState: "approved", previousRevisionId: previous?.id ?? null },
        after: { letter, candidateId: candidate.id, modelDigest: revision.modelDigest, pdfSha256: revision.pdfSha256, path: datasheetPath(organization.slug, candidateModel.header.partNumber, letter) },
      },
      transaction,
    );
    await queueCandidateNotice({ event: "released", candidate, letter, revisionId: revision.id }, transaction);
    return revision.id;
  }));
  return getRevision(revisionId);
}

function notApproved(state: string, id: number): string {
  return state === "released" ? `Candidate #${id} is released already.` : `Candidate #${id} is not approved (it is ${state}).`;
}

// Crockford's base-32 alphabet: no I, L, O or U, so a reference read off paper is not misread.
const ALPHABET = "0123456789ABCDEFGHJKMNPQRSTVWXYZ";

/** A short random reference printed in the PDF's footer, "7KQ2M-XR4TD": 50 bits, unique by index. */
export function verificationReference(): string {
  let s = "";
  for (let i = 0; i < 10; i++) s += ALPHABET[randomInt(32)];
  return `${s.slice(0, 5)}-${s.slice(5)}`;
}
