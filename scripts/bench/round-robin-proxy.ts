/**
 * A small HTTP round-robin proxy for the bench (scripts/bench/catalog-load.ts): each request goes to
 * the next upstream in turn over kept-alive connections, with X-Forwarded-For/-Host/-Proto set as a
 * load balancer sets them. Not for production: no health checks, no retries, no TLS.
 */
import http from "node:http";

export async function startRoundRobinProxy(port: number, upstreamPorts: number[]): Promise<{ close: () => Promise<void> }> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: 256 });
  let next = 0;
  const server = http.createServer((req, res) => {
    const upstream = upstreamPorts[next++ % upstreamPorts.length];
    const headers = {
      ...req.headers,
      "x-forwarded-for": req.socket.remoteAddress ?? "127.0.0.1",
      "x-forwarded-host": req.headers.host ?? `localhost:${port}`,
      "x-forwarded-proto": "http",
    };
    const forward = http.request({ host: "127.0.0.1", port: upstream, method: req.method, path: req.url, headers, agent }, (answer) => {
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    forward.on("error", (error) => {
      if (!res.headersSent) res.writeHead(502, { "content-type": "text/plain" });
      res.end(`upstream ${upstream}: ${error.message}`);
    });
    req.pipe(forward);
  });
  server.keepAliveTimeout = 5_000;
  await new Promise<void>((resolve, reject) => server.once("error", reject).listen(port, "127.0.0.1", () => resolve()));
  return {
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
        agent.destroy();
      }),
  };
}
