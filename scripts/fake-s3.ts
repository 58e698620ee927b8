/**
 * The local S3-compatible store for development and tests: s3rver (an npm package that speaks the
 * S3 REST API and keeps objects in a folder) on 127.0.0.1:$BENCHFOLD_FAKE_S3_PORT, with its objects
 * in $BENCHFOLD_FAKE_S3_DIR and the bucket $S3_BUCKET created at start. The app reaches it through
 * the same S3 driver (AWS SDK v3) it uses for a real bucket: there is no other code path.
 *
 * Beside the S3 API, paths under /_fake/ (never a bucket: bucket names begin with a letter or a
 * digit) answer only to this machine:
 *   GET /_fake/health                  {"ok":true}
 *   PUT /_fake/faults {"writes":"fail"} every write (PUT, POST, DELETE) answers 503 SlowDown
 *   PUT /_fake/faults {"writes":"lose-answer"} every write is carried out, but answers 503 SlowDown, as if
 *                                      the store's answer was lost on the way back: the caller thinks
 *                                      nothing was written and an unreferenced object is left behind
 *   PUT /_fake/faults {"reads":"fail"}  every read (GET, HEAD) answers 503 as well
 *   PUT /_fake/faults {}               back to normal
 * so a test can make the store refuse an upload or a release's PDF, or leave an orphan for the sweep.
 * Never started in production: the scripts start it only when no S3_BUCKET is configured.
 */
import { mkdirSync, rmSync } from "node:fs";
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import S3rver from "s3rver";

const port = Number(process.env.BENCHFOLD_FAKE_S3_PORT ?? 4566);
const directory = process.env.BENCHFOLD_FAKE_S3_DIR ?? `.data/s3-${port}`;
const buckets = (process.env.S3_BUCKET ?? "benchfold-local").split(",").map((b) => b.trim()).filter(Boolean);
if (process.argv.includes("--empty")) rmSync(directory, { recursive: true, force: true });
mkdirSync(directory, { recursive: true });

const s3 = new S3rver({
  directory,
  silent: true,
  // The SDK signs with the credentials it was given; the fake accepts S3RVER/S3RVER only and checks the signature.
  configureBuckets: buckets.map((name) => ({ name, configs: [] })),
});
const handle = s3.callback();
let faults: { writes?: "fail" | "lose-answer"; reads?: "fail" } = {};

function fromThisMachine(req: IncomingMessage): boolean {
  const peer = (req.socket.remoteAddress ?? "").replace(/^::ffff:/, "");
  return peer === "::1" || peer.startsWith("127.");
}

function s3Error(res: ServerResponse, status: number, code: string, message: string) {
  res.writeHead(status, { "content-type": "application/xml", "retry-after": "1" });
  res.end(`<?xml version="1.0" encoding="UTF-8"?><Error><Code>${code}</Code><Message>${message}</Message></Error>`);
}

async function control(req: IncomingMessage, res: ServerResponse) {
  if (!fromThisMachine(req)) return s3Error(res, 404, "NotFound", "Not found");
  const path = (req.url ?? "").split("?")[0];
  if (path === "/_fake/health" && req.method === "GET") {
    res.writeHead(200, { "content-type": "application/json" });
    return res.end(JSON.stringify({ ok: true, buckets, faults }));
  }
  if (path === "/_fake/faults" && req.method === "PUT") {
    let body = "";
    for await (const chunk of req) body += chunk;
    try {
      const next = JSON.parse(body || "{}") as typeof faults;
      faults = {
        ...(next.writes === "fail" || next.writes === "lose-answer" ? { writes: next.writes } : {}),
        ...(next.reads === "fail" ? { reads: "fail" } : {}),
      };
    } catch {
      res.writeHead(400, { "content-type": "application/json" });
      return res.end(JSON.stringify({ error: "body must be JSON like {\"writes\":\"fail\"}" }));
    }
    console.log(`[fake-s3] faults: ${JSON.stringify(faults)}`);
    res.writeHead(200, { "content-type": "application/json" });
    return res.end(JSON.stringify({ faults }));
  }
  s3Error(res, 404, "NotFound", "Not found");
}

/** s3rver carries the request out; whatever it answers is dropped and a 503 SlowDown goes back instead. */
function loseAnswer(res: ServerResponse) {
  const real = { writeHead: res.writeHead, write: res.write, end: res.end };
  res.writeHead = (() => res) as typeof res.writeHead;
  res.write = (() => true) as typeof res.write;
  res.end = (() => {
    Object.assign(res, real);
    for (const name of res.getHeaderNames()) res.removeHeader(name);
    s3Error(res, 503, "SlowDown", "The local fake store wrote the object and lost its answer (a fault set through /_fake/faults).");
    return res;
  }) as typeof res.end;
}

const server = createServer((req, res) => {
  if ((req.url ?? "").startsWith("/_fake/")) {
    control(req, res).catch(() => s3Error(res, 500, "InternalError", "control failed"));
    return;
  }
  const reading = req.method === "GET" || req.method === "HEAD";
  if (!reading && faults.writes === "lose-answer") {
    loseAnswer(res);
    handle(req, res);
    return;
  }
  if ((reading && faults.reads) || (!reading && faults.writes)) {
    // Drain the body first, as a real store would before answering.
    req.resume();
    req.on("end", () => s3Error(res, 503, "SlowDown", "The local fake store refuses this request (a fault set through /_fake/faults)."));
    return;
  }
  handle(req, res);
});

s3.configureBuckets()
  .then(() => {
    server.listen(port, "127.0.0.1", () => console.log(`[fake-s3] S3 on http://127.0.0.1:${port}, buckets ${buckets.join(", ")}, objects in ${directory}`));
  })
  .catch((error: unknown) => {
    console.error("[fake-s3] could not create the buckets:", error);
    process.exit(1);
  });

for (const signal of ["SIGTERM", "SIGINT"] as const) process.on(signal, () => server.close(() => process.exit(0)));
