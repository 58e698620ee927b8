/**
 * The words both renderers print for a release, so the web sheet and the PDF say the same thing.
 */

/** "2026-12-02T09:14:05Z" → "2026-12-02 09:14:05 UTC": to the second, always UTC, whatever the reader's zone. */
export function signedAtText(signedAt: string): string {
  const time = new Date(signedAt);
  if (Number.isNaN(time.getTime())) throw new RangeError(`Signature time must be ISO 8601, got "${signedAt}"`);
  const iso = time.toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 19)} UTC`;
}

/** The one line stating what a signature signs: the candidate's digest, in full. */
export const candidateDigestLabel = "Signs the candidate with SHA-256";
