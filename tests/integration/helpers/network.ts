import { request } from "node:http";
import { networkInterfaces } from "node:os";
import { baseUrl } from "./loopback";

/**
 * The test server reached through one of this machine's non-loopback interface addresses, so
 * the server sees a non-loopback socket peer. Throws, rather than letting a test pass without
 * checking anything, when the machine has no such interface.
 */
export function nonLoopbackBaseUrl(): string {
  const addresses = Object.values(networkInterfaces())
    .flat()
    .filter((a) => a && !a.internal && !(a.family === "IPv6" && a.address.toLowerCase().startsWith("fe80:")));
  const chosen = addresses.find((a) => a!.family === "IPv4") ?? addresses[0];
  if (!chosen) {
    throw new Error(
      "THIS MACHINE HAS NO NON-LOOPBACK NETWORK INTERFACE (os.networkInterfaces() lists loopback only), so the test " +
        "cannot show that a request from another address is refused. Give it one (as root, e.g. a veth pair: " +
        "`ip link add bf0 type veth peer name bf1 && ip addr add 192.0.2.10/24 dev bf0 && ip link set bf0 up && ip link set bf1 up`) and run again.",
    );
  }
  const host = chosen.family === "IPv6" ? `[${chosen.address}]` : chosen.address;
  return `http://${host}:${new URL(baseUrl).port}`;
}

/**
 * A plain HTTP/1.1 request with exactly these headers (fetch would not let a test set Host).
 * Answers the status and the body as text.
 */
export function rawRequest(url: string, headers: Record<string, string> = {}): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const req = request(url, { method: "GET", headers }, (res) => {
      let body = "";
      res.setEncoding("utf8");
      res.on("data", (chunk: string) => (body += chunk));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on("error", reject);
    req.end();
  });
}
