import { route } from "@/lib/server/auth/guard";
import { matchesEtag, releasedFileCaching } from "@/lib/server/reviews/released-caching";
import { readReleasedMedianTouchstone } from "@/lib/server/reviews/released-files";
import { attachmentDisposition } from "@/lib/sheet/file-name";

export const dynamic = "force-dynamic";

/**
 * The median unit of a released revision's Touchstone sets of one condition ("25C-s4p": temperature
 * and port count), written by the engine as Touchstone 1.1 in dB and degrees and named
 * "<part>_rev<letter>_median-of-<n>_<temperature>.sNp". Offered where two or more units were measured.
 * The ETag is the SHA-256 of the text; caching as for the revision's PDF.
 */
export const GET = route({ resource: "released-sheets" }, async ({ params, request }) => {
  const { head, group, text, sha256 } = await readReleasedMedianTouchstone({ organizationSlug: params.org, partNumber: params.part, revision: params.rev, groupId: params.group });
  const etag = `"${sha256}"`;
  const headers: Record<string, string> = {
    "content-disposition": attachmentDisposition(group.fileName),
    "cache-control": releasedFileCaching(params.rev, head.standing),
    etag,
    "x-benchfold-revision": head.letter,
    "x-benchfold-standing": head.standing,
  };
  if (matchesEtag(request, etag)) return new Response(null, { status: 304, headers });
  return new Response(text, { headers: { ...headers, "content-type": "application/octet-stream" } });
});
