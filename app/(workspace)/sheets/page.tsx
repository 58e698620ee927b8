import type { Metadata } from "next";
import { listDevices } from "@/lib/server/devices/list-devices";
import { requireSheetReader } from "@/components/sheets/require-sheet-reader";
import { SheetsIndexView } from "@/components/sheets/sheets-index-view";
import { ForbiddenView } from "@/components/workspace/forbidden-view";

export const metadata: Metadata = { title: "Sheets" };

export default async function SheetsPage() {
  const access = await requireSheetReader("/sheets");
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="datasheet drafts" />;
  const { organizationId, organizationName } = access.user;
  const devices = await listDevices(organizationId);
  return <SheetsIndexView devices={devices} organizationId={organizationId} organizationName={organizationName} canEdit={access.canEdit} />;
}
