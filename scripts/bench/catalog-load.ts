/**
 * Catalog search under load (part of `npm run bench`): a synthetic catalog of 1,000 released
 * devices (scripts/bench/synthetic-catalog.ts) in a database of its own, `benchfold_bench_test`
 * (dropped and made again each run, then migrated), served by the app's own build (`.next`, from
 * `npm start` or `npm test`) through scripts/server.mjs on a port of its own; then 50 concurrent
 * clients for 30 s on each of:
 *
 *   - GET /api/health/live, constant JSON: the reference, what any route handler costs here;
 *   - GET /api/v1/sheets with one typical parametric query, repeated (class, a frequency the
 *     part must cover, two limits with units, sorted by a limit): what a popular search costs;
 *   - GET /api/v1/sheets with 400 distinct queries taken in turn (more than the search keeps in
 *     memory, so each one runs its SQL): the cost of the search itself.
 *
 * Printed: requests, req/s, p50, p95, errors, and each search's throughput ÷ the reference's, with
 * the aims (p95 under 50 ms, at least half the reference's throughput, no errors).
 *
 * Then one instance against two: a second server from the same build on the same database, and the
 * distinct searches sent through scripts/bench/round-robin-proxy.ts once with only the first
 * instance behind it and once with both (the same proxy both times, so its own cost is in both
 * figures): the two throughputs and their ratio (aim ≥ 1.6 with cores enough: the machine's count
 * is printed, and two Node processes plus MariaDB cannot scale on two cores).
 * Nothing is asserted. Skipped with a note when MariaDB is not running or there is no build.
 *
 *   BENCH_CATALOG_DEVICES (1000), BENCH_CATALOG_CLIENTS (50), BENCH_CATALOG_SECONDS (30),
 *   BENCH_CATALOG_PORT (3190; the second instance and the proxy take the next two),
 *   BENCH_CATALOG_DB (benchfold_bench_test)
 */
import { spawn, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, openSync } from "node:fs";
import { availableParallelism } from "node:os";
import path from "node:path";
import { createSequelize, readDatabaseSettings } from "../../models/connection";
import { hammer, loadHeader, loadRow, type LoadResult } from "./http-load";
import { distinctSearches, typicalSearch } from "./catalog-queries";
import { seedSyntheticCatalog } from "./synthetic-catalog";
import { startRoundRobinProxy } from "./round-robin-proxy";

const root = path.resolve(__dirname, "../..");
const devices = Number(process.env.BENCH_CATALOG_DEVICES ?? 1000);
const clients = Number(process.env.BENCH_CATALOG_CLIENTS ?? 50);
const seconds = Number(process.env.BENCH_CATALOG_SECONDS ?? 30);
const port = Number(process.env.BENCH_CATALOG_PORT ?? 3190);
const database = process.env.BENCH_CATALOG_DB ?? "benchfold_bench_test";
const baseUrl = `http://localhost:${port}`;
const dataDir = process.env.BENCHFOLD_DATA_DIR ?? path.join(root, ".data");

async function waitFor(url: string, timeoutMs: number): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).ok) return true;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  return false;
}

function run(command: string, args: string[], env: NodeJS.ProcessEnv): void {
  const result = spawnSync(command, args, { cwd: root, env, stdio: ["ignore", "ignore", "inherit"] });
  if (result.status !== 0) throw new Error(`${command} ${args.join(" ")} failed (${result.status})`);
}

