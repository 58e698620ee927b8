import type { Metadata } from "next";
import { listInstruments } from "@/lib/server/instruments/list-instruments";
import { InstrumentsView } from "@/components/admin/instruments-view";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "Instruments" };

export default async function InstrumentsPage() {
  const access = await requirePageUser({ permission: "instrument:manage", path: "/admin/instruments" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="the instrument list" />;
  const instruments = await listInstruments(access.user.organizationId);
  return <InstrumentsView organizationName={access.user.organizationName} instruments={instruments} />;
}
