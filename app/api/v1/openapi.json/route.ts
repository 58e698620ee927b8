import { createHash } from "node:crypto";
import { route } from "@/lib/server/auth/guard";
import { buildOpenApiDocument } from "@/lib/schemas/openapi-document";

export const dynamic = "force-dynamic";

let served: { body: string; etag: string } | null = null;

/**
 * The OpenAPI 3.1 document of /api/v1, generated from the zod schemas its handlers use
 * (lib/schemas/openapi-document.ts). Public; it changes only with a new build, so it is built once
 * per process and revalidated by its digest.
 */
export const GET = route({ resource: "service" }, async ({ request }) => {
  if (!served) {
    const body = JSON.stringify(buildOpenApiDocument());
    served = { body, etag: `"${createHash("sha256").update(body).digest("hex").slice(0, 40)}"` };
  }
  const headers = { "cache-control": "public, no-cache", etag: served.etag };
  const wanted = request.headers.get("if-none-match");
  if (wanted && wanted.split(",").some((tag) => tag.trim() === served!.etag)) return new Response(null, { status: 304, headers });
  return new Response(served.body, { headers: { ...headers, "content-type": "application/json" } });
});
