import type { InstrumentSummary } from "@/lib/domain/instruments";
import { PageHeader } from "@/components/ui/page-header";
import { InstrumentsPanel } from "./instruments-panel";

export function InstrumentsView({ organizationName, instruments }: { organizationName: string; instruments: InstrumentSummary[] }) {
  return (
    <>
      <PageHeader
        runningHead={organizationName}
        title="Instruments"
        lead="The analyzers, meters and sources your benches measure with, their calibration dates and stated uncertainty."
      />
      <InstrumentsPanel initialInstruments={instruments} />
    </>
  );
}
