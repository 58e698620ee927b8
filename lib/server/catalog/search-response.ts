import "server-only";
import { gzipSync } from "node:zlib";
import type { CatalogResult } from "@/lib/catalog/types";
import type { SheetsSearchResponse } from "@/lib/schemas/api-v1";

/**
 * The body of GET /api/v1/sheets for one search answer, serialized once and gzip-compressed once per
 * answer object: searchCatalog hands back the same object for a kept answer, so a repeated search costs
 * neither JSON.stringify nor zlib again (compressing each response was a sixth of the server's CPU time
 * under the catalog benchmark). Next leaves a response that already has a Content-Encoding alone.
 */
const encoded = new WeakMap<CatalogResult, { json: string; gzip?: Buffer }>();

export function searchResponse(result: CatalogResult, request: Request, headers: Record<string, string>): Response {
  let entry = encoded.get(result);
  if (!entry) {
    entry = { json: JSON.stringify({ apiVersion: 1, ...result } satisfies SheetsSearchResponse) };
    encoded.set(result, entry);
  }
  const common = { ...headers, "content-type": "application/json", vary: "accept-encoding" };
  if (!acceptsGzip(request.headers.get("accept-encoding"))) return new Response(entry.json, { headers: common });
  entry.gzip ??= gzipSync(entry.json);
  return new Response(new Uint8Array(entry.gzip), { headers: { ...common, "content-encoding": "gzip", "content-length": String(entry.gzip.length) } });
}

/** RFC 9110 §12.5.3: gzip listed (or `*`) with a q-value above zero. */
export function acceptsGzip(header: string | null): boolean {
  if (!header) return false;
  let star: boolean | null = null;
  for (const part of header.split(",")) {
    const [coding, ...params] = part.trim().toLowerCase().split(";");
    const q = params.map((p) => p.trim()).find((p) => p.startsWith("q="));
    const accepted = q === undefined || Number(q.slice(2)) > 0;
    if (coding === "gzip" || coding === "x-gzip") return accepted;
    if (coding === "*") star = accepted;
  }
  return star ?? false;
}
