import { createHash } from "node:crypto";
import { HeadObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from "@aws-sdk/client-s3";
import { QueryTypes, type QueryInterface } from "sequelize";

// Frozen: the columns, the key scheme and the storage settings of its day, not imported from code.
//
// Moves every file kept in MariaDB (stored_files.bytes: bench files; sheet_revisions.pdf: released
// PDFs) to the object store (S3_BUCKET, S3_ENDPOINT, …: lib/server/storage/storage-config.ts), each
// under its content key `sha256/<2 hex>/<64 hex>`, then drops the byte columns. MariaDB keeps key,
// size and SHA-256.
//
// Idempotent and resumable: a key names one byte string, so writing an object again is harmless;
// a stored_files row is marked moved (storage_key set) right after its write, and the revisions are
// checked object by object. Each file's bytes are checked against their recorded SHA-256 and size
// before they go (a mismatch stops the migration naming the row, nothing dropped), and the byte
// columns are dropped only after every object has been read back from the store by size.
//
// sheet_revisions is append-only (triggers of 20261202-0700 refuse UPDATE and DELETE), and stays so:
// no revision row is updated here. Its key is a generated column of pdf_sha256, added by ALTER TABLE
// (DDL does not fire row triggers), so pdf_sha256, the SHA-256 printed and verified everywhere, is
// untouched; only the bytes move.

const BATCH = 20;
const keyOf = (sha256: string) => `sha256/${sha256.slice(0, 2)}/${sha256}`;

type Store = { put(key: string, bytes: Buffer, sha256: string, contentType: string): Promise<void>; size(key: string): Promise<number | null> };

function openStore(): Store {
  const env = process.env;
  const bucket = (env.S3_BUCKET ?? "").trim();
  if (!bucket) throw new Error("Files stored in the database move to the object store: set S3_BUCKET (npm start and npm test start a local store and set it).");
  const endpoint = (env.S3_ENDPOINT ?? "").trim() || undefined;
  const folder = (env.S3_PREFIX ?? "").trim().replace(/^\/+|\/+$/g, "");
  const prefix = folder ? `${folder}/` : "";
  const pathStyle = env.S3_FORCE_PATH_STYLE;
  const client = new S3Client({
    region: (env.S3_REGION ?? "").trim() || "us-east-1",
    endpoint,
    forcePathStyle: pathStyle === undefined || pathStyle === "" ? endpoint !== undefined : pathStyle === "1" || pathStyle === "true",
    ...(env.S3_ACCESS_KEY_ID ? { credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? "" } } : {}),
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return {
    async put(key, bytes, sha256, contentType) {
      await client.send(
        new PutObjectCommand({ Bucket: bucket, Key: prefix + key, Body: bytes, ContentType: contentType, ContentLength: bytes.length, ChecksumSHA256: Buffer.from(sha256, "hex").toString("base64") }),
      );
    },
    async size(key) {
      try {
        const head = await client.send(new HeadObjectCommand({ Bucket: bucket, Key: prefix + key }));
        return Number(head.ContentLength ?? -1);
      } catch (error) {
        if (error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404) return null;
        throw error;
      }
    },
  };
}

async function columns(qi: QueryInterface, table: string): Promise<Set<string>> {
  return new Set(Object.keys(await qi.describeTable(table)));
}

function checkBytes(what: string, bytes: Buffer, sha256: string, sizeBytes: number) {
  const actual = createHash("sha256").update(bytes).digest("hex");
  if (actual !== sha256 || bytes.length !== Number(sizeBytes)) {
    throw new Error(`${what}: the bytes in the database (${bytes.length} bytes, SHA-256 ${actual}) are not the recorded ones (${sizeBytes} bytes, ${sha256}); nothing was dropped. Repair this row, then migrate again.`);
  }
}

async function requireAllStored(store: Store, what: string, rows: { key: string; size_bytes: number }[]) {
  for (const row of rows) {
    const size = await store.size(row.key);
    if (size !== Number(row.size_bytes)) throw new Error(`${what}: object ${row.key} is ${size === null ? "missing" : `${size} bytes, not ${row.size_bytes}`} in the store; the bytes stay in the database. Migrate again.`);
  }
}

export async function up({ context: qi }: { context: QueryInterface }) {
  const sql = <T extends object>(text: string, replacements: unknown[] = []) => qi.sequelize.query<T>(text, { type: QueryTypes.SELECT, replacements });
  const exec = (text: string, replacements: unknown[] = []) => qi.sequelize.query(text, { replacements });
  let store: Store | null = null;
  const opened = () => (store ??= openStore());

  // Bench files (and any other upload): stored_files.bytes → object, storage_key marks the move.
  const fileColumns = await columns(qi, "stored_files");
  if (!fileColumns.has("storage_key")) await exec("ALTER TABLE stored_files ADD COLUMN storage_key VARCHAR(255) NULL AFTER size_bytes");
  if (fileColumns.has("bytes")) {
    for (;;) {
      const rows = await sql<{ id: number; sha256: string; size_bytes: number; content_type: string; bytes: Buffer }>(
        `SELECT id, sha256, size_bytes, content_type, bytes FROM stored_files WHERE storage_key IS NULL ORDER BY id LIMIT ${BATCH}`,
      );
      if (!rows.length) break;
      for (const row of rows) {
        const bytes = Buffer.from(row.bytes);
        checkBytes(`stored_files #${row.id}`, bytes, row.sha256, row.size_bytes);
        await opened().put(keyOf(row.sha256), bytes, row.sha256, row.content_type);
        await exec("UPDATE stored_files SET storage_key = ? WHERE id = ?", [keyOf(row.sha256), row.id]);
      }
    }
    const moved = await sql<{ key: string; size_bytes: number }>("SELECT DISTINCT storage_key AS `key`, size_bytes FROM stored_files");
    if (moved.length) await requireAllStored(opened(), "stored_files", moved);
    await exec("ALTER TABLE stored_files DROP COLUMN bytes");
  }
  await exec("ALTER TABLE stored_files MODIFY storage_key VARCHAR(255) NOT NULL");

  // Released PDFs: the key is generated from the (unchanged) SHA-256; no revision row is updated.
  const revisionColumns = await columns(qi, "sheet_revisions");
  if (!revisionColumns.has("pdf_key")) {
    await exec("ALTER TABLE sheet_revisions ADD COLUMN pdf_key VARCHAR(80) AS (CONCAT('sha256/', LEFT(pdf_sha256, 2), '/', pdf_sha256)) VIRTUAL AFTER pdf_bytes");
  }
  if (revisionColumns.has("pdf")) {
    for (let last = 0; ; ) {
      const rows = await sql<{ id: number; pdf: Buffer; pdf_sha256: string; pdf_bytes: number; pdf_key: string }>(
        `SELECT id, pdf, pdf_sha256, pdf_bytes, pdf_key FROM sheet_revisions WHERE id > ? ORDER BY id LIMIT ${BATCH}`,
        [last],
      );
      if (!rows.length) break;
      for (const row of rows) {
        last = row.id;
        const bytes = Buffer.from(row.pdf);
        checkBytes(`sheet_revisions #${row.id}`, bytes, row.pdf_sha256, row.pdf_bytes);
        if ((await opened().size(row.pdf_key)) !== bytes.length) await opened().put(row.pdf_key, bytes, row.pdf_sha256, "application/pdf");
      }
    }
    const moved = await sql<{ key: string; size_bytes: number }>("SELECT DISTINCT pdf_key AS `key`, pdf_bytes AS size_bytes FROM sheet_revisions");
    if (moved.length) await requireAllStored(opened(), "sheet_revisions", moved);
    await exec("ALTER TABLE sheet_revisions DROP COLUMN pdf");
  }
}

export async function down() {
  throw new Error("20261203-1500 moved the file bytes to the object store; it is not undone by a migration. Restore an earlier backup (npm run restore) instead.");
}
