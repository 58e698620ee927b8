/**
 * Public reads from a MariaDB read replica (lib/server/db/public-reads.ts), in this process: the
 * test starts a GTID replica of the run's test database (scripts/replica.sh, on REPLICA_DB_PORT,
 * default DB_PORT + 10), points DB_REPLICA_HOSTS at it, and shows that public reads come from it
 * (its @@server_id is 2, the primary's 1), that what the primary writes reaches it, that no write
 * is ever sent to it (its general log, as a table), and that a replica whose replication is stopped
 * (lagging without bound) or that is down is passed over: the reads go to the primary and succeed.
 * The public sheet's lookup (findReleasedRevision: the sheet page, its JSON, compare) and the
 * verification of a printout run on it too, answer what the primary answers, and a revision the
 * replica does not have yet (released while it is held back by MASTER_DELAY) is still found, on the
 * primary.
 * The replica is stopped at the end; nothing else in the run uses it.
 */
import { execFile } from "node:child_process";
import path from "node:path";
import { promisify } from "node:util";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeDb, db } from "@/models";
import { readDatabaseSettings } from "@/models/connection";
import { parseCatalogQuery } from "@/lib/catalog/catalog-query";
import { assertLoopbackDatabase } from "./helpers/loopback";
import { clientsByRole, makeOrganization } from "./helpers/factories";
import { deviceWithApprovedData, releaseSheet } from "./helpers/reviews";

vi.mock("server-only", () => ({}));

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");
const replicaPort = Number(process.env.REPLICA_DB_PORT ?? Number(process.env.DB_PORT ?? 3407) + 10);
const replicaScript = (...args: string[]) =>
  run("bash", [path.join(ROOT, "scripts/replica.sh"), ...args], { cwd: ROOT, env: { ...process.env, REPLICA_DB_PORT: String(replicaPort) } });
const onReplica = async (sql: string) => (await replicaScript("sql", sql)).stdout;

process.env.DB_REPLICA_HOSTS = `127.0.0.1:${replicaPort}`;
process.env.DB_REPLICA_CHECK_MS = "100";
const { publicSelect, closePublicReads } = await import("@/lib/server/db/public-reads");
const { searchCatalog } = await import("@/lib/server/catalog/search-catalog");
const { findReleasedRevision, revisionSummaries } = await import("@/lib/server/reviews/list-revisions");
const { verifyPrintout } = await import("@/lib/server/reviews/verify-printout");

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const SERVER = "SELECT @@server_id AS server";

/** Where a public read of the organization `slug` went, and whether that server has it. */
async function readOrganization(slug: string): Promise<{ server: number; found: number }> {
  const [row] = await publicSelect<{ server: number; found: number }>(`${SERVER}, (SELECT COUNT(*) FROM organizations WHERE slug = ?) AS found`, [slug]);
  return { server: Number(row.server), found: Number(row.found) };
}

/** How many statements of the app's user the replica's general log holds that contain `fragment` (LIKE, so % and _ are wildcards). */
async function replicaLogCount(fragment: string): Promise<number> {
  const out = await onReplica(`SELECT COUNT(*) FROM mysql.general_log WHERE user_host LIKE 'benchfold[%' AND argument LIKE '%${fragment.replace(/'/g, "''")}%'`);
  return Number(out.trim().split("\n").pop());
}

// The demo's doubler, released as A and B before the integration tests run (scripts/seed-demo-releases.ts).
const demoSheet = { organizationSlug: "kestrine", partNumber: "KDX-2G4" };

async function until<T>(read: () => Promise<T>, ok: (value: T) => boolean, ms = 10_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const value = await read();
    if (ok(value) || Date.now() > end) return value;
    await sleep(50);
  }
}

beforeAll(async () => {
  assertLoopbackDatabase();
  const started = performance.now();
  await replicaScript("start", readDatabaseSettings().database);
  console.log(`replica started and caught up in ${Math.round(performance.now() - started)} ms`);
  await onReplica("SET GLOBAL log_output = 'TABLE'; TRUNCATE mysql.general_log; SET GLOBAL general_log = 1");
});

