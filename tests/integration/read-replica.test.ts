/**
 * Public reads from a MariaDB read replica (lib/server/db/public-reads.ts), in this process: the
 * test starts a GTID replica of the run's test database (scripts/replica.sh, on REPLICA_DB_PORT,
 * default DB_PORT + 10), points DB_REPLICA_HOSTS at it, and shows that public reads come from it
 * (its @@server_id is 2, the primary's 1), that what the primary writes reaches it, that no write
 * is ever sent to it (its general log, as a table), and that a replica whose replication is stopped
 * (lagging without bound) or that is down is passed over: the reads go to the primary and succeed.
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
import { makeOrganization } from "./helpers/factories";

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

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const SERVER = "SELECT @@server_id AS server";

/** Where a public read of the organization `slug` went, and whether that server has it. */
async function readOrganization(slug: string): Promise<{ server: number; found: number }> {
  const [row] = await publicSelect<{ server: number; found: number }>(`${SERVER}, (SELECT COUNT(*) FROM organizations WHERE slug = ?) AS found`, [slug]);
  return { server: Number(row.server), found: Number(row.found) };
}

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
  });
});
