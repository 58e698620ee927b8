import { createServer, type IncomingMessage } from "node:http";
import { connect, type AddressInfo } from "node:net";
import { describe, expect, it } from "vitest";
import { lastForwardedFor, normalizeAddress, parseTrustedProxies, prepareRequestHeaders, readProxyHeader, resolveClientAddress } from "@/scripts/server.mjs";

/** A request as Node's HTTP parser leaves it: lower-cased `headers` (duplicates joined) and `rawHeaders`. */
function fakeRequest(remoteAddress: string, raw: [string, string][]): IncomingMessage {
  const headers: Record<string, string> = {};
  const headersDistinct: Record<string, string[]> = {};
  for (const [name, value] of raw) {
    const key = name.toLowerCase();
    headers[key] = headers[key] === undefined ? value : `${headers[key]}, ${value}`;
    headersDistinct[key] = [...(headersDistinct[key] ?? []), value];
  }
  return { socket: { remoteAddress }, headers, headersDistinct, rawHeaders: raw.flat() } as unknown as IncomingMessage;
}

const rawPairs = (req: IncomingMessage) =>
  Array.from({ length: req.rawHeaders.length / 2 }, (_, i) => [req.rawHeaders[2 * i].toLowerCase(), req.rawHeaders[2 * i + 1]]);

const loopbackProxy = parseTrustedProxies("127.0.0.1,::1");
const none = parseTrustedProxies(undefined);

describe("BENCHFOLD_TRUSTED_PROXIES", () => {
  it.each([
    ["127.0.0.1,::1", "127.0.0.1", true],
    ["127.0.0.1,::1", "::ffff:127.0.0.1", true],
    ["127.0.0.1,::1", "::1", true],
    ["127.0.0.1,::1", "127.0.0.2", false],
    ["10.0.0.0/8 192.168.1.5", "10.200.3.4", true],
    ["10.0.0.0/8 192.168.1.5", "192.168.1.6", false],
    ["fd00::/8", "fd12::7", true],
    ["", "127.0.0.1", false],
  ])("%j trusts %s: %s", (setting, address, expected) => {
    expect(parseTrustedProxies(setting).has(address)).toBe(expected);
  });

  it.each(["localhost", "10.0.0.0/33", "10.0.0.1/8/2", "1.2.3", "::1/x"])("refuses %j", (entry) => {
    expect(() => parseTrustedProxies(entry)).toThrow(/not an IP address or CIDR range/);
  });
});

