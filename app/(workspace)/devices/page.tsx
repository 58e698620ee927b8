import type { Metadata } from "next";
import { can } from "@/lib/server/auth/permissions";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { listDevices } from "@/lib/server/devices/list-devices";
import { readDeviceListQuery } from "@/components/devices/device-list-query";
import { DevicesView } from "@/components/devices/devices-view";

export const metadata: Metadata = { title: "Devices" };

export default async function DevicesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser({ permission: "device:read", path: "/devices" });
  const [devices, params] = await Promise.all([listDevices(user.organizationId), searchParams]);
  return (
    <DevicesView
      devices={devices}
      organizationName={user.organizationName}
      query={readDeviceListQuery(params)}
      canCreate={can(user.role, "device:write")}
    />
  );
}
