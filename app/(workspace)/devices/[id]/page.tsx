import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { allows } from "@/lib/access/matrix";
import { loadForPage, requirePageUser } from "@/lib/server/auth/require-page-user";
import { getDevice } from "@/lib/server/devices/get-device";
import { listInstruments } from "@/lib/server/instruments/list-instruments";
import { listDeviceMeasurementSets } from "@/lib/server/measurements/list-device-measurement-sets";
import { findDeviceReview } from "@/lib/server/reviews/list-pending-candidates";
import { listDeviceRevisions } from "@/lib/server/reviews/list-revisions";
import { getConformityWatch } from "@/lib/server/conformity/get-conformity-watch";
import { DeviceView } from "@/components/devices/device-view";
import { parseRecordId } from "@/lib/schemas/decimal";

type Props = { params: Promise<{ id: string }> };

export const metadata: Metadata = { title: "Device" };

export default async function DevicePage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser({ resource: "devices", path: `/devices/${id}` });
  const deviceId = parseRecordId(id);
  if (deviceId === undefined) notFound();
  // What the page offers is what the API would accept from this role.
  const canUpload = allows(user.role, "measurement-upload");
  const readsCandidates = allows(user.role, "sheet-comments");
  const watchesConformity = allows(user.role, "conformity");
  const [device, sets, instruments, revisions, review, conformity] = await loadForPage(() =>
    Promise.all([
      getDevice({ viewer: user, deviceId }),
      listDeviceMeasurementSets({ viewer: user, deviceId }),
      canUpload ? listInstruments(user.organizationId) : Promise.resolve([]),
      listDeviceRevisions({ viewer: user, deviceId }),
      readsCandidates ? findDeviceReview({ viewer: user, deviceId }) : Promise.resolve(null),
      watchesConformity ? getConformityWatch({ viewer: user, deviceId }) : Promise.resolve(null),
    ]),
  );
  return (
    <DeviceView
      device={device}
      organizationName={user.organizationName}
      sets={sets}
      revisions={revisions}
      sheetHref={allows(user.role, "sheet-drafts") ? `/sheets/${deviceId}` : null}
      review={review}
      conformity={conformity ? { watch: conformity, canClose: allows(user.role, "conformity-close") } : null}
      canWithdraw={allows(user.role, "revision-withdrawal")}
      upload={canUpload ? { instruments } : null}
      canEdit={allows(user.role, "device-edit")}
    />
  );
}
