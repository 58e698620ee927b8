import { route } from "@/lib/server/auth/guard";
import { matchesEtag, releasedFileCaching } from "@/lib/server/reviews/released-caching";
import { readReleasedCsv } from "@/lib/server/reviews/released-files";

export const dynamic = "force-dynamic";

/**
 * A released revision's specification table as CSV, written from its frozen model by the one CSV
 * writer (lib/catalog), once per revision and kept (lib/server/kept-results.ts). The ETag is the
 * SHA-256 of the text; caching as for the revision's PDF.
 */
export const GET = route({ resource: "released-sheets" }, async ({ params, request }) => {
  const { head, csv } = await readReleasedCsv({ organizationSlug: params.org, partNumber: params.part, revision: params.rev });
  const headers: Record<string, string> = {
    "content-disposition": `attachment; filename="${csv.fileName}"`,
    "cache-control": releasedFileCaching(params.rev, head.standing),
    etag: csv.etag,
    "x-benchfold-revision": head.letter,
    "x-benchfold-standing": head.standing,
  };
  if (matchesEtag(request, csv.etag)) return new Response(null, { status: 304, headers });
  return new Response(csv.text, { headers: { ...headers, "content-type": "text/csv; charset=utf-8; header=present" } });
});
