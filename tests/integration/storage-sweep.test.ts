/**
 * The orphan sweep (DEVELOPERS.md, "Files and backups"; lib/server/storage/sweep-orphan-objects.ts,
 * scripts/storage-sweep.ts) against the run's database and fake S3 store:
 * - an upload whose store write went through but whose answer was lost (the fake's "lose-answer"
 *   fault) saves no row and leaves an orphan; the sweep keeps it while it is younger than the grace
 *   period, a dry run only names it, and a sweep whose clock is a day later deletes it; no object any
 *   row refers to is deleted, even with a grace period of 0; the same upload again puts it back;
 * - a write of the same bytes that commits while the sweep waits on the key's claim (after the sweep
 *   listed the bucket and read the references) keeps its object;
 * - the command: what it kept and deleted, --dry-run, --grace-hours, a bad option, and the database
 *   lock that keeps two sweeps apart.
 * "Old" is made by the sweep's clock (`now`) or a grace period of 0, never by waiting.
 */
import { spawn, spawnSync } from "node:child_process";
import { createHash, randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { claimObjectKey } from "@/lib/server/storage/claim-object-key";
import { contentKey } from "@/lib/server/storage/object-key";
import { referencedObjectsSql } from "@/lib/server/storage/object-references";
import { sweepOrphanObjects, type SweepReport } from "@/lib/server/storage/sweep-orphan-objects";
import { closeDb, db, withDatabaseLock } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeDevice, makeOrganization, type Who } from "./helpers/factories";
import { runStore, setFakeS3Faults } from "./helpers/object-store";
import { fixtureUpload, fixturesDir } from "./helpers/uploads";

vi.mock("server-only", () => ({}));

const root = path.resolve(__dirname, "../..");
const DAY_MS = 86_400_000;
const later = (ms: number) => () => new Date(Date.now() + ms);

let org: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;

beforeAll(async () => {
  org = await makeOrganization();
  clients = await clientsByRole(org);
});
afterEach(() => setFakeS3Faults({}));
afterAll(() => closeDb());

/** A bench file with a comment line of its own: new bytes, a new key. */
function uniqueBench(): { bytes: Buffer; sha256: string; key: string } {
  const original = readFileSync(path.join(fixturesDir, "examples/drive-sweep-doubler.csv"), "utf8");
  const bytes = Buffer.from(`# note: sweep test ${randomBytes(6).toString("hex")}\n${original}`);
  const sha256 = createHash("sha256").update(bytes).digest("hex");
  return { bytes, sha256, key: contentKey(sha256) };
}

const upload = async (deviceId: number, bytes: Buffer) =>
  clients.get("engineer")!.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/drive-sweep-doubler.csv", {}, new Uint8Array(bytes)) });

async function inStore(key: string): Promise<boolean> {
  for await (const o of runStore().list(key)) if (o.key === key) return true;
  return false;
}

const sweep = (opts: { graceMs: number; now?: () => Date; dryRun?: boolean }) => sweepOrphanObjects({ store: runStore(), sequelize: db().sequelize, ...opts });
const outcomeOf = (report: SweepReport, key: string) => report.objects.find((o) => o.key === key)?.outcome;

async function referencedKeys(): Promise<string[]> {
  return (await db().sequelize.query<{ k: string }>(referencedObjectsSql, { type: QueryTypes.SELECT })).map((r) => r.k);
}

