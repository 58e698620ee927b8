import "server-only";
import { AppError } from "@/lib/errors";
import { datasheetPath, datasheetPdfPath, type RevisionStanding, type RevisionSummary } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import { db } from "@/models";
import { authorize } from "../auth/authorize";
import { primarySelect, publicLookup, type SelectRows } from "../db/public-reads";
import { readObject } from "../storage/stored-objects";
import type { SessionUser } from "../auth/session-user";

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

type SummaryRow = {
  id: number;
  device_id: number;
  candidate_id: number;
  letter: string;
  released_at: Date | string;
  released_by_id: number;
  released_by_name: string;
  release_notes: string | string[];
  pdf_sha256: string;
  pdf_bytes: number;
  reference: string;
  part_number: string;
  slug: string;
  withdrawal_reason: string | null;
  withdrawn_at: Date | string | null;
  withdrawn_by_name: string;
  superseded: number;
};

/** Which revisions: one device's, one by id, or one part's by its public address (organization slug and part number). */
type RevisionsWhere = { deviceId: number } | { id: number } | { organizationSlug: string; partNumber: string };

/** A DATETIME as the driver returned it (a Date, or its text in UTC: the connection's time zone is +00:00) as ISO 8601. */
function isoTime(value: Date | string): string {
  return value instanceof Date ? value.toISOString() : new Date(`${value.replace(" ", "T")}Z`).toISOString();
}

/**
 * Summaries of the revisions matching `where`, newest first, in two statements. `select` is where
 * they are read: the primary by default (the workspace reads its own releases and withdrawals), or
 * publicSelect for the public pages (see lib/server/db/public-reads.ts).
 */
export async function revisionSummaries(where: RevisionsWhere, select: SelectRows = primarySelect): Promise<RevisionSummary[]> {
  const [condition, replacements] =
    "id" in where
      ? ["r.id = :id", { id: where.id }]
      : "deviceId" in where
        ? ["r.device_id = :deviceId", { deviceId: where.deviceId }]
        : ["o.slug = :slug AND d.part_number = :part", { slug: where.organizationSlug, part: where.partNumber }];
  const rows = await select<SummaryRow>(
    `SELECT r.id, r.device_id, r.candidate_id, r.letter, r.released_at, r.released_by_id, COALESCE(ru.name, '') AS released_by_name,
            r.release_notes, r.pdf_sha256, r.pdf_bytes, r.reference, d.part_number, o.slug,
            w.reason AS withdrawal_reason, w.withdrawn_at, COALESCE(wu.name, '') AS withdrawn_by_name,
            EXISTS (SELECT 1 FROM sheet_revisions n WHERE n.previous_revision_id = r.id) AS superseded
       FROM sheet_revisions r
       JOIN devices d ON d.id = r.device_id
       JOIN organizations o ON o.id = d.organization_id
       LEFT JOIN users ru ON ru.id = r.released_by_id
       LEFT JOIN sheet_revision_withdrawals w ON w.revision_id = r.id
       LEFT JOIN users wu ON wu.id = w.withdrawn_by_id
      WHERE ${condition}
      ORDER BY r.sequence DESC`,
    replacements,
  );
  if (!rows.length) return [];
  const signatures = await select<{ candidate_id: number; printed_name: string; role_word: string; signed_at: Date | string }>(
    "SELECT candidate_id, printed_name, role_word, signed_at FROM sheet_signatures WHERE candidate_id IN (:ids) ORDER BY id",
    { ids: rows.map((r) => r.candidate_id) },
  );
  return rows.map((r) => {
    const withdrawn = r.withdrawn_at !== null;
    const standing: RevisionStanding = withdrawn ? "withdrawn" : Number(r.superseded) ? "superseded" : "current";
    return {
      id: Number(r.id),
      deviceId: Number(r.device_id),
      letter: r.letter,
      releasedAt: isoTime(r.released_at),
      releasedBy: { id: Number(r.released_by_id), name: r.released_by_name },
      signers: signatures
        .filter((s) => Number(s.candidate_id) === Number(r.candidate_id))
        .map((s) => ({ name: s.printed_name, roleWord: s.role_word, signedAt: isoTime(s.signed_at) })),
      standing,
      withdrawal: withdrawn ? { reason: r.withdrawal_reason ?? "", withdrawnAt: isoTime(r.withdrawn_at!), by: r.withdrawn_by_name } : null,
      // A JSON column: the driver may hand it over parsed or as its text.
      notes: typeof r.release_notes === "string" ? (JSON.parse(r.release_notes) as string[]) : r.release_notes,
      pdfSha256: r.pdf_sha256,
      pdfBytes: Number(r.pdf_bytes),
      reference: r.reference,
      publicPath: datasheetPath(r.slug, r.part_number, r.letter),
      pdfPath: datasheetPdfPath(r.slug, r.part_number, r.letter),
    };
  });
}

export type ReleasedSheet = { summary: RevisionSummary; model: SheetModel; history: RevisionSummary[] };

/**
 * A released revision by its public address: organization slug, part number, and a letter or
 * "current" (the newest revision that is not withdrawn). Anyone may read it; nothing of a draft.
 * Public data: read through publicLookup (a replica when one is up and caught up).
 */
export function findReleasedRevision(opts: { organizationSlug: string; partNumber: string; revision: string }): Promise<ReleasedSheet> {
  return publicLookup(async (select) => {
    const history = await revisionSummaries({ organizationSlug: opts.organizationSlug, partNumber: opts.partNumber }, select);
    const summary =
      opts.revision === "current" ? history.find((r) => r.standing === "current") : history.find((r) => r.letter === opts.revision);
    if (!summary) throw new AppError("not-found", "No such released sheet.");
    const [row] = await select<{ model_json: string }>("SELECT model_json FROM sheet_revisions WHERE id = ?", [summary.id]);
    return { summary, model: JSON.parse(row.model_json) as SheetModel, history };
  });
}

/** A released revision by its verification reference, as printed in its PDF's footer (public: through publicLookup). */
export function findRevisionByReference(reference: string): Promise<RevisionSummary> {
  return publicLookup(async (select) => {
    const [row] = await select<{ id: number }>("SELECT id FROM sheet_revisions WHERE reference = ?", [reference.trim().toUpperCase()]);
    const [summary] = row ? await revisionSummaries({ id: Number(row.id) }, select) : [];
    if (!summary) throw new AppError("not-found", "No released sheet has this verification reference.");
    return summary;
  });
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
export function locateReleasedRevision(opts: { organizationSlug: string; partNumber: string; revision: string }): Promise<ReleasedRevisionHead> {
  // The lookup may come from a read replica (public data); the bytes from the file store.
  return publicLookup((select) => locateIn(select, opts));
}

async function locateIn(select: SelectRows, opts: { organizationSlug: string; partNumber: string; revision: string }): Promise<ReleasedRevisionHead> {
  const current = opts.revision === "current";
  const rows = await select<{ id: number; device_id: number; letter: string; pdf_sha256: string; withdrawn: number; superseded: number }>(
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
