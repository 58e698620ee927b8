import { gunzipSync } from "node:zlib";
import { describe, expect, it, vi } from "vitest";
import type { CatalogResult } from "@/lib/catalog/types";

vi.mock("server-only", () => ({}));
const { acceptsGzip, searchResponse } = await import("@/lib/server/catalog/search-response");

// Accept-Encoding as RFC 9110 §12.5.3 defines it: codings with optional q-values, q=0 meaning "not
// acceptable", "*" for any coding not listed; its examples are the first rows.
describe("acceptsGzip", () => {
  it.each([
    ["compress, gzip", true],
    ["", false],
    ["*", true],
    ["compress;q=0.5, gzip;q=1.0", true],
    ["gzip;q=1.0, identity; q=0.5, *;q=0", true],
    ["gzip;q=0", false],
    ["br, *;q=0", false],
    ["br, *", true],
    ["identity", false],
    ["GZIP", true],
    ["x-gzip", true],
    ["gzip, deflate", true],
  ])("%j → %s", (header, expected) => {
    expect(acceptsGzip(header)).toBe(expected);
  });
  it("no header: identity", () => expect(acceptsGzip(null)).toBe(false));
});

describe("searchResponse", () => {
  const result: CatalogResult = { total: 0, page: 1, pageSize: 25, hits: [], facets: { deviceClass: [], organization: [] } };
  const request = (encoding?: string) => new Request("http://localhost/api/v1/sheets", { headers: encoding ? { "accept-encoding": encoding } : {} });

  it("sends gzip when accepted, the same JSON as plain, with Vary", async () => {
    const plain = searchResponse(result, request(), { "cache-control": "public, no-cache" });
    const zipped = searchResponse(result, request("gzip, deflate"), { "cache-control": "public, no-cache" });
    expect(plain.headers.get("content-encoding")).toBeNull();
    expect(zipped.headers.get("content-encoding")).toBe("gzip");
    for (const r of [plain, zipped]) {
      expect(r.headers.get("vary")).toBe("accept-encoding");
      expect(r.headers.get("cache-control")).toBe("public, no-cache");
      expect(r.headers.get("content-type")).toBe("application/json");
    }
    const text = await plain.text();
    // node:zlib's gunzip as the reference reader of the compressed bytes.
    expect(gunzipSync(Buffer.from(await zipped.arrayBuffer())).toString("utf8")).toBe(text);
    expect(JSON.parse(text)).toEqual({ apiVersion: 1, ...result });
  });

  it("serializes an answer once: a kept answer object gives the same bytes", async () => {
    const a = await searchResponse(result, request("gzip"), {}).arrayBuffer();
    const b = await searchResponse(result, request("gzip"), {}).arrayBuffer();
    expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true);
    const other = await searchResponse({ ...result, total: 5 }, request(), {}).json();
    expect(other).toMatchObject({ total: 5 });
  });
});
