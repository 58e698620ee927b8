/**
 * Downloads of a released PDF under load (part of the load benchmark): the demo doubler's current
 * revision, by its lettered public address (what a customer's link names), at `clients`
 * concurrent clients for a fixed time; beside it, as the reference measured in the same run, a
 * plain `node:http` server in a worker thread of this process sending the same bytes from memory,
 * under the same client loop. Prints req/s, p50 and p95 of both and the ratio of throughputs, and
 * the same for the app's cheapest route (next-auth's CSRF token): what any route handler costs
 * here before its own work, so a ratio below the aim shows how much of it the download itself takes.
 */
import { createHash } from "node:crypto";
import { Worker } from "node:worker_threads";
import { datasheetPdfPath } from "../../lib/domain/reviews";
import { hammer, loadHeader, loadRow } from "./http-load";

/** The whole of the plain server: one buffer, one header set, nothing else. */
const plainServerSource = `
const { parentPort, workerData } = require("node:worker_threads");
const http = require("node:http");
const bytes = Buffer.from(workerData.bytes);
const headers = { "content-type": "application/pdf", "content-length": String(bytes.length), etag: workerData.etag };
const server = http.createServer((request, response) => { response.writeHead(200, headers); response.end(bytes); });
server.keepAliveTimeout = 5000;
server.listen(0, "127.0.0.1", () => parentPort.postMessage(server.address().port));
parentPort.on("message", () => server.close(() => process.exit(0)));
`;

async function startPlainServer(bytes: Buffer, etag: string): Promise<{ url: string; stop: () => Promise<void> }> {
  const worker = new Worker(plainServerSource, { eval: true, workerData: { bytes, etag } });
  const port = await new Promise<number>((resolve, reject) => {
    worker.once("message", resolve);
    worker.once("error", reject);
  });
  return {
    url: `http://127.0.0.1:${port}/sheet.pdf`,
    stop: async () => {
      worker.postMessage("stop");
      await new Promise((resolve) => worker.once("exit", resolve));
    },
  };
}

export async function benchReleasedDownload(opts: { baseUrl: string; clients: number; seconds: number; org: string; part: string }): Promise<void> {
  const current = await fetch(`${opts.baseUrl}${datasheetPdfPath(opts.org, opts.part, "current")}`);
  const bytes = Buffer.from(await current.arrayBuffer());
  const letter = current.headers.get("x-benchfold-revision");
  if (current.status !== 200 || !letter) {
    console.log(`released PDF download skipped: ${opts.part} of ${opts.org} has no released revision (${current.status}); load the demo with npm start`);
    return;
  }
  const etag = current.headers.get("etag") ?? "";
  if (etag !== `"${createHash("sha256").update(bytes).digest("hex")}"`) throw new Error(`the released PDF's bytes do not match its ETag ${etag}`);
  const url = `${opts.baseUrl}${datasheetPdfPath(opts.org, opts.part, letter)}`;
  const plain = await startPlainServer(bytes, etag);
  try {
    const released = await hammer(url, opts);
    const reference = await hammer(plain.url, opts);
    // What any route of the app costs before it does any work of its own: next-auth's CSRF token.
    const floor = await hammer(`${opts.baseUrl}/api/auth/csrf`, opts);
    console.log(`\nReleased PDF download: GET ${url.slice(opts.baseUrl.length)} (${(bytes.length / 1024).toFixed(0)} kB), ${opts.clients} concurrent clients, ${opts.seconds} s each`);
    console.log(loadHeader());
    console.log(loadRow(`Benchfold, revision ${letter} PDF`, released));
    console.log(loadRow("plain node:http, same bytes", reference));
    console.log(loadRow("app floor: /api/auth/csrf", floor));
    console.log(
      `throughput Benchfold ÷ plain server: ${(released.perSecond / reference.perSecond).toFixed(2)} (aim ≥ 0.5); ` +
        `p50 ${(released.p50 / reference.p50).toFixed(1)}×, p95 ${(released.p95 / reference.p95).toFixed(1)}× the plain server's; ` +
        `the app's floor ÷ plain server: ${(floor.perSecond / reference.perSecond).toFixed(2)}`,
    );
  } finally {
    await plain.stop();
  }
}
