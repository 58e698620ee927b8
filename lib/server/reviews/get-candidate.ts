import "server-only";
import { Op } from "sequelize";
import { allows } from "@/lib/access/matrix";
import { AppError } from "@/lib/errors";
import type { CandidateDetail, CandidateSummary, CommentView, SignatureView } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import { db } from "@/models";
import type { Device, SheetCandidate, SheetComment, SheetSignature, User } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";

export type { CandidateDetail };

type CandidateRow = SheetCandidate & { Device?: Device; submittedBy?: User; SheetSignatures?: SheetSignature[] };

/** The candidate as the review page and its API show it: frozen model, the last release's model, comments, signatures. */
export async function getCandidate(opts: { viewer: SessionUser; candidateId: number }): Promise<CandidateDetail> {
  const { viewer, candidateId } = opts;
  authorize(viewer, "sheet-comments");
  const { SheetCandidate, SheetRevision } = db();
  const candidate = (await SheetCandidate.findOne({
    where: { id: candidateId, organizationId: viewer.organizationId },
    include: candidateIncludes(),
  })) as CandidateRow | null;
  if (!candidate) throw new AppError("not-found", "No such sheet candidate in your organization.");
  const previous = candidate.comparedRevisionId
    ? await SheetRevision.unscoped().findByPk(candidate.comparedRevisionId, { attributes: ["letter", "modelJson"] })
    : null;
  const signatures = signatureViews(candidate.SheetSignatures ?? []);
  const summary = candidateSummary(candidate, previous?.letter ?? null);
  const ownSubmission = candidate.submittedById === viewer.id;
  const signedAlready = signatures.some((s) => s.signer.id === viewer.id);
  const reviewer = allows(viewer.role, "sheet-review");
  const decideBlockedBecause = !reviewer
    ? null
    : ownSubmission
      ? "You submitted this sheet; another reviewer must decide on it."
      : signedAlready && candidate.state === "in-review"
        ? "You have signed this candidate; it waits for another reviewer's signature."
        : candidate.state !== "in-review"
          ? `The candidate is ${candidate.state === "stale" ? "out of date" : candidate.state.replace("-", " ")}.`
          : null;
  return {
    ...summary,
    model: JSON.parse(candidate.modelJson) as SheetModel,
    previousModel: previous ? (JSON.parse(previous.modelJson) as SheetModel) : null,
    acknowledgements: candidate.acknowledgements,
    note: candidate.note,
    signatures,
    comments: await commentViews(candidate),
    can: {
      comment: candidate.state === "in-review" || candidate.state === "changes-requested",
      decide: reviewer && decideBlockedBecause === null,
      sign: reviewer && decideBlockedBecause === null,
      release: allows(viewer.role, "sheet-release") && candidate.state === "approved",
    },
    decideBlockedBecause,
  };
}

/**
 * What a candidate summary reads beside the candidate: its device, its submitter and its signatures.
 * The same for the queue, a device's review and the review page.
 */
export function candidateIncludes() {
  const { Device, User, SheetSignature } = db();
  return [
    { model: Device, attributes: ["id", "partNumber", "title"] },
    { model: User, as: "submittedBy", attributes: ["id", "name"] },
    { model: SheetSignature },
  ];
}

export function candidateSummary(candidate: CandidateRow, comparedRevision: string | null): CandidateSummary {
  return {
    id: candidate.id,
    deviceId: candidate.deviceId,
    partNumber: candidate.Device?.partNumber ?? "",
    title: candidate.Device?.title ?? "",
    state: candidate.state,
    digest: candidate.modelDigest,
    modelDate: candidate.modelDate,
    submittedBy: { id: candidate.submittedById, name: candidate.submittedBy?.name ?? "" },
    submittedAt: candidate.submittedAt.toISOString(),
    requiredSignatures: candidate.requiredSignatures,
    signatureCount: candidate.SheetSignatures?.length ?? 0,
    changeRequest: candidate.changeRequest ?? null,
    staleReason: candidate.staleReason ?? null,
    comparedRevision,
  };
}

function signatureViews(rows: SheetSignature[]): SignatureView[] {
  return [...rows]
    .sort((a, b) => a.id - b.id)
    .map((s) => ({
      id: s.id,
      signer: { id: s.signerId, name: s.printedName },
      printedName: s.printedName,
      roleWord: s.roleWord,
      organizationName: s.organizationName,
      meaning: s.meaning,
      candidateDigest: s.candidateDigest,
      signedAt: s.signedAt.toISOString(),
    }));
}

/**
 * The candidate's comments, and the unresolved ones written on earlier submissions of the same
 * sheet since its last release, so a thread survives a resubmission.
 */
async function commentViews(candidate: SheetCandidate): Promise<CommentView[]> {
  const { SheetComment, SheetRevision, User } = db();
  const lastRelease = await SheetRevision.findOne({ where: { deviceId: candidate.deviceId }, order: [["sequence", "DESC"]], attributes: ["releasedAt"] });
  const rows = (await SheetComment.findAll({
    where: {
      deviceId: candidate.deviceId,
      organizationId: candidate.organizationId,
      ...(lastRelease ? { createdAt: { [Op.gt]: lastRelease.releasedAt } } : {}),
    },
    include: [{ model: User, as: "author", attributes: ["id", "name"] }],
    order: [["id", "ASC"]],
  })) as (SheetComment & { author?: User })[];
  const names = await resolverNames(rows);
  const earlierThreadsOpen = new Set(rows.filter((r) => r.candidateId !== candidate.id && r.parentId === null && !r.resolvedAt).map((r) => r.id));
  // A thread written on here in part (a reply to an earlier thread) stays whole, resolved or not.
  const threadsHere = new Set(rows.filter((r) => r.candidateId === candidate.id).map((r) => r.parentId ?? r.id));
  return rows
    .filter((r) => threadsHere.has(r.parentId ?? r.id) || earlierThreadsOpen.has(r.parentId ?? r.id))
    .map((r) => ({
      id: r.id,
      candidateId: r.candidateId,
      parentId: r.parentId,
      author: { id: r.authorId, name: r.author?.name ?? "" },
      anchor: { kind: r.anchorKind, id: r.anchorId, label: r.anchorLabel },
      body: r.body,
      createdAt: r.createdAt.toISOString(),
      resolvedAt: r.resolvedAt ? r.resolvedAt.toISOString() : null,
      resolvedBy: r.resolvedById ? { id: r.resolvedById, name: names.get(r.resolvedById) ?? "" } : null,
      earlier: r.candidateId !== candidate.id,
    }));
}

async function resolverNames(rows: SheetComment[]): Promise<Map<number, string>> {
  const ids = [...new Set(rows.map((r) => r.resolvedById).filter((id): id is number => id != null))];
  if (!ids.length) return new Map();
  const users = await db().User.findAll({ where: { id: { [Op.in]: ids } }, attributes: ["id", "name"] });
  return new Map(users.map((u) => [u.id, u.name]));
}
