import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { isAppError } from "@/lib/errors";
import { can } from "@/lib/domain/permissions";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { getDevice } from "@/lib/server/devices/get-device";
import { listInstruments } from "@/lib/server/instruments/list-instruments";
import { listDeviceMeasurementSets } from "@/lib/server/measurements/list-device-measurement-sets";
import { DeviceView } from "@/components/devices/device-view";
import { parseRecordId } from "@/lib/schemas/decimal";

type Props = { params: Promise<{ id: string }> };

export const metadata: Metadata = { title: "Device" };

export default async function DevicePage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser({ permission: "device:read", path: `/devices/${id}` });
  const deviceId = parseRecordId(id);
  if (deviceId === undefined) notFound();
  const { organizationId } = user;
  const canUpload = can(user.role, "measurement:upload");
  try {
    const [device, sets, instruments] = await Promise.all([
      getDevice({ organizationId, deviceId }),
      listDeviceMeasurementSets({ organizationId, deviceId }),
      canUpload ? listInstruments(organizationId) : Promise.resolve([]),
    ]);
    return (
      <DeviceView
        device={device}
        organizationName={user.organizationName}
        sets={sets}
        upload={canUpload ? { instruments } : null}
        canEdit={can(user.role, "device:write")}
      />
    );
  } catch (error) {
    if (isAppError(error) && error.code === "not-found") notFound();
    throw error;
  }
}
