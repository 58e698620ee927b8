import type { Metadata } from "next";
import { listInstruments } from "@/lib/server/instruments/list-instruments";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { InstrumentsView } from "@/components/admin/instruments-view";

export const metadata: Metadata = { title: "Instruments" };

export default async function InstrumentsPage() {
  const user = await requirePageUser({ resource: "instrument-admin", path: "/admin/instruments" });
  const instruments = await listInstruments(user.organizationId);
  return <InstrumentsView organizationName={user.organizationName} instruments={instruments} />;
}
