import "server-only";
import { Op } from "sequelize";
import { AppError } from "@/lib/errors";
import { datasheetPath, datasheetPdfPath, type RevisionStanding, type RevisionSummary } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import { db } from "@/models";
import type { Device, Organization, SheetRevision, SheetRevisionWithdrawal, User } from "@/models";
import { authorize } from "../auth/authorize";
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
async function revisionSummaries(where: { deviceId?: number; id?: number }): Promise<RevisionSummary[]> {
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

/** The stored PDF bytes of a released revision, exactly as released. */
export async function readRevisionPdf(revisionId: number): Promise<{ pdf: Buffer; sha256: string }> {
  const row = await db().SheetRevision.unscoped().findByPk(revisionId, { attributes: ["pdf", "pdfSha256"] });
  if (!row) throw new AppError("not-found", "No such revision.");
  return { pdf: row.pdf, sha256: row.pdfSha256 };
}
