import type { Metadata } from "next";
import { allows } from "@/lib/access/matrix";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { findDevicePage } from "@/lib/server/devices/find-device-page";
import { readDeviceListQuery } from "@/components/devices/device-list-query";
import { DevicesView } from "@/components/devices/devices-view";

export const metadata: Metadata = { title: "Devices" };

export default async function DevicesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser({ resource: "devices", path: "/devices" });
  const query = readDeviceListQuery(await searchParams);
  const devicePage = await findDevicePage(user, query);
  return (
    <DevicesView
      devicePage={devicePage}
      organizationName={user.organizationName}
      query={query}
      canCreate={allows(user.role, "device-edit")}
    />
  );
}
