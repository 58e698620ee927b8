/**
 * Migration 20261203-1500 (files to the object store) on a database of its own
 * (benchfold_migrate_test, emptied by scripts/db.sh reset), migrated to the step before it and
 * filled with files the old way (bytes in stored_files and sheet_revisions.pdf):
 * - a row whose bytes are not its recorded SHA-256 stops the migration naming the row, and the
 *   bytes stay in the database;
 * - run again once the row is repaired, it carries on (rows already moved keep their key), puts
 *   every file in the run's store under its content key, drops both byte columns, and leaves every
 *   revision row as it was (same SHA-256; the append-only trigger still refuses an UPDATE);
 * - run a third time, it changes nothing and does not fail.
 */
import { execFileSync } from "node:child_process";
import { createHash, randomBytes } from "node:crypto";
import path from "node:path";
import { QueryTypes, type Sequelize } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { contentKey } from "@/lib/server/storage/object-key";
import { readVerified } from "@/lib/server/storage/object-store";
import { createSequelize, readDatabaseSettings } from "@/models";
import { createMigrator } from "@/models/migrator";
import { runStore } from "./helpers/object-store";

const root = path.resolve(__dirname, "../..");
const database = "benchfold_migrate_test";
const step = "20261203-1500-files-to-object-store.ts";
const sha = (b: Buffer) => createHash("sha256").update(b).digest("hex");
let sequelize: Sequelize;

const files = [0, 1, 2].map((i) => Buffer.from(`# bench file ${i} ${randomBytes(8).toString("hex")}\n1,2,3\n`));
const pdfs = [0, 1].map((i) => Buffer.concat([Buffer.from("%PDF-1.4\n"), randomBytes(2000 + i)]));

const select = <T extends object>(sql: string, replacements: unknown[] = []) => sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
const columnsOf = async (table: string) => Object.keys(await sequelize.getQueryInterface().describeTable(table));

beforeAll(async () => {
  execFileSync("bash", [path.join(root, "scripts/db.sh"), "reset", database], { cwd: root, env: process.env, stdio: "pipe" });
  sequelize = createSequelize({ ...readDatabaseSettings(), database });
  await createMigrator(sequelize).up({ to: "20261202-0920-spec-limit-typed-decimals.ts" });
  await sequelize.transaction(async (transaction) => {
    const q = (sql: string, replacements: unknown[]) => sequelize.query(sql, { replacements, transaction });
    // The parents the file rows point at (a migration's ALTER TABLE checks every foreign key).
    await q("INSERT INTO organizations (id, slug, name, kind, created_at, updated_at) VALUES (1, 'migration-test', 'Migration Test', 'vendor', NOW(3), NOW(3))", []);
    await q("INSERT INTO users (id, organization_id, email, name, password_hash, role, created_at, updated_at) VALUES (1, 1, 'm@migration-test.example', 'M', 'x', 'engineer', NOW(3), NOW(3))", []);
    await q("INSERT INTO devices (id, organization_id, part_number, device_class, title, description, key_conditions, created_at, updated_at) VALUES (1, 1, 'MIGR-1', 'doubler', 'Migration test', '', '{}', NOW(3), NOW(3))", []);
    for (const id of [1, 2]) {
      await q(
        `INSERT INTO sheet_candidates (id, organization_id, device_id, state, model_json, model_digest, model_date, acknowledgements, note, required_signatures, submitted_by_id, submitted_at, created_at, updated_at)
         VALUES (?, 1, 1, 'released', '{}', REPEAT('0', 64), '2026-12-01', '[]', '', 1, 1, NOW(3), NOW(3), NOW(3))`,
        [id],
      );
    }
    for (const [i, bytes] of files.entries()) {
      // The second file's recorded SHA-256 is wrong: the first run must stop there.
      const recorded = i === 1 ? "f".repeat(64) : sha(bytes);
      await q("INSERT INTO stored_files (id, organization_id, sha256, size_bytes, original_name, content_type, bytes, created_at) VALUES (?, 1, ?, ?, ?, 'text/csv', ?, NOW(3))", [i + 1, recorded, bytes.length, `f${i}.csv`, bytes]);
    }
    for (const [i, pdf] of pdfs.entries()) {
      await q(
        `INSERT INTO sheet_revisions (id, organization_id, device_id, candidate_id, sequence, letter, previous_revision_id, model_json, model_digest, pdf, pdf_sha256, pdf_bytes, reference, release_notes, engineer_note, released_by_id, released_at, created_at)
         VALUES (?, 1, 1, ?, ?, ?, ?, '{}', REPEAT('0', 64), ?, ?, ?, ?, '[]', '', 1, NOW(3), NOW(3))`,
        [i + 1, i + 1, i + 1, "AB"[i], i === 0 ? null : 1, pdf, sha(pdf), pdf.length, `MIGR${i}-${randomBytes(3).toString("hex")}`],
      );
    }
  });
}, 180_000);

