import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { matchesEtag, releasedFileCaching } from "@/lib/server/reviews/released-caching";
import { readReleasedTouchstone } from "@/lib/server/reviews/released-files";
import { attachmentDisposition } from "@/lib/sheet/file-name";

export const dynamic = "force-dynamic";

/**
 * The raw bytes, exactly as uploaded, of one Touchstone set a released revision rests on (its frozen
 * model's traceability names it), named "<part>_rev<letter>_<serial>_<temperature>.sNp". A set the
 * revision does not rest on, however it stands in the workspace, is not found. The ETag is the file's
 * SHA-256; caching as for the revision's PDF.
 */
export const GET = route({ resource: "released-sheets" }, async ({ params, request }) => {
  const setId = readIdParam(params.setId, "Touchstone file behind this released sheet");
  const { head, file, bytes } = await readReleasedTouchstone({ organizationSlug: params.org, partNumber: params.part, revision: params.rev, setId });
  const etag = `"${file.sha256}"`;
  const headers: Record<string, string> = {
    "content-disposition": attachmentDisposition(file.fileName),
    "cache-control": releasedFileCaching(params.rev, head.standing),
    etag,
    "x-benchfold-revision": head.letter,
    "x-benchfold-standing": head.standing,
  };
  if (matchesEtag(request, etag)) return new Response(null, { status: 304, headers });
  return new Response(new Uint8Array(bytes), { headers: { ...headers, "content-type": "application/octet-stream", "content-length": String(bytes.length) } });
});
