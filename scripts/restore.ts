/**
 * npm run restore -- <backup folder> [--database NAME] [--bucket NAME]: brings a backup of npm run
 * backup into a fresh database and store.
 *
 * The target is the database `--database` (default DB_NAME; it must have no tables: a restore never merges into live data;
 * on this machine's own MariaDB it is created when missing, through scripts/db.sh create) and the
 * bucket `--bucket` (default S3_BUCKET) of the configured store (created when missing). Before anything is written, the dump and every object file
 * are checked against the manifest's SHA-256 and size; a mismatch stops the restore naming the file.
 * Then the dump is loaded with Debian's `mariadb` client (DEFINER clauses removed, so the restoring
 * user owns the triggers), the objects are written to the store, and every object the restored
 * database refers to is read back from the store and checked against its recorded SHA-256.
 */
import { spawn, spawnSync } from "node:child_process";
import { createReadStream, existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { createInterface } from "node:readline";
import { QueryTypes } from "sequelize";
import { createS3ObjectStore, readVerified, sha256Hex } from "../lib/server/storage/object-store";
import { readStorageSettings } from "../lib/server/storage/storage-config";
import { createSequelize, readDatabaseSettings, type DatabaseSettings } from "../models/connection";
import { parseManifest, referencedObjects, sha256File } from "./backup-manifest";

const isLoopback = (host: string) => host === "localhost" || host === "::1" || host.startsWith("127.");

/** The target database exists and has no tables; on this machine's MariaDB a missing one is created. */
async function requireEmptyDatabase(settings: DatabaseSettings): Promise<void> {
  const count = async () => {
    const sequelize = createSequelize(settings);
    try {
      const [row] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM information_schema.tables WHERE table_schema = DATABASE()", { type: QueryTypes.SELECT });
      return Number(row.n);
    } finally {
      await sequelize.close();
    }
  };
  let tables: number;
  try {
    tables = await count();
  } catch (error) {
    // 1049: no such database; 1044: the user may not see it (MariaDB says so for a missing one it has no grant on).
    const unknown = /Unknown database|ER_BAD_DB_ERROR|no: 1049|Access denied for user .* to database|ER_DBACCESS_DENIED_ERROR|no: 1044/.test(String((error as Error).message) + String((error as { parent?: { code?: string } }).parent?.code));
    if (!unknown) throw error;
    if (!isLoopback(settings.host)) throw new Error(`database ${settings.database} does not exist on ${settings.host}: create it (empty) first`);
    const made = spawnSync("bash", [path.join(__dirname, "db.sh"), "create", settings.database], { stdio: "inherit" });
    if (made.status !== 0) throw new Error(`could not create database ${settings.database} (scripts/db.sh create)`);
    tables = await count();
  }
  if (tables > 0) throw new Error(`database ${settings.database} has ${tables} tables: a restore goes into an empty database (name a new one with --database)`);
}

/** Streams the dump into the `mariadb` client, line by line, without DEFINER clauses. */
function loadDump(file: string, settings: DatabaseSettings): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn("mariadb", ["--no-defaults", `--host=${settings.host}`, `--port=${settings.port}`, `--user=${settings.user}`, "--default-character-set=utf8mb4", settings.database], {
      env: { ...process.env, MYSQL_PWD: settings.password },
      stdio: ["pipe", "inherit", "pipe"],
    });
    let stderr = "";
    child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
    child.on("error", (error) => reject(new Error(`mariadb could not run (Debian's mariadb-client installs it): ${error.message}`)));
    child.on("close", (code) => (code === 0 ? resolve() : reject(new Error(`loading the dump failed (mariadb exited ${code}): ${stderr.trim().split("\n").slice(-3).join(" ")}`))));
    (async () => {
      const lines = createInterface({ input: createReadStream(file), crlfDelay: Infinity });
      for await (const line of lines) {
        const cleaned = line.replace(/\/\*!50017 DEFINER=`[^`]*`@`[^`]*`\s*\*\/\s?/g, "").replace(/\bDEFINER=`[^`]*`@`[^`]*`\s/g, "");
        if (!child.stdin.write(`${cleaned}\n`)) await new Promise((r) => child.stdin.once("drain", r));
      }
      child.stdin.end();
    })().catch((error: Error) => {
      child.kill();
      reject(error);
    });
  });
}

async function main() {
  const folder = process.argv[2] && !process.argv[2].startsWith("--") ? path.resolve(process.argv[2]) : null;
  if (!folder) throw new Error("usage: npm run restore -- <backup folder> (a folder written by npm run backup)");
  if (!existsSync(path.join(folder, "manifest.json"))) throw new Error(`${folder} has no manifest.json: not a backup of npm run backup`);
  const manifest = parseManifest(readFileSync(path.join(folder, "manifest.json"), "utf8"));
  const option = (name: string) => {
    const i = process.argv.indexOf(name);
    return i >= 0 ? process.argv[i + 1] : undefined;
  };
  const databaseName = option("--database") ?? readDatabaseSettings().database;
  if (!/^[A-Za-z0-9_]+$/.test(databaseName)) throw new Error(`database name "${databaseName}" must be letters, digits and _`);
  const database = { ...readDatabaseSettings(), database: databaseName };
  const store = createS3ObjectStore(readStorageSettings({ ...process.env, S3_BUCKET: option("--bucket") ?? process.env.S3_BUCKET }));
  const started = Date.now();

  // Everything is checked before anything is written.
  const dumpFile = path.join(folder, manifest.database.file);
  const dump = await sha256File(dumpFile);
  if (dump.sha256 !== manifest.database.sha256 || dump.sizeBytes !== manifest.database.sizeBytes) {
    throw new Error(`${manifest.database.file} is not the dumped file (SHA-256 ${dump.sha256}, ${dump.sizeBytes} bytes; the manifest says ${manifest.database.sha256}, ${manifest.database.sizeBytes}); nothing was restored`);
  }
  const objectFile = (key: string) => path.join(folder, "objects", ...key.split("/"));
  for (const o of manifest.objects) {
    const file = objectFile(o.key);
    if (!existsSync(file)) throw new Error(`object ${o.key} is missing from the backup; nothing was restored`);
    const actual = await sha256File(file);
    if (actual.sha256 !== o.sha256 || actual.sizeBytes !== o.sizeBytes) throw new Error(`object ${o.key} in the backup does not match its SHA-256 in the manifest; nothing was restored`);
  }
  await requireEmptyDatabase(database);
  await store.ensureBucket();

  await loadDump(dumpFile, database);
  console.error(`[benchfold] restore: database ${manifest.database.name} loaded into ${database.database}`);
  for (const o of manifest.objects) {
    const bytes = readFileSync(objectFile(o.key));
    if (sha256Hex(bytes) !== o.sha256) throw new Error(`object ${o.key} changed while restoring`);
    await store.put({ key: o.key, bytes, sha256: o.sha256, contentType: "application/octet-stream" });
  }

  // The restored database's every reference, read back from the store and checked.
  const sequelize = createSequelize(database);
  try {
    const referenced = await referencedObjects((sql) => sequelize.query(sql, { type: QueryTypes.SELECT }));
    for (const o of referenced) await readVerified(store, o);
    console.error(`[benchfold] restore: ${manifest.objects.length} objects written to ${store.description}; all ${referenced.length} the database refers to read back and match their SHA-256 (${Date.now() - started} ms)`);
  } finally {
    await sequelize.close();
  }
}

main().catch((error: Error) => {
  console.error(`[benchfold] restore failed: ${error.message}`);
  process.exit(1);
});
