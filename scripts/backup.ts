/**
 * npm run backup [-- --out <folder>]: a backup that restores (npm run restore).
 *
 * 1. The database, consistent at one moment: `mariadb-dump --single-transaction` (Debian's
 *    mariadb-client) of DB_NAME, tables, triggers and data, to database.sql.
 * 2. The stored objects that database refers to (stored_files.storage_key, sheet_revisions.pdf_key),
 *    each read from the store, checked against its recorded size and SHA-256, and written to
 *    objects/<key>. Objects are immutable and content-addressed and rows that refer to them are never
 *    removed, so copying them after the dump's moment gives every object the dump needs.
 * 3. manifest.json: the dump's SHA-256 and size, and every object's key, SHA-256 and size.
 *
 * Default folder: $BENCHFOLD_DATA_DIR/backups/<UTC time>. An object that cannot be read or does not
 * match its record fails the backup, naming it (a backup never copies a damaged file as if it were
 * good). Settings: DB_* as the app (scripts/lib.sh), S3_* (lib/server/storage/storage-config.ts).
 */
import { spawn } from "node:child_process";
import { createWriteStream, mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { createS3ObjectStore, readVerified } from "../lib/server/storage/object-store";
import { readStorageSettings } from "../lib/server/storage/storage-config";
import { createSequelize, readDatabaseSettings } from "../models/connection";
import { BACKUP_FORMAT, type BackupManifest, referencedObjects, sha256File } from "./backup-manifest";

function argument(name: string): string | undefined {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

function dumpDatabase(file: string, settings: ReturnType<typeof readDatabaseSettings>): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(
      "mariadb-dump",
      [
        "--no-defaults",
        `--host=${settings.host}`,
        `--port=${settings.port}`,
        `--user=${settings.user}`,
        "--single-transaction",
        "--triggers",
        "--routines",
        "--hex-blob",
        "--skip-lock-tables",
        "--default-character-set=utf8mb4",
        settings.database,
      ],
      // The password through the environment, not the command line (where ps shows it).
      { env: { ...process.env, MYSQL_PWD: settings.password }, stdio: ["ignore", "pipe", "pipe"] },
    );
    const out = createWriteStream(file);
    let stderr = "";
    child.stdout.pipe(out);
    child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
    child.on("error", (error) => reject(new Error(`mariadb-dump could not run (Debian's mariadb-client installs it): ${error.message}`)));
    child.on("close", (code) => {
      out.close(() => (code === 0 ? resolve() : reject(new Error(`mariadb-dump exited ${code}: ${stderr.trim().split("\n").slice(-3).join(" ")}`))));
    });
  });
}

async function main() {
  const database = readDatabaseSettings();
  const store = createS3ObjectStore(readStorageSettings());
  const started = Date.now();
  const stamp = new Date().toISOString().replace(/[:.]/g, "-");
  const folder = path.resolve(argument("--out") ?? path.join(process.env.BENCHFOLD_DATA_DIR ?? ".data", "backups", stamp));
  mkdirSync(path.join(folder, "objects"), { recursive: true });

  const dumpFile = path.join(folder, "database.sql");
  await dumpDatabase(dumpFile, database);
  const dump = await sha256File(dumpFile);
  console.error(`[benchfold] backup: database ${database.database} dumped (${(dump.sizeBytes / 1024).toFixed(0)} kB)`);

  const sequelize = createSequelize(database);
  let objects;
  try {
    objects = await referencedObjects((sql) => sequelize.query(sql, { type: QueryTypes.SELECT }));
  } finally {
    await sequelize.close();
  }
  let bytes = 0;
  for (const o of objects) {
    let data: Buffer;
    try {
      data = await readVerified(store, o);
    } catch (error) {
      throw new Error(`object ${o.key} (${o.sizeBytes} bytes, SHA-256 ${o.sha256}) cannot be backed up: ${(error as Error).message}`);
    }
    const file = path.join(folder, "objects", ...o.key.split("/"));
    mkdirSync(path.dirname(file), { recursive: true });
    writeFileSync(file, data);
    bytes += data.length;
  }
  const manifest: BackupManifest = {
    format: BACKUP_FORMAT,
    createdAt: new Date(started).toISOString(),
    database: { name: database.database, file: "database.sql", ...dump },
    objects,
  };
  writeFileSync(path.join(folder, "manifest.json"), `${JSON.stringify(manifest, null, 2)}\n`);
  console.error(`[benchfold] backup: ${objects.length} objects (${(bytes / 1024).toFixed(0)} kB), each checked against its SHA-256, in ${Date.now() - started} ms`);
  console.log(folder);
}

main().catch((error: Error) => {
  console.error(`[benchfold] backup failed: ${error.message}`);
  process.exit(1);
});