describe("the orphan sweep", () => {
  it("deletes an orphan left by an upload whose answer was lost once it is older than the grace period, and never a referenced object", async () => {
    const deviceId = (await makeDevice(org.organization.id)).id;
    const kept = uniqueBench();
    expect((await upload(deviceId, kept.bytes)).status).toBe(201);

    const orphan = uniqueBench();
    await setFakeS3Faults({ writes: "lose-answer" });
    const refused = await upload(deviceId, orphan.bytes);
    expect(refused.status).toBe(503);
    await setFakeS3Faults({});
    const [{ n }] = await db().sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM stored_files WHERE storage_key = ?", { type: QueryTypes.SELECT, replacements: [orphan.key] });
    expect(Number(n)).toBe(0);
    expect((await runStore().get(orphan.key)).equals(orphan.bytes)).toBe(true);

    const young = await sweep({ graceMs: DAY_MS });
    expect(outcomeOf(young, orphan.key)).toBe("young");
    expect(outcomeOf(young, kept.key)).toBe("referenced");
    expect(await inStore(orphan.key)).toBe(true);

    const dry = await sweep({ graceMs: DAY_MS, now: later(DAY_MS + 3_600_000), dryRun: true });
    expect(outcomeOf(dry, orphan.key)).toBe("would-delete");
    expect(await inStore(orphan.key)).toBe(true);

    const referenced = await referencedKeys();
    const swept = await sweep({ graceMs: DAY_MS, now: later(DAY_MS + 3_600_000) });
    expect(outcomeOf(swept, orphan.key)).toBe("deleted");
    expect(swept.counts.failed).toBe(0);
    expect(await inStore(orphan.key)).toBe(false);
    // Even a grace period of 0 leaves every object a row refers to (the demo's files and PDFs among them).
    const none = await sweep({ graceMs: 0 });
    expect(none.counts.deleted).toBe(0);
    const listed = new Set<string>();
    for await (const o of runStore().list("sha256/")) listed.add(o.key);
    expect(referenced.length).toBeGreaterThan(10);
    expect(referenced.filter((k) => !listed.has(k))).toEqual([]);
    expect((await runStore().get(kept.key)).equals(kept.bytes)).toBe(true);

    // The same file uploaded again is stored again, under the same key.
    expect((await upload(deviceId, orphan.bytes)).status).toBe(201);
    expect((await runStore().get(orphan.key)).equals(orphan.bytes)).toBe(true);
  });

  it("keeps an orphan whose bytes a writer is storing again and commits while the sweep waits on the key's claim", async () => {
    const orphan = uniqueBench();
    await runStore().put({ key: orphan.key, bytes: orphan.bytes, sha256: orphan.sha256, contentType: "text/csv" });
    const { sequelize, StoredFile } = db();
    const writer = await sequelize.transaction();
    let sweeping: Promise<SweepReport> | null = null;
    try {
      // What putObject does inside an upload's transaction: claim the key, then put the bytes.
      await claimObjectKey(sequelize, orphan.key, writer);
      await runStore().put({ key: orphan.key, bytes: orphan.bytes, sha256: orphan.sha256, contentType: "text/csv" });
      sweeping = sweep({ graceMs: 0, now: later(2 * DAY_MS) });
      // The sweep has listed the bucket and read the references (no row yet) once it waits for the claim.
      for (;;) {
        const waiting = await sequelize.query<{ n: number }>(
          // The app's user sees its own connections; the writer's claim has returned, so a running one is the sweep's.
          "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE ID <> CONNECTION_ID() AND INFO LIKE 'INSERT INTO stored_object_claims%'",
          { type: QueryTypes.SELECT },
        );
        if (Number(waiting[0].n) > 0) break;
        await new Promise((resolve) => setTimeout(resolve, 20));
      }
      await StoredFile.create(
        { organizationId: org.organization.id, sha256: orphan.sha256, sizeBytes: orphan.bytes.length, storageKey: orphan.key, originalName: "sweep-race.csv", contentType: "text/csv" },
        { transaction: writer },
      );
      await writer.commit();
    } catch (error) {
      await writer.rollback();
      throw error;
    }
    const report = await sweeping!;
    expect(outcomeOf(report, orphan.key)).toBe("referenced-since-listing");
    expect((await runStore().get(orphan.key)).equals(orphan.bytes)).toBe(true);
  });
});

describe("npm run storage:sweep", () => {
  const command = (args: string[]) =>
    spawnSync(process.execPath, [path.join(root, "node_modules/tsx/dist/cli.mjs"), path.join(root, "scripts/storage-sweep.ts"), ...args], { cwd: root, env: process.env, encoding: "utf8", timeout: 120_000 });

  it("prints what it kept and deleted; --dry-run deletes nothing; --grace-hours sets the period", async () => {
    const orphan = uniqueBench();
    await runStore().put({ key: orphan.key, bytes: orphan.bytes, sha256: orphan.sha256, contentType: "text/csv" });

    const young = command([]);
    expect(young.status, young.stderr).toBe(0);
    expect(young.stdout).toContain(`kept (younger than the grace period): ${orphan.key}`);
    expect(young.stdout).toMatch(/grace 24 h: \d+ objects; kept \d+ referenced, [1-9]\d* younger than 24 h/);

    const dry = command(["--dry-run", "--grace-hours", "0"]);
    expect(dry.status, dry.stderr).toBe(0);
    expect(dry.stdout).toContain(`would delete: ${orphan.key}`);
    expect(dry.stdout).toContain("dry run: nothing deleted");
    expect(await inStore(orphan.key)).toBe(true);

    const swept = command(["--grace-hours", "0"]);
    expect(swept.status, swept.stderr).toBe(0);
    expect(swept.stdout).toContain(`deleted: ${orphan.key}`);
    expect(swept.stdout).toMatch(/; deleted [1-9]\d* \(/);
    expect(await inStore(orphan.key)).toBe(false);

    const bad = command(["--grace-hours", "soon"]);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toContain('--grace-hours: "soon" is not a number of hours');
  });

  it("does not run while another sweep holds the database lock", async () => {
    const orphan = uniqueBench();
    await runStore().put({ key: orphan.key, bytes: orphan.bytes, sha256: orphan.sha256, contentType: "text/csv" });
    const result = await withDatabaseLock(db().sequelize, "benchfold-storage-sweep", 5, () =>
      new Promise<{ status: number | null; stderr: string }>((resolve) => {
        const child = spawn(process.execPath, [path.join(root, "node_modules/tsx/dist/cli.mjs"), path.join(root, "scripts/storage-sweep.ts"), "--grace-hours", "0"], { cwd: root, env: process.env });
        let stderr = "";
        child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
        child.on("close", (status) => resolve({ status, stderr }));
      }),
    );
    expect(result.status).toBe(1);
    expect(result.stderr).toMatch(/another instance held the database lock ".*benchfold-storage-sweep"/);
    expect(await inStore(orphan.key)).toBe(true);
  });
});
