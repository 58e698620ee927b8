/**
 * Load benchmark (the last part of `npm run bench`): concurrent clients against a running
 * instance — `npm start` on BENCHFOLD_BENCH_URL (default http://localhost:3000) with the demo
 * loaded. For a workspace page, a JSON list and a sheet PDF already cached: requests per second,
 * p50/p95 latency, errors, and the server's resident memory cold, warm (after one request to
 * each target), right after the run and every 5 s for BENCH_LOAD_SETTLE_MS (30 s) after it. The PDF's reference run in the same process is a fresh render (a changed
 * device description makes a new model; the description is put back afterwards). Then the download
 * of the demo doubler's released PDF against a plain node:http server (released-download.ts). Nothing is asserted:
 * timings live here, never in the tests. Skipped with a note when no server answers.
 *
 *   BENCH_LOAD_CLIENTS (50), BENCH_LOAD_SECONDS (60), BENCH_LOAD_FRESH_RENDERS (4), BENCH_LOAD_SETTLE_MS (30000),
 *   BENCH_LOAD_DOWNLOAD (0 skips the released download)
 */
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { signInOverHttp } from "../sign-in-over-http";
import { hammer, loadHeader, loadRow, type LoadResult } from "./http-load";
import { benchReleasedDownload } from "./released-download";

const baseUrl = process.env.BENCHFOLD_BENCH_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
const clients = Number(process.env.BENCH_LOAD_CLIENTS ?? 50);
const seconds = Number(process.env.BENCH_LOAD_SECONDS ?? 60);
const freshRenders = Number(process.env.BENCH_LOAD_FRESH_RENDERS ?? 4);
const demoEngineer = { email: "elena.marchetti@kestrine.example", password: "bench-demo-2026" };

/** The resident memory of the process listening on the server's port, from /proc (Linux). */
function serverRssMb(): number | null {
  try {
    const port = new URL(baseUrl).port || "80";
    const line = execFileSync("ss", ["-ltnpH", `sport = :${port}`], { encoding: "utf8" });
    const pid = /pid=(\d+)/.exec(line)?.[1];
    if (!pid) return null;
    const rssKb = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, "utf8"))?.[1]);
    return Math.round(rssKb / 1024);
  } catch {
    return null;
  }
}

async function freshPdfSeconds(cookie: string, deviceId: number): Promise<number> {
  const deviceUrl = `${baseUrl}/api/devices/${deviceId}`;
  const { device } = (await (await fetch(deviceUrl, { headers: { cookie } })).json()) as {
    device: { partNumber: string; deviceClass: string; title: string; description: string; keyConditions: unknown };
  };
  const patch = (description: string) =>
    fetch(deviceUrl, {
      method: "PATCH",
      headers: { cookie, origin: baseUrl, "content-type": "application/json" },
      body: JSON.stringify({ partNumber: device.partNumber, deviceClass: device.deviceClass, title: device.title, description, keyConditions: device.keyConditions }),
    });
  const times: number[] = [];
  // Unique per run: a description used before may still have its PDF in the server's cache.
  const runTag = Date.now().toString(36);
  try {
    for (let i = 1; i <= freshRenders; i++) {
      // A new description is a new sheet model, so the next PDF is rendered, not served from the cache.
      if (!(await patch(`${device.description} (load benchmark ${runTag}-${i})`)).ok) throw new Error("could not change the device for a fresh render");
      const started = performance.now();
      const pdf = await fetch(`${baseUrl}/api/devices/${deviceId}/sheet/pdf`, { headers: { cookie } });
      await pdf.arrayBuffer();
      times.push((performance.now() - started) / 1000);
    }
  } finally {
    await patch(device.description);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

async function main() {
  try {
    await fetch(`${baseUrl}/api/auth/csrf`);
  } catch {
    console.log(`load benchmark skipped: nothing answers at ${baseUrl} (start the app with npm start, or set BENCHFOLD_BENCH_URL)`);
    return;
  }
  const cookie = await signInOverHttp(baseUrl, demoEngineer);
  const devices = (await (await fetch(`${baseUrl}/api/devices`, { headers: { cookie } })).json()) as { devices: { id: number; partNumber: string }[] };
  const doubler = devices.devices.find((d) => d.partNumber === "KDX-2G4");
  if (!doubler) throw new Error("the demo device KDX-2G4 is not there: load the demo with npm start");
  const pdfPath = `/api/devices/${doubler.id}/sheet/pdf`;
  const targets = [
    ["workspace page /devices", "/devices"],
    ["JSON list /api/devices", "/api/devices"],
    ["cached sheet PDF", pdfPath],
  ] as const;
  // Cold: the server as it started. Warm: after one request to each target, so the PDF worker
  // thread runs (its own V8 heap, in this process) and each route's code is loaded: what the
  // load adds is measured from there.
  const rssCold = serverRssMb();
  for (const [, path] of targets) await (await fetch(`${baseUrl}${path}`, { headers: { cookie } })).arrayBuffer();
  const rssStart = serverRssMb();

  console.log(`\nLoad: ${clients} concurrent clients, ${seconds} s per target, against ${baseUrl}, node ${process.version}`);
  const rows: string[] = [];
  const results: Record<string, LoadResult> = {};
  for (const [name, path] of targets) {
    const result = await hammer(`${baseUrl}${path}`, { clients, seconds, headers: { cookie } });
    results[name] = result;
    rows.push(loadRow(name, result));
  }
  const rssEnd = serverRssMb();
  // V8 gives heap pages back once the process is idle (its memory reducer runs a few seconds
  // after the load stops, and again later), so the resident size is read for a while after.
  const settleMs = Number(process.env.BENCH_LOAD_SETTLE_MS ?? 30_000);
  const settling: { atS: number; mb: number | null }[] = [];
  for (let waitedMs = 0; waitedMs < settleMs; ) {
    const stepMs = Math.min(5_000, settleMs - waitedMs);
    await new Promise((resolve) => setTimeout(resolve, stepMs));
    waitedMs += stepMs;
    settling.push({ atS: Math.round(waitedMs / 1000), mb: serverRssMb() });
  }
  const rssSettled = settling.at(-1)?.mb ?? rssEnd;
  const freshS = await freshPdfSeconds(cookie, doubler.id);

  console.log(loadHeader());
  for (const row of rows) console.log(row);
  const cached = results["cached sheet PDF"].perSecond;
  console.log(
    `fresh PDF render (median of ${freshRenders}, one at a time): ${(freshS * 1000).toFixed(0)} ms = ${(1 / freshS).toFixed(2)} PDFs/s; ` +
      `cached PDF throughput ÷ fresh: ${(cached * freshS).toFixed(1)}×`,
  );
  const mb = (v: number | null) => (v === null ? "n/a" : `${v} MB`);
  console.log(
    `server RSS: cold ${mb(rssCold)}, warm (one request to each target) ${mb(rssStart)}, right after the load ${mb(rssEnd)}, then ` +
      settling.map((s) => `${s.atS} s ${mb(s.mb)}`).join(", ") +
      (rssStart && rssSettled ? `; settled ÷ warm: ${(rssSettled / rssStart).toFixed(2)}` : "") +
      (rssCold && rssSettled ? `, settled ÷ cold: ${(rssSettled / rssCold).toFixed(2)}` : ""),
  );
  if (process.env.BENCH_LOAD_DOWNLOAD !== "0") await benchReleasedDownload({ baseUrl, clients, seconds, org: "kestrine", part: "KDX-2G4" });
}

main().catch((error) => {
  console.error(`load benchmark failed: ${(error as Error).message}`);
  process.exit(1);
});
