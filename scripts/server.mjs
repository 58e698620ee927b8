// @ts-check
/**
 * Benchfold's HTTP server: Next.js (its documented custom-server API) behind a few lines that
 * tell the app where each request really came from. `npm start`, `npm run dev` and `npm test`
 * run this file instead of `next start` / `next dev`:
 *
 *   node scripts/server.mjs [--dev]        PORT (3000), BENCHFOLD_TRUSTED_PROXIES (none), BENCHFOLD_PROXY_HEADER (x-forwarded-for)
 *
 * Why: a Next.js route handler cannot see the TCP peer (request.ip is gone), and Next only
 * fills X-Forwarded-For when the client did not send one (`??=` in base-server.js), so every
 * header the app could read about the client is the client's own word. Here, before Next sees
 * a request, any client-supplied copy of our internal headers is removed (from `headers` and
 * `rawHeaders`) and they are set from the socket:
 *
 *   x-benchfold-peer            the socket's remote address
 *   x-benchfold-client-address  the peer, or the hop a trusted proxy appended to X-Forwarded-For
 *   x-benchfold-proxied         "1" when the request carries a forwarding header (it came through
 *                               a proxy, even a local one), else "0"
 *
 * From a peer that is not a trusted proxy the forwarding headers themselves are dropped too,
 * so Next fills them from the socket and nothing downstream reads a client's claim.
 * lib/server/auth/request-network.ts is the one reader; it refuses to trust the headers unless
 * this file marked the process (a server started with plain `next start` would pass them on).
 *
 * Plain JavaScript, type-checked by tsc (`// @ts-check`): the long-running server needs no
 * loader (tsx) in front of Next's own module hooks and runs wherever `node` does.
 */
import { createServer } from "node:http";
import { BlockList, isIP } from "node:net";
import { realpathSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";

/** Headers only this server may set; a client's copy is removed. */
export const internalHeaders = Object.freeze(["x-benchfold-peer", "x-benchfold-client-address", "x-benchfold-proxied"]);

/** Headers a proxy adds. Their presence means the request did not come straight from its peer. */
export const forwardingHeaders = Object.freeze([
  "forwarded",
  "x-forwarded-for",
  "x-forwarded-host",
  "x-forwarded-proto",
  "x-forwarded-port",
  "x-real-ip",
  "via",
]);

/** The global the app checks to know these headers were set here (see request-network.ts). */
export const serverMarker = Symbol.for("benchfold.request-network-headers");

/** `::ffff:127.0.0.1` (an IPv4 peer on a dual-stack socket) → `127.0.0.1`; lower case. */
export function normalizeAddress(/** @type {string | undefined} */ address) {
  if (!address) return "";
  const lower = address.trim().toLowerCase();
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/.exec(lower);
  return mapped ? mapped[1] : lower;
}

export function isLoopbackAddress(/** @type {string} */ address) {
  const a = normalizeAddress(address);
  return a === "::1" || (isIP(a) === 4 && a.startsWith("127."));
}

/**
 * BENCHFOLD_TRUSTED_PROXIES: addresses or CIDR ranges, separated by commas or spaces
 * (`127.0.0.1,::1`, `10.0.0.0/8`). Empty: no proxy is trusted. A malformed entry throws.
 * @param {string | undefined} setting
 */
export function parseTrustedProxies(setting) {
  const list = new BlockList();
  /** @type {string[]} */
  const entries = [];
  for (const entry of (setting ?? "").split(/[\s,]+/).filter(Boolean)) {
    const [rawAddress, prefix, extra] = entry.split("/");
    const address = normalizeAddress(rawAddress);
    const family = isIP(address);
    const bits = prefix === undefined ? null : Number(prefix);
    const maxBits = family === 6 ? 128 : 32;
    if (!family || extra !== undefined || (bits !== null && !(Number.isInteger(bits) && bits >= 0 && bits <= maxBits && /^\d+$/.test(prefix)))) {
      throw new Error(`BENCHFOLD_TRUSTED_PROXIES: "${entry}" is not an IP address or CIDR range`);
    }
    const type = family === 6 ? "ipv6" : "ipv4";
    if (bits === null) list.addAddress(address, type);
    else list.addSubnet(address, bits, type);
    entries.push(entry);
  }
  return {
    entries,
    /** @param {string} address */
    has(address) {
      const a = normalizeAddress(address);
      const family = isIP(a);
      return family !== 0 && list.check(a, family === 6 ? "ipv6" : "ipv4");
    },
  };
}

/** `203.0.113.7`, `203.0.113.7:5100`, `[2001:db8::1]:443` or `2001:db8::1` → the bare address; "" if none. */
function addressOfHop(/** @type {string} */ hop) {
  let value = hop.trim().replace(/^"|"$/g, "");
  const bracketed = /^\[([^\]]+)\](?::\d+)?$/.exec(value);
  if (bracketed) value = bracketed[1];
  else if (/^\d+\.\d+\.\d+\.\d+:\d+$/.test(value)) value = value.slice(0, value.lastIndexOf(":"));
  value = normalizeAddress(value);
  return isIP(value) ? value : "";
}

