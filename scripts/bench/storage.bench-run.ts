/**
 * What the object store costs against keeping the bytes in MariaDB (npm run bench; figures only).
 * In one process, alternating, for a bench file (a fixture, as uploaded) and a released-PDF-sized
 * file (400 kB): the write as the app did it before (INSERT of the bytes into a LONGBLOB row of a
 * scratch table in benchfold_test) against the write now (PutObject through the app's S3 driver),
 * and the read before (SELECT of the LONGBLOB) against the read now (GetObject and the SHA-256 and
 * size check). The store is the configured one or s3rver in this process (bench-store.ts).
 */
import { randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { QueryTypes } from "sequelize";
import { it } from "vitest";
import { ensureBenchStore } from "./bench-store";

const rounds = Number(process.env.BENCH_STORAGE_ROUNDS ?? 40);
const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))];

it("times the object store against MariaDB BLOBs", { timeout: 600_000 }, async () => {
  process.env.DB_NAME ??= "benchfold_test";
  const { createSequelize } = await import("@/models/connection");
  const sequelize = createSequelize();
  try {
    await sequelize.authenticate();
  } catch (error) {
    console.log(`storage benchmark skipped: no database ${process.env.DB_NAME} (${(error as Error).message.split("\n")[0]}); run npm run db:start, and npm test once`);
    await sequelize.close();
    return;
  }
  const store = await ensureBenchStore();
  const { createS3ObjectStore, readVerified, sha256Hex } = await import("@/lib/server/storage/object-store");
  const { readStorageSettings } = await import("@/lib/server/storage/storage-config");
  const { contentKey } = await import("@/lib/server/storage/object-key");
  const s3 = createS3ObjectStore(readStorageSettings());
  await sequelize.query("CREATE TABLE IF NOT EXISTS bench_storage_blobs (id INT UNSIGNED AUTO_INCREMENT PRIMARY KEY, bytes LONGBLOB NOT NULL) ENGINE=InnoDB");
  const lines: string[] = [];
  try {
    const files = [
      { name: "bench file (fixture)", base: readFileSync(path.resolve(__dirname, "../../fixtures/examples/drive-sweep-doubler.csv")) },
      { name: "PDF-sized (400 kB)", base: randomBytes(400 * 1024) },
    ];
    for (const file of files) {
      const t = { blobWrite: [] as number[], s3Write: [] as number[], blobRead: [] as number[], s3Read: [] as number[] };
      for (let i = 0; i < rounds; i++) {
        // New bytes each round (a new key), as each upload is.
        const bytes = Buffer.concat([file.base, Buffer.from(`\n# ${i} ${randomBytes(8).toString("hex")}\n`)]);
        let t0 = performance.now();
        const [id] = (await sequelize.query("INSERT INTO bench_storage_blobs (bytes) VALUES (?)", { replacements: [bytes], type: QueryTypes.INSERT })) as unknown as [number];
        t.blobWrite.push(performance.now() - t0);
        t0 = performance.now();
        const sha256 = sha256Hex(bytes);
        const key = contentKey(sha256);
        await s3.put({ key, bytes, sha256, contentType: "application/octet-stream" });
        t.s3Write.push(performance.now() - t0);
        t0 = performance.now();
        await sequelize.query("SELECT bytes FROM bench_storage_blobs WHERE id = ?", { replacements: [id], type: QueryTypes.SELECT });
        t.blobRead.push(performance.now() - t0);
        t0 = performance.now();
        await readVerified(s3, { key, sha256, sizeBytes: bytes.length });
        t.s3Read.push(performance.now() - t0);
      }
      const f = (xs: number[]) => `p50 ${quantile(xs, 0.5).toFixed(1)} ms, p95 ${quantile(xs, 0.95).toFixed(1)} ms`;
      lines.push(
        `${file.name}, ${(file.base.length / 1024).toFixed(1)} kB, ${rounds} rounds:`,
        `  write: MariaDB BLOB ${f(t.blobWrite)} | object store ${f(t.s3Write)} | ratio of p50s ${(quantile(t.s3Write, 0.5) / quantile(t.blobWrite, 0.5)).toFixed(2)}`,
        `  read:  MariaDB BLOB ${f(t.blobRead)} | object store + SHA-256 check ${f(t.s3Read)} | ratio of p50s ${(quantile(t.s3Read, 0.5) / quantile(t.blobRead, 0.5)).toFixed(2)}`,
      );
    }
  } finally {
    await sequelize.query("DROP TABLE IF EXISTS bench_storage_blobs");
    await sequelize.close();
    await store.stop();
  }
  console.log(`\nObject store against MariaDB BLOBs (store: ${store.description})\n${lines.join("\n")}`);
});
