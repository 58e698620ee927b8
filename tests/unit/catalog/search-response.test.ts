import { describe, expect, it, vi } from "vitest";
import type { CatalogResult } from "@/lib/catalog/types";

vi.mock("server-only", () => ({}));
const { searchResponse } = await import("@/lib/server/catalog/search-response");

describe("searchResponse", () => {
  const result: CatalogResult = { total: 0, page: 1, pageSize: 25, hits: [], facets: { deviceClass: [], organization: [] } };

  it("answers the versioned JSON with the headers given", async () => {
    const r = searchResponse(result, { "cache-control": "public, no-cache" });
    expect(r.headers.get("cache-control")).toBe("public, no-cache");
    expect(r.headers.get("content-type")).toBe("application/json");
    expect(await r.json()).toEqual({ apiVersion: 1, ...result });
  });

  it("serializes an answer object once, and another answer afresh", async () => {
    const fresh: CatalogResult = { ...result, page: 2 };
    const stringify = vi.spyOn(JSON, "stringify");
    await searchResponse(fresh, {}).text();
    await searchResponse(fresh, {}).text();
    expect(stringify.mock.calls.filter(([v]) => (v as { apiVersion?: number })?.apiVersion === 1)).toHaveLength(1);
    expect(await searchResponse({ ...result, total: 5 }, {}).json()).toMatchObject({ total: 5 });
    stringify.mockRestore();
  });
});
