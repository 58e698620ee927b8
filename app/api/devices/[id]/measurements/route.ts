import { route } from "@/lib/server/auth/guard";
import { ingestMeasurement } from "@/lib/server/measurements/ingest-measurement";
import { listDeviceMeasurementSets } from "@/lib/server/measurements/list-device-measurement-sets";
import { readUploadForm } from "@/lib/server/measurements/read-upload-form";
import { readIdParam } from "@/lib/server/route-params";

export const GET = route({ resource: "devices" }, async ({ user, params }) => ({
  measurementSets: await listDeviceMeasurementSets({ viewer: user, deviceId: readIdParam(params.id, "device") }),
}));

export const POST = route({ resource: "measurement-upload" }, async ({ user, params, request }) => {
  const deviceId = readIdParam(params.id, "device");
  const { file, fields } = await readUploadForm(request);
  const set = await ingestMeasurement({ organizationId: user.organizationId, deviceId, file, fields, actor: { kind: "user", userId: user.id } });
  return Response.json({ measurementSet: set }, { status: 201 });
});
