import type { MetadataRoute } from "next";
import { serverConfig } from "@/lib/server/config";

// The sitemap's address follows the server's public address (NEXTAUTH_URL), read at request time.
export const dynamic = "force-dynamic";

/**
 * /robots.txt: the public pages (home, catalog, released sheets, verify) may be crawled, with the
 * released sheets' JSON and PDFs; the workspace, accounts, the rest of the API and the dev mailbox
 * may not (they need a session or are private to this machine anyway). Names the sitemap.
 * The longest matching rule wins (RFC 9309 §2.2.2), so /api/v1/sheets/ stays open under /api/.
 */
export default function robots(): MetadataRoute.Robots {
  return {
    rules: [
      {
        userAgent: "*",
        allow: ["/", "/api/v1/sheets/"],
        disallow: ["/api/", "/dev/", "/devices", "/sheets", "/review", "/admin/", "/subscriptions", "/unsubscribe/", "/sign-in", "/sign-up", "/password-reset", "/invitations/"],
      },
    ],
    sitemap: new URL("/sitemap.xml", serverConfig.appUrl).toString(),
  };
}
