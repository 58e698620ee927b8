import "server-only";
import { Op, QueryTypes } from "sequelize";
import { AppError } from "@/lib/errors";
import { datasheetPath, datasheetPdfPath, type RevisionStanding, type RevisionSummary } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import { db } from "@/models";
import type { Device, Organization, SheetRevision, SheetRevisionWithdrawal, User } from "@/models";
import { authorize } from "../auth/authorize";
import { publicSelect } from "../db/public-reads";
import { readObject } from "../storage/stored-objects";
import type { SessionUser } from "../auth/session-user";

type RevisionRow = SheetRevision & { SheetRevisionWithdrawal?: SheetRevisionWithdrawal | null };

/** A device's released revisions, newest first, for anyone of its organization who reads devices. */
export async function listDeviceRevisions(opts: { viewer: SessionUser; deviceId: number }): Promise<RevisionSummary[]> {
  authorize(opts.viewer, "devices");
  const { Device } = db();
  const device = await Device.findOne({ where: { id: opts.deviceId, organizationId: opts.viewer.organizationId }, attributes: ["id"] });
  if (!device) throw new AppError("not-found", "No such device in your organization.");
  return revisionSummaries({ deviceId: device.id });
}

export async function getRevision(revisionId: number): Promise<RevisionSummary> {
  const [summary] = await revisionSummaries({ id: revisionId });
  if (!summary) throw new AppError("not-found", "No such revision.");
  return summary;
}

/** Summaries of the revisions matching `where` (one device's, or one), newest first. */
export async function revisionSummaries(where: { deviceId?: number; id?: number }): Promise<RevisionSummary[]> {
  const { SheetRevision, SheetRevisionWithdrawal, SheetSignature, Device, Organization, User } = db();
  const rows = (await SheetRevision.findAll({
    where: where.id !== undefined ? { id: where.id } : { deviceId: where.deviceId },
    include: [{ model: SheetRevisionWithdrawal }],
    order: [["sequence", "DESC"]],
  })) as RevisionRow[];
  if (!rows.length) return [];
  const deviceId = rows[0].deviceId;
  const device = (await Device.findByPk(deviceId, { attributes: ["partNumber", "organizationId"], include: [{ model: Organization, attributes: ["slug"] }] })) as Device & { Organization: Organization };
  const later = await SheetRevision.findAll({ where: { deviceId, previousRevisionId: { [Op.in]: rows.map((r) => r.id) } }, attributes: ["previousRevisionId"] });
  const superseded = new Set(later.map((r) => r.previousRevisionId));
  const signatures = await SheetSignature.findAll({ where: { candidateId: { [Op.in]: rows.map((r) => r.candidateId) } }, order: [["id", "ASC"]] });
  const people = await User.findAll({
    where: { id: { [Op.in]: [...rows.map((r) => r.releasedById), ...rows.flatMap((r) => (r.SheetRevisionWithdrawal ? [r.SheetRevisionWithdrawal.withdrawnById] : []))] } },
    attributes: ["id", "name"],
  });
  const nameOf = new Map(people.map((p: User) => [p.id, p.name]));
  const slug = device.Organization.slug;
  return rows.map((r) => {
    const w = r.SheetRevisionWithdrawal ?? null;
    const standing: RevisionStanding = w ? "withdrawn" : superseded.has(r.id) ? "superseded" : "current";
    return {
      id: r.id,
      deviceId: r.deviceId,
      letter: r.letter,
      releasedAt: r.releasedAt.toISOString(),
      releasedBy: { id: r.releasedById, name: nameOf.get(r.releasedById) ?? "" },
      signers: signatures.filter((s) => s.candidateId === r.candidateId).map((s) => ({ name: s.printedName, roleWord: s.roleWord, signedAt: s.signedAt.toISOString() })),
      standing,
      withdrawal: w ? { reason: w.reason, withdrawnAt: w.withdrawnAt.toISOString(), by: nameOf.get(w.withdrawnById) ?? "" } : null,
      notes: r.releaseNotes,
      pdfSha256: r.pdfSha256,
      pdfBytes: r.pdfBytes,
      reference: r.reference,
      publicPath: datasheetPath(slug, device.partNumber, r.letter),
      pdfPath: datasheetPdfPath(slug, device.partNumber, r.letter),
    };
  });
}

export type ReleasedSheet = { summary: RevisionSummary; model: SheetModel; history: RevisionSummary[] };

/**
 * A released revision by its public address: organization slug, part number, and a letter or
 * "current" (the newest revision that is not withdrawn). Anyone may read it; nothing of a draft.
 */
export async function findReleasedRevision(opts: { organizationSlug: string; partNumber: string; revision: string }): Promise<ReleasedSheet> {
  const { Organization, Device, SheetRevision } = db();
  const organization = await Organization.findOne({ where: { slug: opts.organizationSlug }, attributes: ["id"] });
  const device = organization ? await Device.findOne({ where: { organizationId: organization.id, partNumber: opts.partNumber }, attributes: ["id"] }) : null;
  const history = device ? await revisionSummaries({ deviceId: device.id }) : [];
  const summary =
    opts.revision === "current" ? history.find((r) => r.standing === "current") : history.find((r) => r.letter === opts.revision);
  if (!summary) throw new AppError("not-found", "No such released sheet.");
  const row = await SheetRevision.unscoped().findByPk(summary.id, { attributes: ["modelJson"] });
  return { summary, model: JSON.parse(row!.modelJson) as SheetModel, history };
}