describe("the client address", () => {
  it("is the socket peer when no proxy is trusted, whatever X-Forwarded-For says", () => {
    expect(resolveClientAddress({ peer: "192.0.2.9", forwardedFor: "127.0.0.1", trusted: none })).toBe("192.0.2.9");
    expect(resolveClientAddress({ peer: "::ffff:192.0.2.9", forwardedFor: undefined, trusted: none })).toBe("192.0.2.9");
  });

  it("is the peer when the peer is not one of the trusted proxies", () => {
    expect(resolveClientAddress({ peer: "192.0.2.9", forwardedFor: "10.1.2.3", trusted: loopbackProxy })).toBe("192.0.2.9");
  });

  it("is the right-most X-Forwarded-For hop, the one the trusted proxy appended", () => {
    // The client sent "127.0.0.1, 10.9.9.9"; the proxy appended the address it saw.
    expect(resolveClientAddress({ peer: "127.0.0.1", forwardedFor: "127.0.0.1, 10.9.9.9, 198.51.100.4", trusted: loopbackProxy })).toBe("198.51.100.4");
    expect(resolveClientAddress({ peer: "::1", forwardedFor: "[2001:db8::5]:4711", trusted: loopbackProxy })).toBe("2001:db8::5");
    expect(resolveClientAddress({ peer: "::1", forwardedFor: "198.51.100.4:5100", trusted: loopbackProxy })).toBe("198.51.100.4");
  });

  it("stays the peer when the trusted proxy appended nothing usable", () => {
    expect(resolveClientAddress({ peer: "127.0.0.1", forwardedFor: "198.51.100.4, unknown", trusted: loopbackProxy })).toBe("127.0.0.1");
    expect(resolveClientAddress({ peer: "127.0.0.1", forwardedFor: " , ", trusted: loopbackProxy })).toBe("127.0.0.1");
  });

  // The header values are RFC 7239's own examples (§4 and §7.1).
  it("reads the last for= of a Forwarded header when the proxy is configured to write that header", () => {
    expect(lastForwardedFor('for="_gazonk"')).toBe("_gazonk");
    expect(lastForwardedFor('For="[2001:db8:cafe::17]:4711"')).toBe("[2001:db8:cafe::17]:4711");
    expect(lastForwardedFor("for=192.0.2.60;proto=http;by=203.0.113.43")).toBe("192.0.2.60");
    expect(lastForwardedFor("for=192.0.2.43, for=198.51.100.17")).toBe("198.51.100.17");
    expect(lastForwardedFor("proto=https")).toBe("");
    const viaForwarded = (forwarded: string, forwardedFor?: string) =>
      resolveClientAddress({ peer: "127.0.0.1", forwardedFor, forwarded, proxyHeader: "forwarded", trusted: loopbackProxy });
    expect(viaForwarded("for=192.0.2.43, for=198.51.100.17")).toBe("198.51.100.17");
    expect(viaForwarded('For="[2001:db8:cafe::17]:4711"')).toBe("2001:db8:cafe::17");
    // An obfuscated or unknown hop names no address: the peer stands.
    expect(viaForwarded('for="_gazonk"')).toBe("127.0.0.1");
    expect(viaForwarded("for=unknown")).toBe("127.0.0.1");
    // The client's own X-Forwarded-For, passed through by a proxy that writes Forwarded, is not read.
    expect(viaForwarded("for=198.51.100.17", "10.6.6.6")).toBe("198.51.100.17");
    // And the reverse: a proxy that writes X-Forwarded-For leaves the client's Forwarded unread.
    expect(resolveClientAddress({ peer: "127.0.0.1", forwardedFor: "198.51.100.4", forwarded: "for=10.6.6.6", trusted: loopbackProxy })).toBe("198.51.100.4");
    // From an untrusted peer neither header counts.
    expect(resolveClientAddress({ peer: "192.0.2.9", forwardedFor: undefined, forwarded: "for=10.6.6.6", proxyHeader: "forwarded", trusted: loopbackProxy })).toBe("192.0.2.9");
  });

  it("accepts only the two proxy header settings", () => {
    expect(readProxyHeader(undefined)).toBe("x-forwarded-for");
    expect(readProxyHeader("Forwarded")).toBe("forwarded");
    expect(() => readProxyHeader("x-real-ip")).toThrow(/BENCHFOLD_PROXY_HEADER/);
  });

  it("normalises IPv4-mapped IPv6 peers", () => {
    expect(normalizeAddress("::FFFF:127.0.0.1")).toBe("127.0.0.1");
    expect(normalizeAddress("2001:DB8::1")).toBe("2001:db8::1");
  });
});

