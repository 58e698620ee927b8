import { createHash } from "node:crypto";
import { createReadStream } from "node:fs";
import { referencedObjectsSql } from "../lib/server/storage/object-references";

/** What npm run backup writes beside the dump and npm run restore reads (scripts/backup.ts, scripts/restore.ts). */
export const BACKUP_FORMAT = "benchfold-backup/1";

export type BackupObject = { key: string; sha256: string; sizeBytes: number };

export type BackupManifest = {
  format: typeof BACKUP_FORMAT;
  createdAt: string;
  database: { name: string; file: string; sha256: string; sizeBytes: number };
  objects: BackupObject[];
};

/**
 * Every object the database refers to, once each, in key order: bench files and other uploads
 * (stored_files) and released PDFs (sheet_revisions), as objectReferences lists them. Content keys,
 * so one key has one SHA-256.
 */
export async function referencedObjects(select: (sql: string) => Promise<object[]>): Promise<BackupObject[]> {
  const rows = (await select(referencedObjectsSql)) as { k: string; h: string; n: number }[];
  const byKey = new Map<string, BackupObject>();
  for (const r of rows) {
    const seen = byKey.get(r.k);
    if (seen && (seen.sha256 !== r.h || seen.sizeBytes !== Number(r.n))) throw new Error(`two records of ${r.k} disagree: ${seen.sha256}/${seen.sizeBytes} and ${r.h}/${r.n}`);
    byKey.set(r.k, { key: r.k, sha256: r.h, sizeBytes: Number(r.n) });
  }
  return [...byKey.values()];
}

/** A manifest read from disk, checked field by field (a backup from elsewhere is input like any other). */
export function parseManifest(text: string): BackupManifest {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new Error(`manifest.json is not JSON: ${(error as Error).message}`);
  }
  const m = value as BackupManifest;
  if (m?.format !== BACKUP_FORMAT) throw new Error(`manifest.json: format is ${JSON.stringify(m?.format)}, expected "${BACKUP_FORMAT}"`);
  const hex = /^[0-9a-f]{64}$/;
  if (!m.database || typeof m.database.file !== "string" || !hex.test(m.database.sha256) || !Number.isInteger(m.database.sizeBytes)) throw new Error("manifest.json: database entry is incomplete");
  if (!/^[A-Za-z0-9_.-]+$/.test(m.database.file)) throw new Error(`manifest.json: database file "${m.database.file}" is not a plain file name`);
  if (!Array.isArray(m.objects)) throw new Error("manifest.json: objects is not a list");
  m.objects.forEach((o, i) => {
    if (typeof o?.key !== "string" || !/^sha256\/[0-9a-f]{2}\/[0-9a-f]{64}$/.test(o.key) || !hex.test(o.sha256) || !Number.isInteger(o.sizeBytes) || o.sizeBytes < 0) {
      throw new Error(`manifest.json: objects[${i}] is not a content key with its SHA-256 and size`);
    }
  });
  return m;
}

/** A file's SHA-256 and size, read as a stream (a dump may be larger than memory should hold). */
export async function sha256File(file: string): Promise<{ sha256: string; sizeBytes: number }> {
  const hash = createHash("sha256");
  let sizeBytes = 0;
  for await (const chunk of createReadStream(file)) {
    hash.update(chunk as Buffer);
    sizeBytes += (chunk as Buffer).length;
  }
  return { sha256: hash.digest("hex"), sizeBytes };
}
