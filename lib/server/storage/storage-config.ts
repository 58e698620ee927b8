/**
 * Where stored files go: an S3-compatible bucket, from the environment. The same settings are read
 * by the app, the outbox worker, the migration that moved files out of MariaDB, and backup/restore.
 *
 * | variable | |
 * |---|---|
 * | `S3_BUCKET` | the bucket (required; `npm start` and `npm test` start a local fake and set it when unset) |
 * | `S3_ENDPOINT` | an S3-compatible endpoint (MinIO, Ceph, a cloud vendor's); unset for AWS itself |
 * | `S3_REGION` | the bucket's region (`us-east-1`) |
 * | `S3_ACCESS_KEY_ID`, `S3_SECRET_ACCESS_KEY` | credentials; unset: the SDK's own chain (AWS_* variables, instance role) |
 * | `S3_FORCE_PATH_STYLE` | `1` for `endpoint/bucket/key` addresses; the default when `S3_ENDPOINT` is set |
 * | `S3_PREFIX` | a folder inside the bucket for every key (empty) |
 */
export type StorageSettings = {
  bucket: string;
  endpoint: string | null;
  region: string;
  credentials: { accessKeyId: string; secretAccessKey: string } | null;
  forcePathStyle: boolean;
  prefix: string;
};

export class StorageConfigError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "StorageConfigError";
  }
}

// S3 bucket naming rules (AWS S3 User Guide, "Bucket naming rules"): 3–63 characters, lowercase
// letters, digits, dots and hyphens, beginning and ending with a letter or digit.
const BUCKET_NAME = /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/;

export function readStorageSettings(env: Record<string, string | undefined> = process.env): StorageSettings {
  const bucket = (env.S3_BUCKET ?? "").trim();
  if (!bucket) throw new StorageConfigError("No file store is configured: set S3_BUCKET (and S3_ENDPOINT for a store other than AWS), or start Benchfold with npm start, which starts a local one.");
  if (!BUCKET_NAME.test(bucket)) throw new StorageConfigError(`S3_BUCKET "${bucket}" is not a bucket name: 3–63 lowercase letters, digits, dots or hyphens.`);
  const endpoint = (env.S3_ENDPOINT ?? "").trim() || null;
  const id = env.S3_ACCESS_KEY_ID ?? "";
  const secret = env.S3_SECRET_ACCESS_KEY ?? "";
  if (Boolean(id) !== Boolean(secret)) throw new StorageConfigError("Set both S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY, or neither.");
  const pathStyle = env.S3_FORCE_PATH_STYLE;
  const folder = (env.S3_PREFIX ?? "").trim().replace(/^\/+|\/+$/g, "");
  return {
    bucket,
    endpoint,
    region: (env.S3_REGION ?? "").trim() || "us-east-1",
    credentials: id ? { accessKeyId: id, secretAccessKey: secret } : null,
    forcePathStyle: pathStyle === undefined || pathStyle === "" ? endpoint !== null : pathStyle === "1" || pathStyle === "true",
    prefix: folder ? `${folder}/` : "",
  };
}
