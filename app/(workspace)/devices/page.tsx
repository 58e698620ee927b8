import type { Metadata } from "next";
import { can } from "@/lib/server/auth/permissions";
import { listDevices } from "@/lib/server/devices/list-devices";
import { readDeviceListQuery } from "@/components/devices/device-list-query";
import { DevicesView } from "@/components/devices/devices-view";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "Devices" };

export default async function DevicesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const access = await requirePageUser({ permission: "device:read", path: "/devices" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="the device list" />;
  const [devices, params] = await Promise.all([listDevices(access.user.organizationId), searchParams]);
  return (
    <DevicesView
      devices={devices}
      organizationName={access.user.organizationName}
      query={readDeviceListQuery(params)}
      canCreate={can(access.user.role, "device:write")}
    />
  );
}
