import { revisionStateLabels } from "../domain/sheets";
import type { SheetModel, SheetRelease } from "./types";

/**
 * The revision letter of the n-th release of a device (1 → "A", 26 → "Z", 27 → "AA", 28 → "AB"):
 * bijective base 26, the way spreadsheet columns are lettered. All 26 letters are used, as the
 * release rules ask (ASME Y14.35 would skip I, O, Q, S, X and Z; we keep the plain alphabet).
 */
export function revisionLetter(sequence: number): string {
  if (!Number.isInteger(sequence) || sequence < 1) throw new RangeError(`Release sequence must be a positive integer, got ${sequence}`);
  let n = sequence;
  let letters = "";
  while (n > 0) {
    const digit = (n - 1) % 26;
    letters = String.fromCharCode(65 + digit) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}

/** The inverse of revisionLetter ("AA" → 27); null for anything that is not upper-case letters. */
export function revisionSequence(letter: string): number | null {
  if (!/^[A-Z]{1,4}$/.test(letter)) return null;
  let n = 0;
  for (const ch of letter) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n;
}

export interface ReleaseFacts extends SheetRelease {
  /** Earlier revisions, any order: the history printed on the sheet. */
  earlierRevisions: { label: string; date: string; summary: string }[];
  /** One line for this revision in that history. */
  summary: string;
}

/**
 * The released sheet model: the candidate exactly as reviewed, with its revision letter, release
 * date, signatures, verification reference and history. Nothing else is recomputed, so what the
 * reviewer signed is what the customer reads.
 */
export function releaseSheetModel(candidate: SheetModel, facts: ReleaseFacts): SheetModel {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(facts.releasedOn)) throw new RangeError(`Release date must be YYYY-MM-DD, got "${facts.releasedOn}"`);
  if (facts.signatures.length === 0) throw new RangeError("A release needs at least one signature");
  const { earlierRevisions, summary, ...release } = facts;
  const history = [...earlierRevisions, { label: facts.revisionLabel, date: facts.releasedOn, summary }].sort(
    (a, b) => (revisionSequence(a.label) ?? 0) - (revisionSequence(b.label) ?? 0),
  );
  return {
    ...candidate,
    header: {
      ...candidate.header,
      revisionText: `Rev. ${facts.revisionLabel}`,
      revisionLabel: facts.revisionLabel,
      state: "released",
      stateLabel: revisionStateLabels.released,
      date: facts.releasedOn,
      released: true,
      banner: null,
    },
    revisionHistory: history,
    release: { ...release, signatures: release.signatures.map((s) => ({ ...s })), notes: [...release.notes] },
  };
}
