import "server-only";
import type { Transaction } from "sequelize";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { claimObjectKey } from "./claim-object-key";
import { contentKey } from "./object-key";
import {
  createS3ObjectStore,
  readVerified,
  sha256Hex,
  StorageIntegrityError,
  StorageMissingError,
  StorageUnavailableError,
  type ObjectStore,
} from "./object-store";
import { readStorageSettings, StorageConfigError } from "./storage-config";

const STORE = Symbol.for("benchfold.object-store");
type Holder = { [STORE]?: ObjectStore };

/** This process's object store (the S3 driver with the settings of storage-config.ts), made once. */
export function objectStore(): ObjectStore {
  const holder = globalThis as Holder;
  if (!holder[STORE]) {
    try {
      holder[STORE] = createS3ObjectStore(readStorageSettings());
    } catch (error) {
      if (error instanceof StorageConfigError) throw new AppError("unavailable", error.message);
      throw error;
    }
  }
  return holder[STORE];
}

export type StoredObject = { key: string; sha256: string; sizeBytes: number };

/**
 * Writes bytes to the store under their content key, inside the transaction that will refer to them.
 * The key is claimed first (claimObjectKey: a row lock held until that transaction ends), so the
 * orphan sweep cannot delete the object between this write and the commit. A store that does not
 * take the bytes is a 503 that says nothing was saved; the throw rolls the caller's transaction back.
 */
export async function putObject(opts: { bytes: Uint8Array; contentType: string; sha256?: string }, transaction: Transaction): Promise<StoredObject> {
  const sha256 = opts.sha256 ?? sha256Hex(opts.bytes);
  const key = contentKey(sha256);
  await claimObjectKey(db().sequelize, key, transaction);
  try {
    await objectStore().put({ key, bytes: opts.bytes, sha256, contentType: opts.contentType });
  } catch (error) {
    if (error instanceof StorageUnavailableError) {
      console.error(`[benchfold] storage: write of ${key} failed: ${error.detail}`);
      throw new AppError("unavailable", "The file store did not accept the file, so nothing was saved. Try again in a minute.", { storage: "write-failed" });
    }
    throw error;
  }
  return { key, sha256, sizeBytes: opts.bytes.byteLength };
}

/**
 * The bytes of a stored object, checked against the size and SHA-256 the database recorded for it.
 * `what` names the file in the error ("the released PDF of KDX-2G4 Rev. B"): a store that does not
 * answer is a 503; a missing object or bytes that are not the recorded ones are never served.
 */
export async function readObject(record: StoredObject, what: string): Promise<Buffer> {
  try {
    return await readVerified(objectStore(), record);
  } catch (error) {
    if (error instanceof StorageIntegrityError) {
      console.error(`[benchfold] storage: ${error.message}`);
      throw new AppError("internal", `The stored copy of ${what} does not match its recorded SHA-256, so it is not served. The administrator can restore it from a backup.`, {
        storage: "hash-mismatch",
        key: record.key,
        expectedSha256: record.sha256,
      });
    }
    if (error instanceof StorageMissingError) {
      console.error(`[benchfold] storage: ${error.message}`);
      throw new AppError("internal", `The stored copy of ${what} is missing from the file store. The administrator can restore it from a backup.`, { storage: "missing", key: record.key });
    }
    if (error instanceof StorageUnavailableError) {
      console.error(`[benchfold] storage: read of ${record.key} failed: ${error.detail}`);
      throw new AppError("unavailable", `The file store cannot be reached just now, so ${what} cannot be sent. Try again in a minute.`, { storage: "unreachable" });
    }
    throw error;
  }
}
