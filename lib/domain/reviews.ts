/**
 * The fixed lists of sheet review and release: the states a submitted candidate passes through,
 * what a signature means, where a review comment may sit, and how a released revision stands.
 * Pure data: models, schemas, server functions and client components all derive from these.
 */
import type { SheetModel } from "../sheet/types";

/**
 * A candidate is the sheet model exactly as an engineer submitted it. "stale": the data, limits or
 * prose changed after submission, so the review starts over with a new candidate.
 */
export const candidateStates = ["in-review", "changes-requested", "approved", "released", "stale"] as const;
export type CandidateState = (typeof candidateStates)[number];

export const candidateStateLabels: Record<CandidateState, string> = {
  "in-review": "In review",
  "changes-requested": "Changes requested",
  approved: "Approved, not released",
  released: "Released",
  stale: "Out of date (changed after submission)",
};

/** Candidates still open: one per device at a time. */
export const openCandidateStates: readonly CandidateState[] = ["in-review", "changes-requested", "approved"];

/** What a signature states (21 CFR Part 11 §11.50(a)(3): the meaning of the signature). */
export const signatureMeanings = ["approved-for-release"] as const;
export type SignatureMeaning = (typeof signatureMeanings)[number];

export const signatureMeaningWords: Record<SignatureMeaning, string> = {
  "approved-for-release": "Reviewed and approved for release",
};

/** How many signatures an organization requires before a candidate counts as approved. */
export const requiredSignatureChoices = [1, 2] as const;
export type RequiredSignatures = (typeof requiredSignatureChoices)[number];

/** What a review comment is about: the whole sheet, one spec-table row, one chart or one prose section. */
export const commentAnchorKinds = ["sheet", "row", "chart", "prose"] as const;
export type CommentAnchorKind = (typeof commentAnchorKinds)[number];

/** A released revision is current until a newer one supersedes it; a withdrawn one keeps its place. */
export const revisionStandings = ["current", "superseded", "withdrawn"] as const;
export type RevisionStanding = (typeof revisionStandings)[number];

export const revisionStandingLabels: Record<RevisionStanding, string> = {
  current: "Current",
  superseded: "Superseded",
  withdrawn: "Withdrawn",
};

/* ---------- what pages and the API hand to components ---------- */


export type PersonRef = { id: number; name: string };

export type SignatureView = {
  id: number;
  signer: PersonRef;
  printedName: string;
  roleWord: string;
  organizationName: string;
  meaning: string;
  candidateDigest: string;
  /** ISO 8601, UTC. */
  signedAt: string;
};

export type CommentView = {
  id: number;
  candidateId: number;
  parentId: number | null;
  author: PersonRef;
  anchor: { kind: CommentAnchorKind; id: string | null; label: string };
  body: string;
  createdAt: string;
  resolvedAt: string | null;
  resolvedBy: PersonRef | null;
  /** True when written on an earlier submission of the same sheet. */
  earlier: boolean;
};

export type CandidateSummary = {
  id: number;
  deviceId: number;
  partNumber: string;
  title: string;
  state: CandidateState;
  digest: string;
  modelDate: string;
  submittedBy: PersonRef;
  submittedAt: string;
  requiredSignatures: number;
  signatureCount: number;
  changeRequest: string | null;
  staleReason: string | null;
  /** The letter the review compares against, or null for a first release. */
  comparedRevision: string | null;
};

export type CandidateDetail = CandidateSummary & {
  model: SheetModel;
  /** The frozen model of the last released revision, or null for a first release. */
  previousModel: SheetModel | null;
  acknowledgements: { code: string; message: string; reason: string }[];
  note: string;
  signatures: SignatureView[];
  comments: CommentView[];
  /** What the viewer may do now (the server checks again on every action). */
  can: { comment: boolean; decide: boolean; sign: boolean; release: boolean };
  /** Why the viewer may not decide, when they may not (e.g. their own submission). */
  decideBlockedBecause: string | null;
};

export type RevisionSummary = {
  id: number;
  deviceId: number;
  letter: string;
  releasedAt: string;
  releasedBy: PersonRef;
  signers: { name: string; roleWord: string; signedAt: string }[];
  standing: RevisionStanding;
  withdrawal: { reason: string; withdrawnAt: string; by: string } | null;
  notes: string[];
  pdfSha256: string;
  pdfBytes: number;
  reference: string;
  /** The public address of this revision. */
  publicPath: string;
  pdfPath: string;
};

/** The public address of a released revision ("current" for whichever is current), and of its stored PDF. */
export function datasheetPath(organizationSlug: string, partNumber: string, revision: string): string {
  return `/datasheets/${encodeURIComponent(organizationSlug)}/${encodeURIComponent(partNumber)}/${encodeURIComponent(revision)}`;
}

export function datasheetPdfPath(organizationSlug: string, partNumber: string, revision: string): string {
  return `/api/v1/sheets/${encodeURIComponent(organizationSlug)}/${encodeURIComponent(partNumber)}/${encodeURIComponent(revision)}/pdf`;
}
