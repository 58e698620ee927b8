/**
 * Objects are addressed by their content: `sha256/<first two hex digits>/<64 hex digits>`. A key
 * never names two different byte strings, so a write is idempotent (a retried upload, a migration
 * run again, a restore), an object never changes once written, and a write whose database
 * transaction then rolls back leaves only an unreferenced copy, which the next identical upload
 * reuses or the orphan sweep (sweep-orphan-objects.ts) deletes. Migration 20261203-1500 and sheet_revisions.pdf_key (a generated column) spell the same
 * scheme in SQL; tests/unit/storage/object-key.test.ts holds the three together.
 */
export function contentKey(sha256: string): string {
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error(`Not a lowercase hex SHA-256: "${sha256.slice(0, 80)}"`);
  return `sha256/${sha256.slice(0, 2)}/${sha256}`;
}

/** The SHA-256 a content key names, or null for a key that is not one (the sweep leaves such objects alone). */
export function contentKeySha256(key: string): string | null {
  const match = /^sha256\/([0-9a-f]{2})\/([0-9a-f]{64})$/.exec(key);
  return match && match[2].startsWith(match[1]) ? match[2] : null;
}
