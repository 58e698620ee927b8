import { route } from "@/lib/server/auth/guard";
import { findReleasedRevision, readRevisionPdf } from "@/lib/server/reviews/list-revisions";
import { sheetPdfFileName } from "@/lib/sheet/file-name";

export const dynamic = "force-dynamic";

/**
 * The stored PDF of a released revision: the same bytes on every download, the ETag their
 * SHA-256. A lettered revision never changes, so it is cached publicly for a year; "current"
 * names whichever revision is current now and is revalidated on every use.
 */
export const GET = route({ resource: "released-sheets" }, async ({ params, request }) => {
  const { summary } = await findReleasedRevision({ organizationSlug: params.org, partNumber: params.part, revision: params.rev });
  const etag = `"${summary.pdfSha256}"`;
  const inline = new URL(request.url).searchParams.get("download") !== "1";
  const partNumber = decodeURIComponent(params.part);
  const headers: Record<string, string> = {
    "content-disposition": `${inline ? "inline" : "attachment"}; filename="${sheetPdfFileName(partNumber, summary.letter)}"`,
    "cache-control": params.rev === "current" || summary.standing === "withdrawn" ? "public, no-cache" : "public, max-age=31536000, immutable",
    etag,
    "x-benchfold-revision": summary.letter,
    "x-benchfold-standing": summary.standing,
  };
  const wanted = request.headers.get("if-none-match");
  if (wanted && wanted.split(",").some((tag) => tag.trim() === etag)) return new Response(null, { status: 304, headers });
  const { pdf } = await readRevisionPdf(summary.id);
  return new Response(new Uint8Array(pdf), { headers: { ...headers, "content-type": "application/pdf", "content-length": String(pdf.length) } });
});
