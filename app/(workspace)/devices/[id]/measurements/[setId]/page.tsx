import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { allows } from "@/lib/access/matrix";
import { loadForPage, requirePageUser } from "@/lib/server/auth/require-page-user";
import { getDevice } from "@/lib/server/devices/get-device";
import { getMeasurementSet } from "@/lib/server/measurements/get-measurement-set";
import { MeasurementSetView } from "@/components/measurements/measurement-set-view";
import { parseRecordId } from "@/lib/schemas/decimal";

type Props = { params: Promise<{ id: string; setId: string }> };

export const metadata: Metadata = { title: "Measurement set" };

export default async function MeasurementSetPage({ params }: Props) {
  const { id, setId } = await params;
  const user = await requirePageUser({ resource: "devices", path: `/devices/${id}/measurements/${setId}` });
  const deviceId = parseRecordId(id);
  const measurementSetId = parseRecordId(setId);
  if (deviceId === undefined || measurementSetId === undefined) notFound();
  // A set is addressed under its own device only: under another, it is not found.
  const [device, set] = await loadForPage(() =>
    Promise.all([getDevice({ viewer: user, deviceId }), getMeasurementSet({ viewer: user, setId: measurementSetId, deviceId })]),
  );
  return (
    <MeasurementSetView
      device={device}
      set={set}
      organizationName={user.organizationName}
      viewer={{ id: user.id, canReview: allows(user.role, "measurement-review") }}
    />
  );
}
