import type { Metadata } from "next";
import { listDevices } from "@/lib/server/devices/list-devices";
import { DevicesView } from "@/components/devices/devices-view";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "Devices" };

export default async function DevicesPage() {
  const access = await requirePageUser({ permission: "device:read", path: "/devices" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="the device list" />;
  const devices = await listDevices(access.user.organizationId);
  return <DevicesView devices={devices} organizationName={access.user.organizationName} />;
}
