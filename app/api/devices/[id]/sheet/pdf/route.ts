import { route } from "@/lib/server/auth/guard";
import { renderSheetPdf } from "@/lib/server/pdf/render-sheet-pdf";
import { readIdParam } from "@/lib/server/route-params";
import { buildDeviceSheet } from "@/lib/server/sheets/build-device-sheet";
import { sheetPdfFileName } from "@/lib/sheet/file-name";

export const dynamic = "force-dynamic";

/** The draft PDF of a device's sheet, from the same sheet model as the web page. */
export const GET = route({ access: "device:read" }, async ({ user, params, request }) => {
  const model = await buildDeviceSheet({ organizationId: user.organizationId, deviceId: readIdParam(params.id, "device") });
  const pdf = await renderSheetPdf(model);
  const inline = new URL(request.url).searchParams.get("download") !== "1";
  const fileName = sheetPdfFileName(model.header.partNumber, model.header.revisionLabel);
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `${inline ? "inline" : "attachment"}; filename="${fileName}"`,
      "cache-control": "private, no-store",
      "x-content-type-options": "nosniff",
    },
  });
});
