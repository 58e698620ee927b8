import type { MetadataRoute } from "next";
import { serverConfig } from "@/lib/server/config";
import { listSitemapSheets } from "@/lib/server/catalog/list-sitemap-sheets";

// Read from the database on each request: a release or a withdrawal shows at once.
export const dynamic = "force-dynamic";

/**
 * /sitemap.xml: the catalog and every released sheet that is not withdrawn, by the lettered address
 * its page names as canonical (the "current" address is a moving alias of one of them, so it is
 * left out, as a sitemap lists canonical addresses only). robots.txt (app/robots.ts) names it.
 */
export default async function sitemap(): Promise<MetadataRoute.Sitemap> {
  const base = serverConfig.appUrl;
  const sheets = await listSitemapSheets();
  return [
    { url: new URL("/catalog", base).toString(), changeFrequency: "daily", priority: 0.6 },
    ...sheets.map((sheet) => ({
      url: new URL(sheet.path, base).toString(),
      lastModified: sheet.changedAt,
      changeFrequency: sheet.standing === "current" ? ("monthly" as const) : ("yearly" as const),
      priority: sheet.standing === "current" ? 0.8 : 0.3,
    })),
  ];
}
