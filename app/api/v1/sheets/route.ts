import { parseCatalogQuery } from "@/lib/catalog/catalog-query";
import { AppError } from "@/lib/errors";
import { route } from "@/lib/server/auth/guard";
import { searchCatalog } from "@/lib/server/catalog/search-catalog";
import { searchResponse } from "@/lib/server/catalog/search-response";

export const dynamic = "force-dynamic";

/**
 * The catalog's search as JSON (the same query string as /catalog): the page of current released
 * revisions (or all, with rev=all), the total and the counts per class and organization.
 * A query that cannot be read answers 422 naming each field. The answer is `sheetsSearchResponseSchema`
 * (lib/schemas/api-v1.ts), which /api/v1/openapi.json publishes; serialized once per answer.
 */
export const GET = route({ resource: "catalog" }, async ({ request }) => {
  const parsed = parseCatalogQuery(new URL(request.url).searchParams);
  if (!parsed.ok) throw new AppError("invalid", `${parsed.issues[0].field}: ${parsed.issues[0].message}`, { fields: parsed.issues });
  const result = await searchCatalog(parsed.query);
  return searchResponse(result, { "cache-control": "public, no-cache" });
});
