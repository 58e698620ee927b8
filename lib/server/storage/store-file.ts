import "server-only";
import type { Transaction } from "sequelize";
import { db } from "@/models";
import type { StoredFile } from "@/models";
import { putObject, readObject } from "./stored-objects";

/**
 * Stores an uploaded file (a bench file, a drawing): its bytes go to the object store, its record
 * (key, size, SHA-256, name, media type) to stored_files in the caller's transaction. Call it after
 * the upload's checks, inside the transaction: a store that refuses the bytes throws a 503 and the
 * transaction rolls back, so the upload stores nothing.
 */
export async function storeFile(
  file: { organizationId: number; bytes: Uint8Array; originalName: string; contentType: string; sha256?: string },
  transaction: Transaction,
): Promise<StoredFile> {
  const stored = await putObject({ bytes: file.bytes, contentType: file.contentType, sha256: file.sha256 }, transaction);
  return db().StoredFile.create(
    { organizationId: file.organizationId, sha256: stored.sha256, sizeBytes: stored.sizeBytes, storageKey: stored.key, originalName: file.originalName, contentType: file.contentType },
    { transaction },
  );
}

/** A stored file's bytes, verified against its record; the caller has decided the file may be read. */
export function readStoredFile(file: { storageKey: string; sha256: string; sizeBytes: number; originalName: string }): Promise<Buffer> {
  return readObject({ key: file.storageKey, sha256: file.sha256, sizeBytes: file.sizeBytes }, `the file ${file.originalName}`);
}