/**
 * The client's address: the socket peer, unless the peer is a trusted proxy; then the right-most
 * hop of the header that proxy writes, the one it appended (the hops left of it are whatever the
 * client sent): `X-Forwarded-For` by default, or the `for=` of the last element of `Forwarded`
 * (RFC 7239 §4, §5.2) when BENCHFOLD_PROXY_HEADER=forwarded. Only the configured header is read,
 * so a client cannot pass its own copy of the other one through the proxy. A trusted proxy that
 * appended nothing usable (e.g. `for=unknown` or an obfuscated `_name`) leaves the peer.
 * @param {{ peer: string, forwardedFor: string | undefined, forwarded?: string | undefined, proxyHeader?: "x-forwarded-for" | "forwarded", trusted: { has(address: string): boolean } }} input
 */
export function resolveClientAddress({ peer, forwardedFor, forwarded, proxyHeader = "x-forwarded-for", trusted }) {
  const address = normalizeAddress(peer);
  if (!trusted.has(address)) return address;
  const last = proxyHeader === "forwarded" ? lastForwardedFor(forwarded) : lastHop(forwardedFor);
  const appended = last ? addressOfHop(last) : "";
  return appended || address;
}

/** @param {string | undefined} header */
function lastHop(header) {
  const hops = (header ?? "").split(",").map((hop) => hop.trim()).filter(Boolean);
  return hops[hops.length - 1] ?? "";
}

/**
 * The `for=` value of the last element of a Forwarded header (RFC 7239 §4: elements separated by
 * commas, pairs by semicolons; a value may be a quoted string), unquoted; "" when it has none.
 * @param {string | undefined} header
 */
export function lastForwardedFor(header) {
  const elements = (header ?? "").split(",").map((e) => e.trim()).filter(Boolean);
  const element = elements[elements.length - 1] ?? "";
  for (const pair of element.split(";")) {
    const eq = pair.indexOf("=");
    if (eq < 0 || pair.slice(0, eq).trim().toLowerCase() !== "for") continue;
    const value = pair.slice(eq + 1).trim();
    return value.startsWith('"') && value.endsWith('"') ? value.slice(1, -1).replace(/\\(.)/g, "$1") : value;
  }
  return "";
}

/** Which header a trusted proxy writes the client's address into (BENCHFOLD_PROXY_HEADER). */
export function readProxyHeader(/** @type {string | undefined} */ setting) {
  const value = (setting ?? "x-forwarded-for").trim().toLowerCase();
  if (value !== "x-forwarded-for" && value !== "forwarded") {
    throw new Error(`BENCHFOLD_PROXY_HEADER: "${setting}" is neither x-forwarded-for nor forwarded`);
  }
  return /** @type {"x-forwarded-for" | "forwarded"} */ (value);
}

/** @param {string | string[] | undefined} value */
function joined(value) {
  return Array.isArray(value) ? value.join(", ") : value;
}

/**
 * Rewrites a request's headers in place before Next sees it (see the top of this file).
 * @param {import("node:http").IncomingMessage} req
 * @param {{ has(address: string): boolean }} trusted
 * @param {"x-forwarded-for" | "forwarded"} [proxyHeader]
 */
