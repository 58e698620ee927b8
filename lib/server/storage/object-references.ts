/**
 * Every column that holds an object's key, with the SHA-256 and size recorded beside it: the one
 * list the backup (what to copy), the restore (what to read back) and the orphan sweep (what to keep)
 * read. A table that starts storing keys adds a line here. `lookup` finds one key's rows through an
 * index (sheet_revisions.pdf_key is generated from pdf_sha256, which is indexed; stored_files'
 * storage_key has an index of its own, migration 20261204-2240).
 */
export const objectReferences = [
  { table: "stored_files", key: "storage_key", sha256: "sha256", sizeBytes: "size_bytes", lookup: "storage_key = :key" },
  { table: "sheet_revisions", key: "pdf_key", sha256: "pdf_sha256", sizeBytes: "pdf_bytes", lookup: "pdf_sha256 = :sha256 AND pdf_key = :key" },
] as const;

/** One statement listing every referenced key with its SHA-256 and size (columns k, h, n), in key order. */
export const referencedObjectsSql = `${objectReferences.map((r) => `SELECT ${r.key} AS k, ${r.sha256} AS h, ${r.sizeBytes} AS n FROM ${r.table}`).join("\n UNION ")}\n ORDER BY k`;

/** One statement counting the rows that refer to the key `:key` (SHA-256 `:sha256`), column n. */
export const keyReferencesSql = `SELECT ${objectReferences.map((r) => `(SELECT COUNT(*) FROM ${r.table} WHERE ${r.lookup})`).join(" + ")} AS n`;