describe("prepareRequestHeaders", () => {
  it("replaces a client's own copies of the internal headers, in headers and rawHeaders", () => {
    const req = fakeRequest("192.0.2.9", [
      ["Host", "example.test"],
      ["X-Benchfold-Peer", "127.0.0.1"],
      ["x-benchfold-client-address", "127.0.0.1"],
      ["X-BENCHFOLD-PROXIED", "0"],
      ["x-benchfold-peer", "::1"],
    ]);
    prepareRequestHeaders(req, none);
    expect(req.headers).toMatchObject({ "x-benchfold-peer": "192.0.2.9", "x-benchfold-client-address": "192.0.2.9", "x-benchfold-proxied": "0" });
    expect(rawPairs(req)).toEqual([
      ["host", "example.test"],
      ["x-benchfold-peer", "192.0.2.9"],
      ["x-benchfold-client-address", "192.0.2.9"],
      ["x-benchfold-proxied", "0"],
    ]);
  });

  it("drops forwarding headers from an untrusted peer but records that the request carried them", () => {
    const req = fakeRequest("192.0.2.9", [
      ["Host", "example.test"],
      ["X-Forwarded-For", "127.0.0.1"],
      ["X-Forwarded-Host", "localhost"],
      ["Forwarded", "for=127.0.0.1"],
    ]);
    prepareRequestHeaders(req, loopbackProxy);
    expect(req.headers["x-forwarded-for"]).toBeUndefined();
    expect(req.headers["x-forwarded-host"]).toBeUndefined();
    expect(req.headers.forwarded).toBeUndefined();
    expect(req.headers).toMatchObject({ "x-benchfold-peer": "192.0.2.9", "x-benchfold-client-address": "192.0.2.9", "x-benchfold-proxied": "1" });
    expect(rawPairs(req).map(([name]) => name)).toEqual(["host", "x-benchfold-peer", "x-benchfold-client-address", "x-benchfold-proxied"]);
  });

  it("keeps a trusted proxy's forwarding headers and takes its appended hop; the request counts as proxied", () => {
    const req = fakeRequest("::ffff:127.0.0.1", [
      ["X-Forwarded-For", "127.0.0.1"],
      ["X-Forwarded-For", "203.0.113.50"],
    ]);
    prepareRequestHeaders(req, loopbackProxy);
    expect(req.headers).toMatchObject({
      "x-forwarded-for": "127.0.0.1, 203.0.113.50",
      "x-benchfold-peer": "127.0.0.1",
      "x-benchfold-client-address": "203.0.113.50",
      "x-benchfold-proxied": "1",
    });
  });

  it("marks a plain loopback request as not proxied", () => {
    const req = fakeRequest("::1", [["Host", "localhost:3000"]]);
    prepareRequestHeaders(req, loopbackProxy);
    expect(req.headers).toMatchObject({ "x-benchfold-peer": "::1", "x-benchfold-client-address": "::1", "x-benchfold-proxied": "0" });
  });
});

describe("prepareRequestHeaders on a real Node socket", () => {
  it("leaves no client copy of an internal header in headers, rawHeaders or headersDistinct", async () => {
    const server = createServer((req, res) => {
      prepareRequestHeaders(req, none);
      res.end(JSON.stringify({ headers: req.headers, rawHeaders: req.rawHeaders, distinct: req.headersDistinct }));
    });
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    const { port } = server.address() as AddressInfo;
    // Written by hand: duplicate and oddly cased copies, which fetch would merge or refuse.
    const raw = [
      "GET / HTTP/1.1",
      `Host: 127.0.0.1:${port}`,
      "X-Benchfold-Peer: 10.0.0.1",
      "x-benchfold-peer: 10.0.0.2",
      "X-BENCHFOLD-CLIENT-ADDRESS: 10.0.0.3",
      "X-Benchfold-Proxied: 0",
      "X-Forwarded-For: 10.0.0.4",
      "Connection: close",
      "",
      "",
    ].join("\r\n");
    const answer = await new Promise<string>((resolve, reject) => {
      let text = "";
      const socket = connect(port, "127.0.0.1", () => socket.write(raw));
      socket.on("data", (chunk) => (text += chunk.toString()));
      socket.on("end", () => resolve(text));
      socket.on("error", reject);
    });
    server.close();
    const seen = JSON.parse(answer.slice(answer.indexOf("\r\n\r\n") + 4)) as {
      headers: Record<string, string>;
      rawHeaders: string[];
      distinct: Record<string, string[]>;
    };
    expect(seen.headers).toMatchObject({ "x-benchfold-peer": "127.0.0.1", "x-benchfold-client-address": "127.0.0.1", "x-benchfold-proxied": "1" });
    expect(seen.headers["x-forwarded-for"]).toBeUndefined();
    expect(seen.distinct["x-benchfold-peer"]).toEqual(["127.0.0.1"]);
    expect(seen.distinct["x-forwarded-for"]).toBeUndefined();
    const internal = seen.rawHeaders.filter((_, i) => i % 2 === 0 && seen.rawHeaders[i].toLowerCase().startsWith("x-benchfold-"));
    expect(internal).toEqual(["x-benchfold-peer", "x-benchfold-client-address", "x-benchfold-proxied"]);
  });
});
