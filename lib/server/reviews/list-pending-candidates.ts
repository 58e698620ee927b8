import "server-only";
import { Op } from "sequelize";
import type { CandidateSummary } from "@/lib/domain/reviews";
import { db } from "@/models";
import type { Device, SheetCandidate, SheetRevision, SheetSignature, User } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { candidateIncludes, candidateSummary } from "./get-candidate";

/**
 * The sheet review queue: the organization's candidates in review that the viewer did not submit
 * and has not signed (four eyes in the query; the decision checks again), oldest first.
 */
export async function listPendingCandidates(viewer: SessionUser): Promise<CandidateSummary[]> {
  authorize(viewer, "sheet-review");
  const { SheetCandidate, SheetRevision } = db();
  const rows = (await SheetCandidate.findAll({
    where: { organizationId: viewer.organizationId, state: "in-review", submittedById: { [Op.ne]: viewer.id } },
    attributes: { exclude: ["modelJson"] },
    include: candidateIncludes(),
    order: [["submittedAt", "ASC"], ["id", "ASC"]],
  })) as (SheetCandidate & { Device?: Device; submittedBy?: User; SheetSignatures?: SheetSignature[] })[];
  const pending = rows.filter((c) => !(c.SheetSignatures ?? []).some((s) => s.signerId === viewer.id));
  const compared = await SheetRevision.findAll({
    where: { id: { [Op.in]: pending.map((c) => c.comparedRevisionId).filter((id): id is number => id !== null) } },
    attributes: ["id", "letter"],
  });
  const letters = new Map(compared.map((r: SheetRevision) => [r.id, r.letter]));
  return pending.map((c) => candidateSummary(c, c.comparedRevisionId ? (letters.get(c.comparedRevisionId) ?? null) : null));
}

/** The open candidate of a device (in review, changes requested or approved), with the latest closed one when none is open. */
export async function findDeviceReview(opts: { viewer: SessionUser; deviceId: number }): Promise<{ open: CandidateSummary | null; latest: CandidateSummary | null }> {
  authorize(opts.viewer, "sheet-comments");
  const { SheetCandidate } = db();
  const latest = (await SheetCandidate.findOne({
    where: { organizationId: opts.viewer.organizationId, deviceId: opts.deviceId },
    attributes: { exclude: ["modelJson"] },
    include: candidateIncludes(),
    order: [["id", "DESC"]],
  })) as (SheetCandidate & { Device?: Device; submittedBy?: User; SheetSignatures?: SheetSignature[] }) | null;
  if (!latest) return { open: null, latest: null };
  const summary = candidateSummary(latest, null);
  return { open: latest.openDeviceId !== null ? summary : null, latest: summary };
}
