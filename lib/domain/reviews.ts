/**
 * The fixed lists of sheet review and release: the states a submitted candidate passes through,
 * what a signature means, where a review comment may sit, and how a released revision stands.
 * Pure data: models, schemas, server functions and client components all derive from these.
 */

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
