import { createHash } from "node:crypto";
import { specificationsCsv } from "@/lib/catalog/sheet-csv";
import { route } from "@/lib/server/auth/guard";
import { matchesEtag, releasedFileCaching } from "@/lib/server/reviews/released-caching";
import { findReleasedRevision } from "@/lib/server/reviews/list-revisions";
import { specificationsCsvFileName } from "@/lib/sheet/file-name";

export const dynamic = "force-dynamic";

/**
 * A released revision's specification table as CSV, written from its frozen model by the one CSV
 * writer (lib/catalog). The ETag is the SHA-256 of the text; caching as for the revision's PDF.
 */
export const GET = route({ resource: "released-sheets" }, async ({ params, request }) => {
  const { summary, model } = await findReleasedRevision({ organizationSlug: params.org, partNumber: params.part, revision: params.rev });
  const csv = specificationsCsv(model);
  const etag = `"${createHash("sha256").update(csv).digest("hex")}"`;
  const headers: Record<string, string> = {
    "content-disposition": `attachment; filename="${specificationsCsvFileName(model.header.partNumber, summary.letter)}"`,
    "cache-control": releasedFileCaching(params.rev, summary.standing),
    etag,
    "x-benchfold-revision": summary.letter,
    "x-benchfold-standing": summary.standing,
  };
  if (matchesEtag(request, etag)) return new Response(null, { status: 304, headers });
  return new Response(csv, { headers: { ...headers, "content-type": "text/csv; charset=utf-8; header=present" } });
});
