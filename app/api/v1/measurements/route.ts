import { AppError } from "@/lib/errors";
import { tokenRoute } from "@/lib/server/auth/guard";
import { authenticateBenchToken } from "@/lib/server/bench-tokens/authenticate-bench-token";
import { findDeviceByPartNumber } from "@/lib/server/devices/find-device-by-part-number";
import { ingestMeasurement } from "@/lib/server/measurements/ingest-measurement";
import { readUploadForm } from "@/lib/server/measurements/read-upload-form";
import { loadSetTables } from "@/lib/server/measurements/load-set-tables";
import type { BenchUploadResponse } from "@/lib/schemas/api-v1";

/**
 * Bench upload: `Authorization: Bearer <bench token>`, multipart with `file`, `device`
 * (the part number) and the same condition fields as the browser upload. No cookies,
 * so no cross-site risk; the token decides the organization.
 */
export const POST = tokenRoute(async (request) => {
  const { organizationId, tokenId } = await authenticateBenchToken(request);
  const { file, fields, extra } = await readUploadForm(request, ["device"]);
  const part = extra.device?.trim();
  if (!part) throw new AppError("invalid", "Name the device by its part number in a field named \"device\".", { field: "device" });
  const device = await findDeviceByPartNumber({ organizationId, partNumber: part });
  const set = await ingestMeasurement({ organizationId, deviceId: device.id, file, fields, actor: { kind: "bench-token", tokenId } });
  // Every value per frequency or drive step (S-parameter magnitude and phase, mismatch loss, dBm/Vrms/dBµV), beside the derived parameters.
  const tables = await loadSetTables({ organizationId, setId: set.id });
  return Response.json({ measurementSet: set, tables } satisfies BenchUploadResponse, { status: 201 });
});
