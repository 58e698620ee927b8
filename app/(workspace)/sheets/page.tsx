import type { Metadata } from "next";
import { allows } from "@/lib/access/matrix";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { findSheetPage } from "@/lib/server/sheets/find-sheet-page";
import { readDeviceListQuery } from "@/components/devices/device-list-query";
import { SheetsIndexView } from "@/components/sheets/sheets-index-view";

export const metadata: Metadata = { title: "Sheets" };

export default async function SheetsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser({ resource: "sheet-drafts", path: "/sheets" });
  const query = readDeviceListQuery(await searchParams);
  const sheetPage = await findSheetPage(user, query);
  return <SheetsIndexView sheetPage={sheetPage} query={query} organizationName={user.organizationName} canEdit={allows(user.role, "sheet-edit")} />;
}