async function main() {
  if (!existsSync(path.join(root, ".next/BUILD_ID"))) {
    console.log("catalog load benchmark skipped: no build in .next (run npm start or npm test once)");
    return;
  }
  if (spawnSync("bash", ["scripts/db.sh", "status"], { cwd: root, stdio: "ignore" }).status !== 0) {
    console.log("catalog load benchmark skipped: MariaDB is not running (npm run db:start)");
    return;
  }
  const env = { ...process.env, DB_NAME: database };
  const seeding = performance.now();
  run("bash", ["scripts/db.sh", "reset", database], env);
  run(process.execPath, ["node_modules/tsx/dist/cli.mjs", "scripts/migrate.ts"], env);
  const sequelize = createSequelize({ ...readDatabaseSettings(), database });
  const catalog = await seedSyntheticCatalog(sequelize, { devices });
  await sequelize.close();
  const seededS = (performance.now() - seeding) / 1000;

  mkdirSync(path.join(dataDir, "logs"), { recursive: true });
  // Both instances share one secret, as instances behind one load balancer do.
  const secret = randomBytes(32).toString("base64url");
  const startServer = (serverPort: number, logName: string) =>
    spawn(process.execPath, ["scripts/server.mjs"], {
      cwd: root,
      env: { ...env, PORT: String(serverPort), NEXTAUTH_URL: baseUrl, NEXTAUTH_SECRET: secret, BENCHFOLD_FAKE_SMTP: "", SMTP_HOST: "127.0.0.1" },
      stdio: ["ignore", openSync(path.join(dataDir, "logs", logName), "w"), openSync(path.join(dataDir, "logs", logName), "a")],
    });
  const server = startServer(port, "bench-catalog-server.log");
  const servers = [server];
  try {
    if (!(await waitFor(`${baseUrl}/api/health/live`, 60_000))) throw new Error(`the app did not answer on ${baseUrl} (see .data/logs/bench-catalog-server.log)`);
    const searches = distinctSearches();
    // Every search must be one the API accepts: a refused query would measure the parser, not the search.
    const typical = await fetch(`${baseUrl}/api/v1/sheets?${typicalSearch}`);
    const typicalBody = (await typical.json()) as { total?: number };
    if (typical.status !== 200) throw new Error(`the typical search answered ${typical.status}: ${JSON.stringify(typicalBody)}`);
    for (const qs of searches.slice(0, 40)) {
      const r = await fetch(`${baseUrl}/api/v1/sheets?${qs}`);
      if (r.status !== 200) throw new Error(`GET /api/v1/sheets?${qs} answered ${r.status}: ${await r.text()}`);
    }
    // Warm-up: compiled routes, the connection pool, MariaDB's buffer pool.
    await hammer(`${baseUrl}/api/health/live`, { clients, seconds: 3 });
    await hammer((n) => `${baseUrl}/api/v1/sheets?${searches[n % searches.length]}`, { clients, seconds: 5 });

    console.log(
      `\nCatalog search: ${catalog.devices} synthetic devices (${catalog.revisions} revisions, ${catalog.current} current, ${catalog.specRows} spec rows; ` +
        `seeded and migrated in ${seededS.toFixed(1)} s), ${clients} concurrent clients, ${seconds} s per target, node ${process.version}`,
    );
    console.log(`typical search: ?${decodeURIComponent(typicalSearch)} → ${typicalBody.total} hits`);
    const results: [string, LoadResult][] = [];
    results.push(["constant JSON /api/health/live", await hammer(`${baseUrl}/api/health/live`, { clients, seconds })]);
    results.push(["search, one typical query", await hammer(`${baseUrl}/api/v1/sheets?${typicalSearch}`, { clients, seconds })]);
    results.push([`search, ${searches.length} queries in turn`, await hammer((n) => `${baseUrl}/api/v1/sheets?${searches[n % searches.length]}`, { clients, seconds })]);
    console.log(loadHeader());
    for (const [name, result] of results) console.log(loadRow(name, result));
    const reference = results[0][1];
    for (const [name, result] of results.slice(1)) {
      console.log(
        `${name}: throughput ÷ constant JSON ${(result.perSecond / reference.perSecond).toFixed(2)} (aim ≥ 0.5), ` +
          `p95 ${result.p95.toFixed(1)} ms (aim < 50 ms), errors ${[...result.failures.values()].reduce((a, b) => a + b, 0)} (aim 0)`,
      );
    }

    // One instance against two behind a round-robin proxy, same searches, same clients.
    const secondPort = port + 1;
    servers.push(startServer(secondPort, "bench-catalog-server-2.log"));
    if (!(await waitFor(`http://localhost:${secondPort}/api/health/live`, 60_000))) throw new Error(`the second instance did not answer on port ${secondPort} (see .data/logs/bench-catalog-server-2.log)`);
    await hammer((n) => `http://localhost:${secondPort}/api/v1/sheets?${searches[n % searches.length]}`, { clients, seconds: 5 });
    const scaled: [string, LoadResult][] = [];
    for (const upstreams of [[port], [port, secondPort]]) {
      const proxy = await startRoundRobinProxy(port + 2, upstreams);
      try {
        const url = (n: number) => `http://localhost:${port + 2}/api/v1/sheets?${searches[n % searches.length]}`;
        await hammer(url, { clients, seconds: 2 });
        scaled.push([`search via proxy, ${upstreams.length} instance${upstreams.length > 1 ? "s" : ""}`, await hammer(url, { clients, seconds })]);
      } finally {
        await proxy.close();
      }
    }
    console.log(`\nOne instance against two on one database, ${clients} concurrent clients, ${searches.length} searches in turn, through a round-robin proxy (scripts/bench/round-robin-proxy.ts)`);
    console.log(loadHeader());
    for (const [name, result] of scaled) console.log(loadRow(name, result));
    const cores = availableParallelism();
    console.log(
      `two instances ÷ one: ${(scaled[1][1].perSecond / scaled[0][1].perSecond).toFixed(2)} (aim ≥ 1.6 given cores enough; this machine has ${cores} core${cores === 1 ? "" : "s"}` +
        `${cores < 4 ? ", too few: two app processes, the proxy, the clients and MariaDB share them" : ""})`,
    );
  } finally {
    for (const child of servers) {
      if (child.exitCode !== null) continue;
      child.kill("SIGTERM");
      await new Promise((resolve) => child.once("exit", resolve));
    }
  }
}

main().catch((error) => {
  console.error(`catalog load benchmark failed: ${(error as Error).message}`);
  process.exit(1);
});
