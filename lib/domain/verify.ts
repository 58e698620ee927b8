/**
 * Verifying a printout: what a visitor may type or drop (a PDF's SHA-256, or the verification
 * reference from its footer), what the answer holds, and the one sentence that says it.
 * Pure: the verify page (a client component), the API's input check and the tests share it.
 */
import { formatDate } from "../format/date";
import type { RevisionStanding } from "./reviews";

/** A SHA-256 in hex, as `sha256sum` prints it. */
export const sha256Pattern = /^[0-9a-fA-F]{64}$/;
/** The footer's reference: two groups of five of Crockford's base-32 digits (no I, L, O or U). */
export const referencePattern = /^[0-9A-HJKMNP-TV-Z]{5}-[0-9A-HJKMNP-TV-Z]{5}$/i;

export type VerifyQuery = { sha256: string } | { reference: string };

/**
 * What a pasted text asks for: a 64-hex SHA-256 (spaces and a "sha256sum" file name around it
 * allowed), or a reference, also inside the footer's line ("Verify: 7KQ2M-XR4TD at …") or its
 * link (…/r/7KQ2M-XR4TD). Null when it is neither.
 */
export function readVerifyInput(text: string): VerifyQuery | null {
  const trimmed = text.trim();
  if (trimmed.length === 0 || trimmed.length > 500) return null;
  const hex = /(?:^|[^0-9a-fA-F])([0-9a-fA-F]{64})(?![0-9a-fA-F])/.exec(trimmed);
  if (hex) return { sha256: hex[1].toLowerCase() };
  const reference = /(?:^|[^0-9A-Za-z])([0-9A-Za-z]{5}-[0-9A-Za-z]{5})(?![0-9A-Za-z])/.exec(trimmed);
  if (reference && referencePattern.test(reference[1])) return { reference: reference[1].toUpperCase() };
  return null;
}

export type VerifyRevisionRef = { letter: string; releasedAt: string; standing: RevisionStanding; notes: string[]; publicPath: string };

/** The API's answer for a released revision (`GET /api/v1/verify`). */
export type VerifyAnswer = {
  organization: { name: string; slug: string };
  partNumber: string;
  title: string;
  letter: string;
  releasedAt: string;
  signers: { name: string; roleWord: string; signedAt: string }[];
  standing: RevisionStanding;
  reference: string;
  pdfSha256: string;
  publicPath: string;
  pdfPath: string;
  withdrawal: { reason: string; withdrawnAt: string } | null;
  /** The revision current now, when this one is not it (null if every later one is withdrawn too). */
  supersededBy: VerifyRevisionRef | null;
  /** Revisions released after this one, oldest first, with their release notes. */
  later: VerifyRevisionRef[];
};

/** The word and mark for each standing: the state is never told by colour alone. */
export const standingMarks: Record<RevisionStanding, { word: string; mark: string }> = {
  current: { word: "Current", mark: "✓" },
  superseded: { word: "Superseded", mark: "↻" },
  withdrawn: { word: "Withdrawn", mark: "⊘" },
};

export const notReleasedSentence = "This is not a released Benchfold sheet.";

function listOf(names: string[]): string {
  if (names.length <= 1) return names[0] ?? "";
  return `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
}

/**
 * The one plain sentence: "Revision B of KDX-2G4 (Kestrel Devices), released 2026-12-02, signed
 * by Joel Park: current." Superseded names the revision current now; withdrawn gives the reason.
 */
export function verifySentence(a: VerifyAnswer): string {
  const signed = a.signers.length ? `, signed by ${listOf(a.signers.map((s) => s.name))}` : "";
  const head = `Revision ${a.letter} of ${a.partNumber} (${a.organization.name}), released ${formatDate(a.releasedAt)}${signed}`;
  switch (a.standing) {
    case "current":
      return `${head}: current.`;
    case "superseded":
      return a.supersededBy ? `${head}: superseded by revision ${a.supersededBy.letter}.` : `${head}: superseded; no later revision is current.`;
    case "withdrawn":
      return `${head}: withdrawn on ${formatDate(a.withdrawal!.withdrawnAt)} (reason: ${a.withdrawal!.reason.trim().replace(/[.\s]+$/, "")}).`;
  }
}
