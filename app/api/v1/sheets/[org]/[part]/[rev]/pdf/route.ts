import { route } from "@/lib/server/auth/guard";
import { pdfBody } from "@/lib/server/pdf/pdf-body";
import { findReleasedPdf } from "@/lib/server/reviews/list-revisions";
import { sheetPdfFileName } from "@/lib/sheet/file-name";

export const dynamic = "force-dynamic";

/**
 * The stored PDF of a released revision: the same bytes on every download, the ETag their
 * SHA-256. A lettered revision never changes, so it is cached publicly for a year; "current"
 * names whichever revision is current now and is revalidated on every use.
 */
export const GET = route({ resource: "released-sheets" }, async ({ params, request }) => {
  const released = await findReleasedPdf({ organizationSlug: params.org, partNumber: params.part, revision: params.rev });
  const etag = `"${released.sha256}"`;
  const inline = new URL(request.url).searchParams.get("download") !== "1";
  const headers: Record<string, string> = {
    "content-disposition": `${inline ? "inline" : "attachment"}; filename="${sheetPdfFileName(params.part, released.letter)}"`,
    "cache-control": params.rev === "current" || released.standing === "withdrawn" ? "public, no-cache" : "public, max-age=31536000, immutable",
    etag,
    "x-benchfold-revision": released.letter,
    "x-benchfold-standing": released.standing,
  };
  const wanted = request.headers.get("if-none-match");
  if (wanted && wanted.split(",").some((tag) => tag.trim() === etag)) return new Response(null, { status: 304, headers });
  return new Response(pdfBody(released.pdf), { headers: { ...headers, "content-type": "application/pdf", "content-length": String(released.pdf.length) } });
});
