/**
 * Backups that restore (DEVELOPERS.md, "Files and backups"): scripts/backup.ts dumps the run's
 * database (with the demo's released sheets) and copies its stored objects with a manifest;
 * scripts/restore.ts brings them into an empty database (benchfold_restore_test, made empty by
 * scripts/db.sh reset) and an empty bucket of the run's fake S3 store. Then every released
 * revision's PDF, read from the restored store, has the SHA-256 the source recorded, and every
 * audit row present before the backup is in the restored database, column for column. A restore
 * into a database that has tables, and one from a backup whose object was altered, are refused
 * before anything is written.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { cpSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { randomBytes } from "node:crypto";
import { QueryTypes, type Sequelize } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readVerified } from "@/lib/server/storage/object-store";
import { closeDb, createSequelize, db, readDatabaseSettings } from "@/models";
import { parseManifest } from "@/scripts/backup-manifest";
import { runStore } from "./helpers/object-store";

const root = path.resolve(__dirname, "../..");
const restoreDb = "benchfold_restore_test";
const restoreBucket = `benchfold-restore-${randomBytes(4).toString("hex")}`;
const restoreEnv = { ...process.env, DB_NAME: restoreDb, S3_BUCKET: restoreBucket };

function tsx(script: string, args: string[], env: NodeJS.ProcessEnv = process.env) {
  return spawnSync(process.execPath, [path.join(root, "node_modules/tsx/dist/cli.mjs"), path.join(root, script), ...args], { cwd: root, env, encoding: "utf8", timeout: 240_000 });
}

const emptyRestoreDatabase = () => execFileSync("bash", [path.join(root, "scripts/db.sh"), "reset", restoreDb], { cwd: root, env: process.env, stdio: "pipe" });

type AuditRow = Record<string, unknown> & { id: number };
const auditRows = (sequelize: Sequelize) => sequelize.query<AuditRow>("SELECT * FROM audit_events ORDER BY id", { type: QueryTypes.SELECT });
type RevisionRow = { id: number; letter: string; pdf_key: string; pdf_sha256: string; pdf_bytes: number };
const revisionRows = (sequelize: Sequelize) => sequelize.query<RevisionRow>("SELECT id, letter, pdf_key, pdf_sha256, pdf_bytes FROM sheet_revisions ORDER BY id", { type: QueryTypes.SELECT });

let folder = "";
let sourceRevisions: RevisionRow[] = [];
let sourceAudit: AuditRow[] = [];
let restored: Sequelize;

beforeAll(async () => {
  sourceRevisions = await revisionRows(db().sequelize);
  sourceAudit = await auditRows(db().sequelize);
  folder = mkdtempSync(path.join(tmpdir(), "benchfold-backup-"));
  const backup = tsx("scripts/backup.ts", ["--out", folder]);
  expect(backup.status, backup.stderr).toBe(0);
  emptyRestoreDatabase();
  const restore = tsx("scripts/restore.ts", [folder], restoreEnv);
  expect(restore.status, restore.stderr).toBe(0);
  expect(restore.stderr).toMatch(/read back and match their SHA-256/);
  restored = createSequelize({ ...readDatabaseSettings(), database: restoreDb });
}, 300_000);

afterAll(async () => {
  await restored?.close();
  await closeDb();
});

describe("a backup restored into an empty database and store", () => {
  it("has every released revision, whose PDF in the restored store has the SHA-256 recorded at release", async () => {
    expect(sourceRevisions.length).toBeGreaterThan(0);
    const after = await revisionRows(restored);
    const byId = new Map(after.map((r) => [r.id, r]));
    const store = runStore(restoreEnv);
    for (const source of sourceRevisions) {
      expect(byId.get(source.id)).toEqual(source);
      // readVerified hashes the bytes it read and compares them with the recorded SHA-256 and size.
      const pdf = await readVerified(store, { key: source.pdf_key, sha256: source.pdf_sha256, sizeBytes: source.pdf_bytes });
      expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    }
  });

  it("has every audit row present before the backup, column for column", async () => {
    expect(sourceAudit.length).toBeGreaterThan(0);
    const after = new Map((await auditRows(restored)).map((r) => [r.id, r]));
    for (const row of sourceAudit) expect(after.get(row.id)).toEqual(row);
  });

  it("keeps the immutability triggers: a restored revision still refuses an UPDATE", async () => {
    await expect(restored.query("UPDATE sheet_revisions SET letter = 'Z' WHERE id = ?", { replacements: [sourceRevisions[0].id] })).rejects.toThrow(/append-only/);
  });

  it("lists every object once in the manifest with its SHA-256, and the copies match it", () => {
    const manifest = parseManifest(readFileSync(path.join(folder, "manifest.json"), "utf8"));
    const keys = manifest.objects.map((o) => o.key);
    expect(new Set(keys).size).toBe(keys.length);
    for (const r of sourceRevisions) expect(keys).toContain(r.pdf_key);
  });

  it("refuses to restore into a database that has tables", () => {
    const again = tsx("scripts/restore.ts", [folder], restoreEnv);
    expect(again.status).toBe(1);
    expect(again.stderr).toMatch(new RegExp(`database ${restoreDb} has \\d+ tables: a restore goes into an empty database`));
  });

  it("refuses a backup whose object was altered, before writing anything", async () => {
    const altered = mkdtempSync(path.join(tmpdir(), "benchfold-backup-altered-"));
    cpSync(folder, altered, { recursive: true });
    const manifest = parseManifest(readFileSync(path.join(altered, "manifest.json"), "utf8"));
    const victim = manifest.objects[0];
    const file = path.join(altered, "objects", ...victim.key.split("/"));
    const bytes = readFileSync(file);
    bytes[0] ^= 0xff;
    writeFileSync(file, bytes);
    emptyRestoreDatabase();
    const refused = tsx("scripts/restore.ts", [altered], restoreEnv);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toContain(`object ${victim.key} in the backup does not match its SHA-256 in the manifest; nothing was restored`);
    const [row] = await restored.query<{ n: number }>("SELECT COUNT(*) AS n FROM information_schema.tables WHERE table_schema = ?", { type: QueryTypes.SELECT, replacements: [restoreDb] });
    expect(Number(row.n)).toBe(0);
  });
});
