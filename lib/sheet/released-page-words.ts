/**
 * The title and description of a released sheet's public page (what a search result or a shared
 * link shows): the part, the letter and, unless the revision is the current one, its standing,
 * so a superseded or withdrawn revision never reads as the sheet to design in from.
 */
import { formatDate } from "../format/date";
import type { RevisionSummary } from "../domain/reviews";

type Revision = Pick<RevisionSummary, "letter" | "releasedAt" | "standing" | "withdrawal">;

export function releasedPageTitle(partNumber: string, revision: Revision): string {
  const standing = revision.standing === "current" ? "" : ` (${revision.standing})`;
  return `${partNumber} Rev. ${revision.letter}${standing}`;
}

/** One or two sentences: the sheet's title, who released which revision when, and what stands now. */
export function releasedPageDescription(opts: { title: string; organizationName: string; revision: Revision; currentLetter: string | null }): string {
  const { title, organizationName, revision, currentLetter } = opts;
  const released = `${title}. Revision ${revision.letter} of the datasheet, released by ${organizationName} on ${formatDate(revision.releasedAt)}`;
  if (revision.standing === "withdrawn" && revision.withdrawal) {
    const now = currentLetter ? ` Revision ${currentLetter} is current.` : "";
    return `${released}; withdrawn on ${formatDate(revision.withdrawal.withdrawnAt)}: ${revision.withdrawal.reason}${/[.!?]$/.test(revision.withdrawal.reason) ? "" : "."}${now}`;
  }
  if (revision.standing === "superseded") return `${released}; superseded${currentLetter ? ` by revision ${currentLetter}` : ""}.`;
  return `${released}; the current revision.`;
}
