/**
 * The S3 driver (AWS SDK v3) against s3rver, the same npm fake the scripts start, in this process on
 * a free loopback port: the round trip, the hash check on read, a missing key, a store that is gone,
 * listing, and creating a bucket.
 */
import { mkdtempSync, rmSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import S3rver from "s3rver";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { contentKey } from "@/lib/server/storage/object-key";
import { createS3ObjectStore, readVerified, sha256Hex, StorageIntegrityError, StorageMissingError, StorageUnavailableError, type ObjectStore } from "@/lib/server/storage/object-store";
import { readStorageSettings } from "@/lib/server/storage/storage-config";

const dir = mkdtempSync(path.join(tmpdir(), "benchfold-s3rver-"));
let fake: S3rver;
let endpoint = "";
const storeFor = (bucket: string, extra: Record<string, string> = {}): ObjectStore =>
  createS3ObjectStore(readStorageSettings({ S3_BUCKET: bucket, S3_ENDPOINT: endpoint, S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER", ...extra }), { maxAttempts: 1, timeoutMs: 3_000 });

beforeAll(async () => {
  fake = new S3rver({ directory: dir, silent: true, port: 0, address: "127.0.0.1", configureBuckets: [{ name: "unit-bucket", configs: [] }] });
  const address: AddressInfo = await fake.run();
  endpoint = `http://127.0.0.1:${address.port}`;
});
afterAll(async () => {
  await fake.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("the S3 driver", () => {
  const bytes = Buffer.from("freq_hz,pout_dbm\n1e9,-3.2\n");
  const sha256 = sha256Hex(bytes);
  const key = contentKey(sha256);

  it("writes and reads back the same bytes, checked against their SHA-256 and size", async () => {
    const store = storeFor("unit-bucket");
    await store.probe();
    await store.put({ key, bytes, sha256, contentType: "text/csv" });
    expect((await readVerified(store, { key, sha256, sizeBytes: bytes.length })).equals(bytes)).toBe(true);
  });

  it("refuses bytes that are not the recorded ones", async () => {
    const store = storeFor("unit-bucket");
    const other = Buffer.from("freq_hz,pout_dbm\n1e9,-3.3\n");
    await store.put({ key: "sha256/00/tampered", bytes: other, sha256: sha256Hex(other), contentType: "text/csv" });
    const read = readVerified(store, { key: "sha256/00/tampered", sha256, sizeBytes: bytes.length });
    await expect(read).rejects.toBeInstanceOf(StorageIntegrityError);
    await expect(read).rejects.toThrow(`expected ${bytes.length} bytes with SHA-256 ${sha256}, read ${other.length} bytes with SHA-256 ${sha256Hex(other)}`);
  });

  it("says a key is missing, distinct from a store that cannot be reached", async () => {
    await expect(storeFor("unit-bucket").get(contentKey("0".repeat(64)))).rejects.toBeInstanceOf(StorageMissingError);
    const gone = createS3ObjectStore(readStorageSettings({ S3_BUCKET: "unit-bucket", S3_ENDPOINT: "http://127.0.0.1:9", S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER" }), { maxAttempts: 1, timeoutMs: 2_000 });
    await expect(gone.get(key)).rejects.toBeInstanceOf(StorageUnavailableError);
    await expect(gone.put({ key, bytes, sha256, contentType: "text/csv" })).rejects.toThrow("The file store did not accept the file.");
    await expect(gone.probe()).rejects.toThrow("The file store cannot be reached.");
  });

  it("keeps keys under S3_PREFIX and lists them without it", async () => {
    const store = storeFor("unit-bucket", { S3_PREFIX: "tenant-a" });
    await store.put({ key, bytes, sha256, contentType: "text/csv" });
    const listed = [];
    for await (const o of store.list()) listed.push(o);
    expect(listed).toEqual([{ key, sizeBytes: bytes.length, lastModified: expect.any(Date) }]);
    // The store's own clock, within a minute of ours (s3rver runs in this process).
    expect(Math.abs(listed[0].lastModified.getTime() - Date.now())).toBeLessThan(60_000);
    await store.delete(key);
    const after = [];
    for await (const o of store.list()) after.push(o);
    expect(after).toEqual([]);
    await expect(store.get(key)).rejects.toBeInstanceOf(StorageMissingError);
  });

  it("creates a missing bucket once (restore targets), and a probe of a missing bucket fails", async () => {
    const store = storeFor("unit-restore-target");
    await expect(store.probe()).rejects.toBeInstanceOf(StorageUnavailableError);
    await store.ensureBucket();
    await store.ensureBucket();
    await store.probe();
  });
});