export function prepareRequestHeaders(req, trusted, proxyHeader = readProxyHeader(process.env.BENCHFOLD_PROXY_HEADER)) {
  const peer = normalizeAddress(req.socket.remoteAddress);
  const isTrustedPeer = trusted.has(peer);
  const proxied = forwardingHeaders.some((name) => req.headers[name] !== undefined);
  const clientAddress = resolveClientAddress({
    peer,
    forwardedFor: joined(req.headers["x-forwarded-for"]),
    forwarded: joined(req.headers.forwarded),
    proxyHeader,
    trusted,
  });

  const drop = new Set(isTrustedPeer ? internalHeaders : [...internalHeaders, ...forwardingHeaders]);
  // Node builds `headers` and `headersDistinct` lazily from `rawHeaders`, counting the pairs it
  // parsed: both are built here, before `rawHeaders` changes length, and all three are edited alike.
  const headers = req.headers;
  const distinct = req.headersDistinct;
  /** @type {string[]} */
  const raw = [];
  for (let i = 0; i + 1 < req.rawHeaders.length; i += 2) {
    if (!drop.has(req.rawHeaders[i].toLowerCase())) raw.push(req.rawHeaders[i], req.rawHeaders[i + 1]);
  }
  for (const name of drop) {
    delete headers[name];
    delete distinct[name];
  }

  /** @type {Record<string, string>} */
  const set = { "x-benchfold-peer": peer, "x-benchfold-client-address": clientAddress, "x-benchfold-proxied": proxied ? "1" : "0" };
  for (const [name, value] of Object.entries(set)) {
    headers[name] = value;
    distinct[name] = [value];
    raw.push(name, value);
  }
  req.rawHeaders = raw;
}

/**
 * True when every %-escape of the request target's path decodes as UTF-8.
 * @param {string} url
 */
export function decodablePath(url) {
  const path = url.split("?")[0];
  try {
    for (const segment of path.split("/")) decodeURIComponent(segment);
    return true;
  } catch {
    return false;
  }
}

/**
 * Decides when the idle server runs one full garbage collection. V8 does not collect a heap that
 * stops allocating: after `npm run bench`'s load the server's heap stayed at 255 MB committed,
 * 156 MB of it garbage, for as long as it was watched (40 s and more), so the process kept that
 * memory. Once no request has been in flight for `idleMs`, and at least `minRequests` were served
 * since the last collection, `tick()` collects (about 0.1–0.3 s for a few hundred MB here, never
 * while a request is in flight); the heap then returns to its size before the load.
 * @param {{ collect: () => void, now?: () => number, idleMs: number, minRequests?: number }} options
 */
export function createIdleCollector({ collect, now = Date.now, idleMs, minRequests = 50 }) {
  let inFlight = 0;
  let served = 0;
  let lastActivity = now();
  return {
    started() {
      inFlight += 1;
      lastActivity = now();
    },
    finished() {
      inFlight = Math.max(0, inFlight - 1);
      served += 1;
      lastActivity = now();
    },
    /** Collects when due; true when it did. */
    tick() {
      if (inFlight > 0 || served < minRequests || now() - lastActivity < idleMs) return false;
      served = 0;
      collect();
      return true;
    },
  };
}

/**
 * V8's full collection, reachable without starting node with --expose-gc (v8.setFlagsFromString,
 * then a fresh context's gc), run twice: the first marks and sweeps, the second, with sweeping
 * done, gives the emptied pages back. One alone left the heap at 261 MB committed, 73 MB used;
 * two brought it to 81 MB committed.
 */
function fullCollection() {
  setFlagsFromString("--expose-gc");
  const gc = /** @type {() => void} */ (runInNewContext("gc"));
  return () => {
    gc();
    gc();
  };
}

const abortPatched = Symbol.for("benchfold.abort-reason-stack-released");

/**
 * Makes every `abort(reason)` of the given AbortController class format an Error reason's stack
 * (and give a reason-less abort a DOMException whose stack is formatted) before the signal keeps it.
 *
 * Why: V8 keeps an Error's stack as structured frames (CallSiteInfo, each holding its function and
 * receiver) until `.stack` is first read, and then keeps only the text. React's server renderer
 * aborts each finished render's cacheController with an Error nobody reads (React issue 37288,
 * Next.js issues 96279 and 97434); one of its frames has a run setImmediate as receiver, that
 * Immediate carries the request's AsyncLocalStorage store (request, response, session, the whole
 * render), and a run Immediate keeps its queue links to the other Immediates of its batch, which
 * carry other requests' stores, whose abort reasons hold more Immediates. With one request held
 * anywhere for good (Turbopack's async-module promise holds the first request that loaded the
 * module), every page request after it stayed in memory: measured here, 384 of 384 rendered pages
 * still in the heap after 20 s of load. Formatting costs a few microseconds per abort.
 * @param {{ prototype: AbortController }} Controller
 */
export function releaseAbortReasonFrames(Controller = globalThis.AbortController) {
  const proto = /** @type {AbortController & Record<symbol, unknown>} */ (Controller.prototype);
  if (proto[abortPatched]) return;
  const abort = proto.abort;
  Object.defineProperty(proto, "abort", {
    configurable: true,
    writable: true,
    value: /** @this {AbortController} @param {unknown} [reason] */ function abort_(reason) {
      const given = reason === undefined ? new DOMException("This operation was aborted", "AbortError") : reason;
      if (given instanceof Error || given instanceof DOMException) void given.stack;
      return abort.call(this, given);
    },
  });
  Object.defineProperty(proto, abortPatched, { value: true });
}

