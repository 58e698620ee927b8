import { route } from "@/lib/server/auth/guard";
import { pdfBody } from "@/lib/server/pdf/pdf-body";
import { sheetModelDigest, sheetPdfFor } from "@/lib/server/pdf/sheet-pdf-cache";
import { readIdParam } from "@/lib/server/route-params";
import { buildDraftSheet } from "@/lib/server/sheets/load-draft-sheet";
import { sheetPdfFileName } from "@/lib/sheet/file-name";

export const dynamic = "force-dynamic";

/**
 * The draft PDF of a device's sheet, from the same sheet model as the web page. The model's
 * digest is the ETag (weak: the bytes carry their creation time), so an unchanged draft
 * answers 304 and the browser keeps its copy.
 */
export const GET = route({ resource: "sheet-drafts" }, async ({ user, params, request }) => {
  const model = await buildDraftSheet(user, readIdParam(params.id, "device"));
  const digest = sheetModelDigest(model);
  const etag = `W/"${digest}"`;
  const inline = new URL(request.url).searchParams.get("download") !== "1";
  const fileName = sheetPdfFileName(model.header.partNumber, model.header.revisionLabel);
  const headers = {
    "content-disposition": `${inline ? "inline" : "attachment"}; filename="${fileName}"`,
    "cache-control": "private, no-cache",
    etag,
    "x-content-type-options": "nosniff",
  };
  const wanted = request.headers.get("if-none-match");
  if (wanted && wanted.split(",").some((tag) => tag.trim() === etag)) return new Response(null, { status: 304, headers });
  const pdf = await sheetPdfFor(model, digest);
  return new Response(pdfBody(pdf), { headers: { ...headers, "content-type": "application/pdf", "content-length": String(pdf.length) } });
});