afterAll(() => sequelize?.close());

describe("migration 20261203-1500", () => {
  it("stops at a row whose bytes are not its recorded SHA-256, naming it, and keeps the bytes", async () => {
    await expect(createMigrator(sequelize).up()).rejects.toThrow(/stored_files #2: the bytes in the database .* are not the recorded ones/);
    expect(await columnsOf("stored_files")).toContain("bytes");
    const moved = await select<{ id: number; storage_key: string | null }>("SELECT id, storage_key FROM stored_files ORDER BY id");
    expect(moved).toEqual([
      { id: 1, storage_key: contentKey(sha(files[0])) },
      { id: 2, storage_key: null },
      { id: 3, storage_key: null },
    ]);
  });

  it("carries on once the row is repaired: every file in the store, the byte columns gone, revisions untouched", async () => {
    const before = await select<{ id: number; pdf_sha256: string; pdf_bytes: number; reference: string }>("SELECT id, pdf_sha256, pdf_bytes, reference FROM sheet_revisions ORDER BY id");
    await sequelize.query("UPDATE stored_files SET sha256 = ? WHERE id = 2", { replacements: [sha(files[1])] });
    const done = await createMigrator(sequelize).up({ to: step });
    expect(done.map((m) => m.name)).toEqual([step]);

    expect(await columnsOf("stored_files")).not.toContain("bytes");
    expect(await columnsOf("sheet_revisions")).not.toContain("pdf");
    const store = runStore();
    const rows = await select<{ storage_key: string; sha256: string; size_bytes: number }>("SELECT storage_key, sha256, size_bytes FROM stored_files ORDER BY id");
    expect(rows.map((r) => r.storage_key)).toEqual(files.map((f) => contentKey(sha(f))));
    for (const [i, r] of rows.entries()) expect((await readVerified(store, { key: r.storage_key, sha256: r.sha256, sizeBytes: r.size_bytes })).equals(files[i])).toBe(true);

    const after = await select<{ id: number; pdf_sha256: string; pdf_bytes: number; reference: string; pdf_key: string }>("SELECT id, pdf_sha256, pdf_bytes, reference, pdf_key FROM sheet_revisions ORDER BY id");
    expect(after.map(({ pdf_key: _key, ...rest }) => rest)).toEqual(before);
    for (const [i, r] of after.entries()) {
      // The generated key is the same content key the app computes (lib/server/storage/object-key.ts).
      expect(r.pdf_key).toBe(contentKey(sha(pdfs[i])));
      expect((await readVerified(store, { key: r.pdf_key, sha256: r.pdf_sha256, sizeBytes: r.pdf_bytes })).equals(pdfs[i])).toBe(true);
    }
    await expect(sequelize.query("UPDATE sheet_revisions SET letter = 'Z' WHERE id = 1")).rejects.toThrow(/append-only/);
  });

  it("run again, changes nothing and does not fail", async () => {
    const before = await select("SELECT * FROM stored_files ORDER BY id");
    const migration = (await import("@/models/migrations/20261203-1500-files-to-object-store")) as { up: (p: { context: ReturnType<Sequelize["getQueryInterface"]> }) => Promise<void> };
    await migration.up({ context: sequelize.getQueryInterface() });
    expect(await select("SELECT * FROM stored_files ORDER BY id")).toEqual(before);
  });
});
