import "server-only";
import { AppError } from "@/lib/errors";
import { notReleasedSentence, type VerifyAnswer, type VerifyQuery, type VerifyRevisionRef } from "@/lib/domain/verify";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { publicLookup, type SelectRows } from "../db/public-reads";
import { revisionSummaries } from "./list-revisions";

/**
 * What a printout is: the released revision whose stored PDF has this SHA-256 (indexed), or whose
 * footer carries this verification reference, with its organization, part, date, signers and
 * standing; for a superseded one the revision current now and the release notes of every revision
 * since; for a withdrawn one the reason. Public: it says only what the released sheets say.
 * Anything else is a 404 whose message says it is not a released Benchfold sheet. Public data: read
 * through publicLookup (a replica when one is up and caught up).
 */
export function verifyPrintout(query: VerifyQuery): Promise<VerifyAnswer> {
  return publicLookup((select) => verifyIn(select, query));
}

async function verifyIn(select: SelectRows, query: VerifyQuery): Promise<VerifyAnswer> {
  const [row] = await select<{ id: number; device_id: number; part_number: string; title: string | null; org_name: string; slug: string }>(
    `SELECT r.id, r.device_id, d.part_number, JSON_VALUE(r.model_json, '$.header.title') AS title, o.name AS org_name, o.slug
       FROM sheet_revisions r
       JOIN devices d ON d.id = r.device_id
       JOIN organizations o ON o.id = r.organization_id
      WHERE ${"sha256" in query ? "r.pdf_sha256 = :value" : "r.reference = :value"}
      LIMIT 1`,
    { value: "sha256" in query ? query.sha256.toLowerCase() : query.reference.toUpperCase() },
  );
  if (!row) throw new AppError("not-found", notReleasedSentence);
  const history = await revisionSummaries({ deviceId: Number(row.device_id) }, select); // newest first
  const index = history.findIndex((r) => r.id === row.id);
  const self = history[index];
  const ref = (r: RevisionSummary): VerifyRevisionRef => ({ letter: r.letter, releasedAt: r.releasedAt, standing: r.standing, notes: r.notes, publicPath: r.publicPath });
  const later = history.slice(0, index).reverse().map(ref);
  const current = history.find((r) => r.standing === "current");
  return {
    organization: { name: row.org_name, slug: row.slug },
    partNumber: row.part_number,
    title: row.title ?? "",
    letter: self.letter,
    releasedAt: self.releasedAt,
    signers: self.signers,
    standing: self.standing,
    reference: self.reference,
    pdfSha256: self.pdfSha256,
    publicPath: self.publicPath,
    pdfPath: self.pdfPath,
    withdrawal: self.withdrawal ? { reason: self.withdrawal.reason, withdrawnAt: self.withdrawal.withdrawnAt } : null,
    supersededBy: current && current.id !== self.id ? ref(current) : null,
    later,
  };
}
