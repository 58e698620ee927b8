import { createHash } from "node:crypto";
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";
import type { StorageSettings } from "./storage-config";

/** The store did not answer, refused the request, or lost the object: nothing was written or read. */
export class StorageUnavailableError extends Error {
  readonly detail: string;
  constructor(message: string, cause?: unknown) {
    super(message);
    this.name = "StorageUnavailableError";
    this.detail = describe(cause);
  }
}

/** The store has no object under the key. */
export class StorageMissingError extends Error {
  constructor(readonly key: string) {
    super(`The file store has no object ${key}.`);
    this.name = "StorageMissingError";
  }
}

/** The bytes read back are not the ones whose SHA-256 and size the database recorded. */
export class StorageIntegrityError extends Error {
  constructor(
    readonly key: string,
    readonly expected: { sha256: string; sizeBytes: number },
    readonly actual: { sha256: string; sizeBytes: number },
  ) {
    super(
      `The stored object ${key} does not match its record: expected ${expected.sizeBytes} bytes with SHA-256 ${expected.sha256}, read ${actual.sizeBytes} bytes with SHA-256 ${actual.sha256}.`,
    );
    this.name = "StorageIntegrityError";
  }
}

export type ListedObject = { key: string; sizeBytes: number; lastModified: Date };

export type PutObject = { key: string; bytes: Uint8Array; sha256: string; contentType: string };

/**
 * The one interface every stored file goes through (bench files, released PDFs, drawings). The
 * S3 driver below is the only implementation the app uses; tests wrap it to fail on purpose.
 */
export interface ObjectStore {
  /** Writes the bytes under the key; resolves once the store has them. */
  put(object: PutObject): Promise<void>;
  /** The bytes under the key, unverified (readVerified checks them against the record). */
  get(key: string): Promise<Buffer>;
  /** Every key under the prefix (for backups, checks and the orphan sweep), in key order, with when the store last wrote it. */
  list(prefix?: string): AsyncIterable<ListedObject>;
  /** Removes the object under the key (the orphan sweep only: the app never deletes a file it refers to). */
  delete(key: string): Promise<void>;
  /** Resolves when the bucket answers. */
  probe(): Promise<void>;
  /** Creates the bucket when it does not exist (local fake and restore targets only). */
  ensureBucket(): Promise<void>;
  readonly description: string;
}

export function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/** Reads an object and checks its size and SHA-256 against what the database recorded. */
export async function readVerified(store: ObjectStore, record: { key: string; sha256: string; sizeBytes: number }): Promise<Buffer> {
  const bytes = await store.get(record.key);
  const actual = { sha256: sha256Hex(bytes), sizeBytes: bytes.length };
  if (actual.sha256 !== record.sha256 || actual.sizeBytes !== Number(record.sizeBytes)) {
    throw new StorageIntegrityError(record.key, { sha256: record.sha256, sizeBytes: Number(record.sizeBytes) }, actual);
  }
  return bytes;
}

/** The S3 driver (AWS SDK for JavaScript v3): AWS itself or any S3-compatible endpoint. */
export function createS3ObjectStore(settings: StorageSettings, options: { timeoutMs?: number; maxAttempts?: number } = {}): ObjectStore {
  const makeClient = (maxAttempts: number, timeoutMs: number) =>
    new S3Client({
      region: settings.region,
      ...(settings.endpoint ? { endpoint: settings.endpoint } : {}),
      forcePathStyle: settings.forcePathStyle,
      ...(settings.credentials ? { credentials: settings.credentials } : {}),
      maxAttempts,
      // Our own SHA-256 goes with each write (ChecksumSHA256, checked by S3 on arrival) and each read
      // is verified against the database's record; no second CRC on top.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
      requestHandler: { requestTimeout: timeoutMs, connectionTimeout: Math.min(timeoutMs, 5_000) },
    });
  const client = makeClient(options.maxAttempts ?? 3, options.timeoutMs ?? 30_000);
  // The readiness probe asks once, without the SDK's retries and their back-off: a load balancer
  // asks again in a few seconds anyway, and the probe must answer within its own time limit.
  let probeClient: S3Client | null = null;
  const bucket = settings.bucket;
  const full = (key: string) => `${settings.prefix}${key}`;
  const description = `s3://${bucket}/${settings.prefix}${settings.endpoint ? ` at ${settings.endpoint}` : ""}`;

  return {
    description,
    async put({ key, bytes, sha256, contentType }) {
      try {
        await client.send(
          new PutObjectCommand({
            Bucket: bucket,
            Key: full(key),
            Body: bytes,
            ContentType: contentType,
            ContentLength: bytes.byteLength,
            ChecksumSHA256: Buffer.from(sha256, "hex").toString("base64"),
          }),
        );
      } catch (error) {
        throw new StorageUnavailableError("The file store did not accept the file.", error);
      }
    },
    async get(key) {
      try {
        const answer = await client.send(new GetObjectCommand({ Bucket: bucket, Key: full(key) }));
        return Buffer.from(await answer.Body!.transformToByteArray());
      } catch (error) {
        if (error instanceof NoSuchKey || (error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404)) throw new StorageMissingError(key);
        throw new StorageUnavailableError("The file store could not be read.", error);
      }
    },
    async *list(prefix = "") {
      let token: string | undefined;
      do {
        let page;
        try {
          page = await client.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: full(prefix), ContinuationToken: token }));
        } catch (error) {
          throw new StorageUnavailableError("The file store could not list its objects.", error);
        }
        for (const o of page.Contents ?? []) {
          yield { key: o.Key!.slice(settings.prefix.length), sizeBytes: Number(o.Size ?? 0), lastModified: o.LastModified ?? new Date(0) };
        }
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
    },
    async delete(key) {
      try {
        await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: full(key) }));
      } catch (error) {
        throw new StorageUnavailableError("The file store did not delete the object.", error);
      }
    },
    async probe() {
      try {
        await (probeClient ??= makeClient(1, Math.min(options.timeoutMs ?? 30_000, 1_500))).send(new HeadBucketCommand({ Bucket: bucket }));
      } catch (error) {
        throw new StorageUnavailableError("The file store cannot be reached.", error);
      }
    },
    async ensureBucket() {
      try {
        await client.send(new HeadBucketCommand({ Bucket: bucket }));
        return;
      } catch (error) {
        if (!(error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404)) throw new StorageUnavailableError("The file store cannot be reached.", error);
      }
      try {
        await client.send(new CreateBucketCommand({ Bucket: bucket }));
      } catch (error) {
        throw new StorageUnavailableError(`The bucket ${bucket} could not be created.`, error);
      }
    },
  };
}

function describe(cause: unknown): string {
  if (cause === undefined) return "";
  const e = cause as { name?: string; message?: string; $metadata?: { httpStatusCode?: number } };
  const status = e?.$metadata?.httpStatusCode;
  return `${e?.name ?? "Error"}${status ? ` (HTTP ${status})` : ""}: ${String(e?.message ?? cause).split("\n")[0]}`;
}
