import { route } from "@/lib/server/auth/guard";
import { readMeasurementSetFile } from "@/lib/server/measurements/read-measurement-set-file";
import { readIdParam } from "@/lib/server/route-params";
import { attachmentDisposition } from "@/lib/sheet/file-name";

export const dynamic = "force-dynamic";

/**
 * A measurement set's raw file as uploaded, under its uploaded name, for whoever may read the set's
 * page (resource `devices`); private, never stored by a shared cache.
 */
export const GET = route({ resource: "devices" }, async ({ user, params }) => {
  const file = await readMeasurementSetFile({ viewer: user, setId: readIdParam(params.id, "measurement set") });
  return new Response(new Uint8Array(file.bytes), {
    headers: {
      "content-type": "application/octet-stream",
      "content-length": String(file.bytes.length),
      "content-disposition": attachmentDisposition(file.fileName),
      "cache-control": "private, no-store",
      etag: `"${file.sha256}"`,
    },
  });
});
