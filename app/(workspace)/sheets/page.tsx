import type { Metadata } from "next";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { NotBuiltView } from "@/components/workspace/not-built-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "Sheets" };

export default async function SheetsPage() {
  const access = await requirePageUser({ permission: "sheet:write", path: "/sheets" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="datasheet drafts" />;
  return (
    <NotBuiltView
      runningHead={access.user.organizationName}
      title="Sheets"
      lead="Draft datasheets: conditions, min/typ/max tables backed by the measurements, typical curves and the prose around them."
      emptyTitle="Sheets are not built yet"
    >
      <p>Writing a sheet needs measurement sets to draw from, and uploading them arrives in a later release.</p>
      <p>Until then, your devices and their identifying conditions are on the Devices page.</p>
    </NotBuiltView>
  );
}
