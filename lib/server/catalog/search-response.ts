import "server-only";
import type { CatalogResult } from "@/lib/catalog/types";
import type { SheetsSearchResponse } from "@/lib/schemas/api-v1";

/**
 * The body of GET /api/v1/sheets for one search answer, serialized once per answer object:
 * searchCatalog hands back the same object for a kept answer, so a repeated search does not run
 * JSON.stringify again. (Compression stays Next's: a route handler's own `Content-Encoding: gzip` is
 * dropped by Next, which then gzips the gzip — seen on this build — so the body goes out as text.)
 */
const serialized = new WeakMap<CatalogResult, string>();

export function searchResponse(result: CatalogResult, headers: Record<string, string>): Response {
  let json = serialized.get(result);
  if (json === undefined) {
    json = JSON.stringify({ apiVersion: 1, ...result } satisfies SheetsSearchResponse);
    serialized.set(result, json);
  }
  return new Response(json, { headers: { ...headers, "content-type": "application/json" } });
}
