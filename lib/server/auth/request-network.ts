import "server-only";

/**
 * Where a request came from, as scripts/server.mjs (the process's HTTP server) recorded it from
 * the TCP socket before Next saw the request. A client cannot set these headers: the server
 * removes any copy it sends. When the process was not started by that server (plain
 * `next start`), nothing removed them, so they are ignored and every answer here fails closed.
 */
export type RequestNetwork = {
  /** The socket's remote address; "" when unknown. */
  peer: string;
  /** The peer, or the hop a trusted proxy appended (BENCHFOLD_TRUSTED_PROXIES); "unknown" when unknown. */
  clientAddress: string;
  /** True when the request carried a forwarding header: it came through a proxy, even a local one. */
  proxied: boolean;
};

type HeaderSource = Headers | Record<string, string | string[] | undefined> | undefined;

const serverMarker = Symbol.for("benchfold.request-network-headers");
let warned = false;

function startedByOurServer(): boolean {
  const marked = (globalThis as Record<symbol, unknown>)[serverMarker] === true;
  if (!marked && !warned) {
    warned = true;
    console.warn(
      "[benchfold] not started through scripts/server.mjs: the client address is unknown (one shared sign-in limit) and /dev/mailbox is refused",
    );
  }
  return marked;
}

function headerValue(headers: HeaderSource, name: string): string | undefined {
  if (!headers) return undefined;
  if (headers instanceof Headers) return headers.get(name) ?? undefined;
  const value = headers[name];
  return Array.isArray(value) ? value[0] : value;
}

export function readRequestNetwork(headers: HeaderSource): RequestNetwork {
  if (!startedByOurServer()) return { peer: "", clientAddress: "unknown", proxied: true };
  return {
    peer: headerValue(headers, "x-benchfold-peer") ?? "",
    clientAddress: headerValue(headers, "x-benchfold-client-address") || "unknown",
    proxied: headerValue(headers, "x-benchfold-proxied") !== "0",
  };
}

const loopbackHostnames = new Set(["localhost", "127.0.0.1", "[::1]"]);

function isLoopbackPeer(address: string): boolean {
  return address === "::1" || /^127\.\d+\.\d+\.\d+$/.test(address);
}

/**
 * True only for a request made on this machine, straight to this server: a loopback socket
 * peer, no forwarding header (a local reverse proxy would relay other machines' requests), and
 * a loopback Host (so a page on another site cannot reach it through DNS rebinding).
 */
export function isFromThisMachine(headers: HeaderSource): boolean {
  const { peer, proxied } = readRequestNetwork(headers);
  if (proxied || !isLoopbackPeer(peer)) return false;
  const host = headerValue(headers, "host") ?? "";
  const hostname = host.replace(/:\d+$/, "").toLowerCase();
  return loopbackHostnames.has(hostname);
}