/** A released revision by its verification reference, as printed in its PDF's footer. */
export async function findRevisionByReference(reference: string): Promise<RevisionSummary> {
  const { SheetRevision } = db();
  const row = await SheetRevision.findOne({ where: { reference: reference.trim().toUpperCase() }, attributes: ["id"] });
  if (!row) throw new AppError("not-found", "No released sheet has this verification reference.");
  return getRevision(row.id);
}

/** The stored PDF bytes of a released revision, exactly as released: read from the file store and checked against its SHA-256. */
export async function readRevisionPdf(revisionId: number): Promise<{ pdf: Buffer; sha256: string }> {
  const row = await db().SheetRevision.unscoped().findByPk(revisionId, { attributes: ["pdfKey", "pdfSha256", "pdfBytes", "letter"] });
  if (!row) throw new AppError("not-found", "No such revision.");
  const pdf = await readObject({ key: row.pdfKey, sha256: row.pdfSha256, sizeBytes: row.pdfBytes }, `the released PDF of Rev. ${row.letter}`);
  return { pdf, sha256: row.pdfSha256 };
}

export type ReleasedPdf = { revisionId: number; letter: string; standing: RevisionStanding; sha256: string; pdf: Buffer };

// A revision's PDF bytes never change (the table refuses it, the key is their hash), so the last few verified ones are kept in memory by
// revision id; only the revision's standing (current, superseded, withdrawn) is read each time.
const PDF_ENTRIES = 32;
const pdfBytes = new Map<number, Buffer>();

/**
 * The stored PDF of a released revision by its public address, in one indexed query (the letter, or
 * the newest revision not withdrawn for "current", with its standing) and, unless it is among the
 * last few sent, one read of the bytes: a download is a lookup and a send.
 */
export async function findReleasedPdf(opts: { organizationSlug: string; partNumber: string; revision: string }): Promise<ReleasedPdf> {
  const row = await locateReleasedRevision(opts);
  const standing = row.standing;
  let pdf = pdfBytes.get(row.id);
  if (pdf) {
    pdfBytes.delete(row.id);
  } else {
    pdf = (await readRevisionPdf(row.id)).pdf;
  }
  pdfBytes.set(row.id, pdf);
  if (pdfBytes.size > PDF_ENTRIES) pdfBytes.delete(pdfBytes.keys().next().value!);
  return { revisionId: row.id, letter: row.letter, standing, sha256: row.pdfSha256, pdf };
}

/** A released revision's row as its public address finds it: what every download reads before its bytes. */
export type ReleasedRevisionHead = { id: number; deviceId: number; letter: string; pdfSha256: string; standing: RevisionStanding };

/**
 * A released revision by its public address in one indexed query: the letter, or the newest revision
 * not withdrawn for "current", with its standing. The downloads (PDF, CSV, Touchstone) start here and
 * keep what they make from the frozen model by the revision id, which never changes meaning.
 */
export async function locateReleasedRevision(opts: { organizationSlug: string; partNumber: string; revision: string }): Promise<ReleasedRevisionHead> {
  const current = opts.revision === "current";
  // The lookup may come from a read replica (public data); the bytes from the file store.
  const rows = await publicSelect<{ id: number; device_id: number; letter: string; pdf_sha256: string; withdrawn: number; superseded: number }>(
    `SELECT r.id, r.device_id, r.letter, r.pdf_sha256,
            EXISTS (SELECT 1 FROM sheet_revision_withdrawals w WHERE w.revision_id = r.id) AS withdrawn,
            EXISTS (SELECT 1 FROM sheet_revisions n WHERE n.previous_revision_id = r.id) AS superseded
       FROM organizations o
       JOIN devices d ON d.organization_id = o.id AND d.part_number = :part
       JOIN sheet_revisions r ON r.device_id = d.id
      WHERE o.slug = :slug AND (:current OR r.letter = :letter)
        ${current ? "AND NOT EXISTS (SELECT 1 FROM sheet_revision_withdrawals w WHERE w.revision_id = r.id)" : ""}
      ORDER BY r.sequence DESC LIMIT 1`,
    { slug: opts.organizationSlug, part: opts.partNumber, current, letter: opts.revision },
  );
  const row = rows[0];
  // "current" is the newest revision, and only while it is not withdrawn.
  if (!row || (current && Number(row.superseded))) throw new AppError("not-found", "No such released sheet.");
  const standing: RevisionStanding = Number(row.withdrawn) ? "withdrawn" : Number(row.superseded) ? "superseded" : "current";
  return { id: Number(row.id), deviceId: Number(row.device_id), letter: row.letter, pdfSha256: row.pdf_sha256, standing };
}