/** The process-wide symbols shared with the app's code (lib/shutdown.ts). */
export const shuttingDownMarker = Symbol.for("benchfold.shutting-down");
export const shutdownHooksKey = Symbol.for("benchfold.shutdown-hooks");

/** BENCHFOLD_SHUTDOWN_GRACE_MS: how long SIGTERM waits for requests in flight (25 s: inside a 30 s orchestrator limit). */
export function readShutdownGraceMs(/** @type {string | undefined} */ setting) {
  if (setting === undefined || setting === "") return 25_000;
  if (!/^\d+$/.test(setting)) throw new Error(`BENCHFOLD_SHUTDOWN_GRACE_MS: "${setting}" is not a whole number of milliseconds`);
  return Number(setting);
}

/**
 * Stopping on SIGTERM (or SIGINT) without cutting anyone off:
 *
 *  1. the readiness probe answers 503 at once (the marker lib/shutdown.ts reads), and every answer
 *     from now on carries `Connection: close`;
 *  2. the listener closes: a new connection is refused; idle keep-alive connections are closed
 *     (Node ≥ 19 does that in server.close()); a connection already sending a request keeps it;
 *  3. the requests in flight finish, for at most `graceMs`; then any left are cut;
 *  4. Next is closed, then the app's shutdown hooks run (each bundled copy's database pool, the
 *     PDF render workers), each for at most 5 s;
 *  5. the process exits 0. A second signal while stopping exits 1 at once.
 *
 * @param {{ httpServer: import("node:http").Server, app: { close(): Promise<void> }, graceMs: number, log?: (line: string) => void, exit?: (code: number) => void }} options
 */
export function createGracefulShutdown({ httpServer, app, graceMs, log = (line) => console.log(`[benchfold] ${line}`), exit = (code) => process.exit(code) }) {
  /** @type {Set<import("node:http").ServerResponse>} */
  const inFlight = new Set();
  let began = false;
  /** @type {(() => void) | null} */
  let drained = null;

  return {
    /** Counts a request from its headers until its answer is sent or its connection closes. */
    track(/** @type {import("node:http").ServerResponse} */ res) {
      inFlight.add(res);
      if (began) res.shouldKeepAlive = false;
      res.once("close", () => {
        inFlight.delete(res);
        if (began && inFlight.size === 0) drained?.();
      });
    },
    get inFlight() {
      return inFlight.size;
    },
    async begin(/** @type {string} */ signal) {
      if (began) {
        log(`${signal} again while stopping: exiting now`);
        exit(1);
        return;
      }
      began = true;
      const started = Date.now();
      /** @type {Record<symbol, unknown>} */ (globalThis)[shuttingDownMarker] = true;
      for (const res of inFlight) res.shouldKeepAlive = false;
      httpServer.close();
      log(`${signal}: stopping; new connections refused, ${inFlight.size} request(s) in flight, waiting up to ${graceMs} ms`);
      // A last resort should a hook hang: the grace period, 5 s per hook, and a margin.
      setTimeout(() => {
        log("shutdown did not finish in time: exiting");
        exit(1);
      }, graceMs + 20_000).unref();

      const finished = await new Promise((resolve) => {
        if (inFlight.size === 0) return resolve(true);
        const timer = setTimeout(() => resolve(false), graceMs);
        drained = () => {
          clearTimeout(timer);
          resolve(true);
        };
      });
      const cut = inFlight.size;
      httpServer.closeAllConnections();
      if (!finished) log(`grace period over: ${cut} request(s) cut off`);
      else log(`requests finished in ${Date.now() - started} ms`);

      await app.close().catch((/** @type {Error} */ error) => log(`closing Next failed: ${error.message}`));
      /** @type {Set<{ name: string, run: () => Promise<void> }> | undefined} */
      const hooks = /** @type {any} */ (globalThis)[shutdownHooksKey];
      const closed = await Promise.all(
        [...(hooks ?? [])].map(async (hook) => {
          /** @type {NodeJS.Timeout | undefined} */
          let timer;
          const limit = new Promise((_, reject) => {
            timer = setTimeout(() => reject(new Error("no answer within 5 s")), 5_000);
          });
          try {
            await Promise.race([hook.run(), limit]);
            return `${hook.name} closed`;
          } catch (error) {
            return `${hook.name} not closed (${/** @type {Error} */ (error).message})`;
          } finally {
            clearTimeout(timer);
          }
        }),
      );
      const counts = new Map();
      for (const line of closed) counts.set(line, (counts.get(line) ?? 0) + 1);
      log(`stopped after ${Date.now() - started} ms: ${[...counts].map(([line, n]) => (n > 1 ? `${line} (×${n})` : line)).join(", ") || "nothing to close"}`);
      exit(0);
    },
  };
}