afterAll(async () => {
  await closePublicReads();
  await closeDb();
  await replicaScript("stop");
});

describe("public reads with a read replica", () => {
  it("come from the replica, which receives what the primary writes", async () => {
    const [primary] = await db().sequelize.query<{ server: number }>(SERVER, { type: QueryTypes.SELECT });
    expect(Number(primary.server)).toBe(1);
    const { organization } = await makeOrganization();
    expect(await until(() => readOrganization(organization.slug), (r) => r.found === 1)).toEqual({ server: 2, found: 1 });

    const query = parseCatalogQuery({ q: "" });
    if (!query.ok) throw new Error("the empty catalog query was refused");
    const fromReplica = await searchCatalog(query.query);
    const [{ n }] = await db().sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM released_sheets", { type: QueryTypes.SELECT });
    expect(fromReplica.total).toBeLessThanOrEqual(Number(n));
    const searches = await onReplica("SELECT COUNT(*) FROM mysql.general_log WHERE user_host LIKE 'benchfold[%' AND argument LIKE '%FROM released_sheets s JOIN organizations%'");
    expect(Number(searches.trim().split("\n").pop())).toBeGreaterThan(0);
  });

  it("serve the public sheet's lookup (page, JSON, compare) and the verification of a printout, with what the primary has", async () => {
    const before = await replicaLogCount("o.slug = 'kestrine' AND d.part_number = 'KDX-2G4'");
    const sheet = await findReleasedRevision({ ...demoSheet, revision: "A" });
    expect(await replicaLogCount("o.slug = 'kestrine' AND d.part_number = 'KDX-2G4'")).toBeGreaterThan(before);
    expect(await replicaLogCount(`SELECT model_json FROM sheet_revisions WHERE id = ${sheet.summary.id}`)).toBeGreaterThan(0);
    // The same summaries as the workspace's read of the primary, and the frozen model of that revision.
    expect(sheet.history).toEqual(await revisionSummaries({ deviceId: sheet.summary.deviceId }));
    expect(sheet.summary).toMatchObject({ letter: "A", standing: "superseded" });
    const [frozen] = await db().sequelize.query<{ model_json: string }>("SELECT model_json FROM sheet_revisions WHERE id = ?", { type: QueryTypes.SELECT, replacements: [sheet.summary.id] });
    expect(sheet.model).toEqual(JSON.parse(frozen.model_json));
    expect((await findReleasedRevision({ ...demoSheet, revision: "current" })).summary).toMatchObject({ letter: "B", standing: "current" });
    await expect(findReleasedRevision({ ...demoSheet, revision: "Z" })).rejects.toMatchObject({ code: "not-found" });

    const verified = await verifyPrintout({ sha256: sheet.summary.pdfSha256 });
    expect(verified).toMatchObject({ partNumber: "KDX-2G4", letter: "A", standing: "superseded", supersededBy: { letter: "B" } });
    expect(await replicaLogCount(`r.pdf_sha256 = '${sheet.summary.pdfSha256}'`)).toBeGreaterThan(0);
  });

  it("find a revision released while the replica is held back, on the primary", { timeout: 240_000 }, async () => {
    const made = await makeOrganization();
    const clients = await clientsByRole(made);
    const deviceId = await deviceWithApprovedData(made.organization.id, clients.get("engineer")!, clients.get("reviewer")!);
    // Held back an hour and counted as fresh (its lag stays under the limit), so the replica is asked and lacks the revision.
    process.env.DB_REPLICA_MAX_LAG_SECONDS = "7200";
    await onReplica("STOP SLAVE; CHANGE MASTER TO MASTER_DELAY = 3600; START SLAVE");
    try {
      const revision = await releaseSheet(clients.get("engineer")!, clients.get("reviewer")!, deviceId);
      const partNumber = decodeURIComponent(revision.publicPath.split("/")[3]);
      await sleep(200); // past DB_REPLICA_CHECK_MS: the next read probes the replica again
      const address = { organizationSlug: made.organization.slug, partNumber, revision: revision.letter };
      const found = await findReleasedRevision(address);
      expect(found.summary).toEqual(revision);
      // It was asked of the replica first, which has the organization (made before the hold) but not the revision.
      expect(await replicaLogCount(`o.slug = '${made.organization.slug}'`)).toBeGreaterThan(0);
      const onReplicaCount = async (sql: string) => Number((await onReplica(sql)).trim().split("\n").pop());
      const database = readDatabaseSettings().database;
      expect(await onReplicaCount(`SELECT COUNT(*) FROM \`${database}\`.organizations WHERE slug = '${made.organization.slug}'`)).toBe(1);
      expect(await onReplicaCount(`SELECT COUNT(*) FROM \`${database}\`.sheet_revisions WHERE id = ${revision.id}`)).toBe(0);
      expect((await verifyPrintout({ reference: revision.reference })).letter).toBe(revision.letter);
    } finally {
      await onReplica("STOP SLAVE; CHANGE MASTER TO MASTER_DELAY = 0; START SLAVE");
      delete process.env.DB_REPLICA_MAX_LAG_SECONDS;
    }
    const { organization } = await makeOrganization();
    expect(await until(() => readOrganization(organization.slug), (r) => r.server === 2 && r.found === 1, 30_000)).toEqual({ server: 2, found: 1 });
  });

  it("never send it a write: publicSelect refuses one, and its log shows none from the app's user", async () => {
    await expect(publicSelect("DELETE FROM organizations WHERE id = 0")).rejects.toThrow(/SELECT statements only/);
    await expect(publicSelect("  update organizations SET name = name")).rejects.toThrow(/SELECT statements only/);
    await makeOrganization(); // writes on the primary meanwhile
    const writes = await onReplica(
      "SELECT COUNT(*) FROM mysql.general_log WHERE user_host LIKE 'benchfold[%' AND command_type = 'Query' " +
        "AND argument REGEXP '^[[:space:](]*(INSERT|UPDATE|DELETE|REPLACE|CREATE|ALTER|DROP|TRUNCATE|LOCK|START|BEGIN|SET[[:space:]]+(GLOBAL|SESSION[[:space:]]+TRANSACTION))'",
    );
    expect(Number(writes.trim().split("\n").pop())).toBe(0);
    const reads = await onReplica("SELECT COUNT(*) FROM mysql.general_log WHERE user_host LIKE 'benchfold[%' AND argument LIKE 'SELECT @@server_id%'");
    expect(Number(reads.trim().split("\n").pop())).toBeGreaterThan(0);
  });

  it("go to the primary while the replica's replication is stopped (lag without bound), and back when it catches up", async () => {
    await onReplica("STOP SLAVE SQL_THREAD");
    try {
      await sleep(200); // past DB_REPLICA_CHECK_MS: the next read probes again
      const { organization } = await makeOrganization();
      expect(await readOrganization(organization.slug)).toEqual({ server: 1, found: 1 });
      await onReplica("START SLAVE SQL_THREAD");
      expect(await until(() => readOrganization(organization.slug), (r) => r.server === 2)).toEqual({ server: 2, found: 1 });
    } finally {
      await onReplica("START SLAVE SQL_THREAD");
    }
  });

  it("go to the primary, without an error, when the replica is down", async () => {
    await replicaScript("stop");
    const { organization } = await makeOrganization();
    expect(await readOrganization(organization.slug)).toEqual({ server: 1, found: 1 });
    const query = parseCatalogQuery({ q: "" });
    if (!query.ok) throw new Error("the empty catalog query was refused");
    await expect(searchCatalog(query.query)).resolves.toMatchObject({ page: 1 });
    const sheet = await findReleasedRevision({ ...demoSheet, revision: "B" });
    expect(sheet.summary).toMatchObject({ letter: "B", standing: "current" });
    expect(sheet.history).toEqual(await revisionSummaries({ deviceId: sheet.summary.deviceId }));
  });
});
