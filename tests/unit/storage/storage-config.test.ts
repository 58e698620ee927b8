import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { contentKey, contentKeySha256 } from "@/lib/server/storage/object-key";
import { readStorageSettings } from "@/lib/server/storage/storage-config";

describe("readStorageSettings", () => {
  it("reads bucket, endpoint, region, credentials; path-style by default for an endpoint", () => {
    expect(readStorageSettings({ S3_BUCKET: "bench-files", S3_ENDPOINT: "http://127.0.0.1:9000", S3_ACCESS_KEY_ID: "id", S3_SECRET_ACCESS_KEY: "secret", S3_PREFIX: "/benchfold/" })).toEqual({
      bucket: "bench-files",
      endpoint: "http://127.0.0.1:9000",
      region: "us-east-1",
      credentials: { accessKeyId: "id", secretAccessKey: "secret" },
      forcePathStyle: true,
      prefix: "benchfold/",
    });
  });

  it("leaves AWS itself to the SDK's credential chain and virtual-hosted addresses", () => {
    expect(readStorageSettings({ S3_BUCKET: "bench-files", S3_REGION: "eu-central-1" })).toEqual({
      bucket: "bench-files",
      endpoint: null,
      region: "eu-central-1",
      credentials: null,
      forcePathStyle: false,
      prefix: "",
    });
    expect(readStorageSettings({ S3_BUCKET: "bench-files", S3_ENDPOINT: "https://s3.example.net", S3_FORCE_PATH_STYLE: "0" }).forcePathStyle).toBe(false);
  });

  it.each([
    [{}, /No file store is configured: set S3_BUCKET/],
    [{ S3_BUCKET: "Bench_Files" }, /is not a bucket name/],
    [{ S3_BUCKET: "ab" }, /is not a bucket name/],
    [{ S3_BUCKET: "bench-files", S3_ACCESS_KEY_ID: "id" }, /Set both S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY, or neither/],
  ])("refuses %j with a sentence naming the setting", (env, message) => {
    expect(() => readStorageSettings(env)).toThrow(message);
  });
});

describe("contentKey", () => {
  it("is sha256/<first two hex digits>/<hex> of the bytes' SHA-256", () => {
    // SHA-256 of "abc": FIPS 180-2, Appendix B.1 (ba7816bf 8f01cfea 414140de 5dae2223 b00361a3 96177a9c b410ff61 f20015ad).
    const hex = createHash("sha256").update("abc").digest("hex");
    expect(hex).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    expect(contentKey(hex)).toBe("sha256/ba/ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("matches the SQL of migration 20261203-1500 and the generated column sheet_revisions.pdf_key", async () => {
    const { readFileSync } = await import("node:fs");
    const migration = readFileSync("models/migrations/20261203-1500-files-to-object-store.ts", "utf8");
    expect(migration).toContain("const keyOf = (sha256: string) => `sha256/${sha256.slice(0, 2)}/${sha256}`;");
    expect(migration).toContain("AS (CONCAT('sha256/', LEFT(pdf_sha256, 2), '/', pdf_sha256))");
  });

  it("refuses anything but a lowercase hex SHA-256", () => {
    expect(() => contentKey("../../etc/passwd")).toThrow(/Not a lowercase hex SHA-256/);
    expect(() => contentKey("BA7816BF8F01CFEA414140DE5DAE2223B00361A396177A9CB410FF61F20015AD")).toThrow(/Not a lowercase hex SHA-256/);
  });
});

describe("contentKeySha256", () => {
  it("reads the SHA-256 back out of a content key, and nothing out of any other key", () => {
    const hex = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";
    expect(contentKeySha256(contentKey(hex))).toBe(hex);
    for (const other of [
      `sha256/bb/${hex}`, // the folder is not the hash's first two digits
      `sha256/ba/${hex}.tmp`,
      `sha256/ba/${hex.toUpperCase()}`,
      `drawings/${hex}`,
      `sha256/ba/${hex}/x`,
      "sha256/ba/",
    ]) {
      expect(contentKeySha256(other), other).toBeNull();
    }
  });
});
