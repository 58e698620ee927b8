import { createS3ObjectStore, type ObjectStore } from "@/lib/server/storage/object-store";
import { readStorageSettings } from "@/lib/server/storage/storage-config";

/** The run's object store (the local fake S3 that npm test starts), through the app's own S3 driver. */
export function runStore(env: Record<string, string | undefined> = process.env): ObjectStore {
  return createS3ObjectStore(readStorageSettings(env), { maxAttempts: 1 });
}

/**
 * Makes the run's fake S3 refuse writes and/or reads with 503 (scripts/fake-s3.ts, PUT /_fake/faults),
 * or carry writes out and answer 503 all the same ("lose-answer": the writer keeps nothing, the store
 * keeps an orphan); `{}` turns it back to normal. Integration files run one at a time, so this
 * touches no other test.
 */
export async function setFakeS3Faults(faults: { writes?: "fail" | "lose-answer"; reads?: "fail" }): Promise<void> {
  const endpoint = process.env.S3_ENDPOINT;
  if (!endpoint || process.env.BENCHFOLD_FAKE_S3 !== "1") throw new Error("the tests need the run's fake S3 store (npm test starts it)");
  const response = await fetch(`${endpoint}/_fake/faults`, { method: "PUT", body: JSON.stringify(faults) });
  if (!response.ok) throw new Error(`fake S3 answered ${response.status} to PUT /_fake/faults`);
}
