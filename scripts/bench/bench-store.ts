/**
 * The object store a benchmark writes to: the configured one (S3_BUCKET, e.g. npm start's fake S3
 * exported by scripts/lib.sh), or else s3rver, the same npm fake, started in this process on a free
 * loopback port with its objects in a temporary folder. Either way the app's own S3 driver is used.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

export async function ensureBenchStore(): Promise<{ description: string; stop: () => Promise<void> }> {
  if (process.env.S3_BUCKET) return { description: `configured bucket ${process.env.S3_BUCKET}${process.env.S3_ENDPOINT ? ` at ${process.env.S3_ENDPOINT}` : ""}`, stop: async () => undefined };
  const { default: S3rver } = await import("s3rver");
  const dir = mkdtempSync(path.join(tmpdir(), "benchfold-bench-s3-"));
  const fake = new S3rver({ directory: dir, silent: true, port: 0, address: "127.0.0.1", configureBuckets: [{ name: "benchfold-bench", configs: [] }] });
  const { port } = await fake.run();
  Object.assign(process.env, { S3_BUCKET: "benchfold-bench", S3_ENDPOINT: `http://127.0.0.1:${port}`, S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER" });
  return {
    description: `s3rver in this process on 127.0.0.1:${port}`,
    stop: async () => {
      await fake.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