async function main() {
  const dev = process.argv.includes("--dev");
  // Before Next (and React) load: they pick their production or development builds from it.
  Object.assign(process.env, { NODE_ENV: dev ? "development" : "production" });
  const port = Number(process.env.PORT ?? 3000);
  const trusted = parseTrustedProxies(process.env.BENCHFOLD_TRUSTED_PROXIES);
  const proxyHeader = readProxyHeader(process.env.BENCHFOLD_PROXY_HEADER);
  /** @type {Record<symbol, unknown>} */ (globalThis)[serverMarker] = true;
  releaseAbortReasonFrames();

  /** @type {ReturnType<typeof createGracefulShutdown> | undefined} */
  let shutdown;
  const { default: next } = await import("next");
  const httpServer = createServer();
  const app = next({ dev, hostname: "localhost", port, httpServer });
  const handle = app.getRequestHandler();
  await app.prepare();

  // BENCHFOLD_IDLE_GC_MS: how long without requests before the idle collection (10 s; 0: never).
  const idleMs = Number(process.env.BENCHFOLD_IDLE_GC_MS ?? 10_000);
  const idle = idleMs > 0 ? createIdleCollector({ collect: fullCollection(), idleMs }) : null;
  if (idle) setInterval(() => idle.tick(), Math.min(5_000, idleMs)).unref();

  httpServer.on("request", (req, res) => {
    if (idle) {
      idle.started();
      res.once("close", () => idle.finished());
    }
    shutdown?.track(res);
    try {
      prepareRequestHeaders(req, trusted, proxyHeader);
    } catch (error) {
      console.error("[benchfold] unreadable request headers", error);
      res.statusCode = 400;
      res.end();
      return;
    }
    // A path whose %-escapes do not decode (e.g. /devices/%E0%A4%A) reaches no page: Next would
    // answer it 500 from its router; it is the client's mistake, so it is a plain 400 here.
    if (!decodablePath(req.url ?? "/")) {
      res.writeHead(400, { "content-type": "text/plain; charset=utf-8", "x-content-type-options": "nosniff" });
      res.end("The address holds a %-escape that does not decode (RFC 3986 §2.1).\n");
      return;
    }
    handle(req, res).catch((error) => {
      console.error("[benchfold] request failed", error);
      if (!res.headersSent) res.statusCode = 500;
      res.end();
    });
  });
  // Registered before Next's own upgrade listener (added on the first request), so an upgrade
  // request (dev hot reload) is rewritten the same way before Next sees it.
  httpServer.on("upgrade", (req, socket) => {
    try {
      prepareRequestHeaders(req, trusted, proxyHeader);
    } catch {
      socket.destroy();
    }
  });
  httpServer.on("error", (error) => {
    console.error(`[benchfold] could not serve on port ${port}:`, error.message);
    process.exit(1);
  });

  shutdown = createGracefulShutdown({ httpServer, app, graceMs: readShutdownGraceMs(process.env.BENCHFOLD_SHUTDOWN_GRACE_MS) });
  const stopping = shutdown;
  process.on("SIGTERM", () => stopping.begin("SIGTERM"));
  process.on("SIGINT", () => stopping.begin("SIGINT"));

  // No host: every interface, as `next start` does.
  httpServer.listen(port, () => {
    const proxies = trusted.entries.length ? trusted.entries.join(", ") : "none (the client address is the socket's)";
    console.log(`[benchfold] ${dev ? "dev server" : "server"} on http://localhost:${port} (all interfaces); trusted proxies: ${proxies}`);
    if (process.env.BENCHFOLD_FAKE_SMTP === "1") {
      console.log(
        `[benchfold] MAIL IS NOT BEING DELIVERED: it is caught by the local fake SMTP server. ` +
          `Read it at http://localhost:${port}/dev/mailbox, only from this machine.`,
      );
    }
  });
}

// Run as a program (not imported by a test); compared by real path so a symlinked checkout still starts.
if (process.argv[1] && realpathSync(process.argv[1]) === realpathSync(fileURLToPath(import.meta.url))) {
  main().catch((error) => {
    console.error("[benchfold] the server did not start:", error);
    process.exit(1);
  });
}
