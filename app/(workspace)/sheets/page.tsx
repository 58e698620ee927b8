import type { Metadata } from "next";
import { listDevices } from "@/lib/server/devices/list-devices";
import { buildDeviceSheet } from "@/lib/server/sheets/build-device-sheet";
import { can, sheetDraftReaders } from "@/lib/domain/permissions";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { SheetsIndexView } from "@/components/sheets/sheets-index-view";

export const metadata: Metadata = { title: "Sheets" };

export default async function SheetsPage() {
  const user = await requirePageUser({ permission: sheetDraftReaders, path: "/sheets" });
  const { organizationId, organizationName } = user;
  const devices = await listDevices(organizationId);
  return (
    <SheetsIndexView
      devices={devices}
      loadDraft={(deviceId) => buildDeviceSheet({ organizationId, deviceId })}
      organizationName={organizationName}
      canEdit={can(user.role, "sheet:write")}
    />
  );
}
