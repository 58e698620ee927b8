import type { DeviceSummary } from "@/lib/domain/devices";
import type { MeasurementSetDetail } from "@/lib/domain/measurements";
import { formatDate } from "@/lib/format";
import { PageHeader } from "@/components/ui/page-header";
import { kindLabel } from "@/lib/domain/measurements";
import {
  ConditionsList,
  RawFileFacts,
  SetBreadcrumb,
  SetCurves,
  SetHistory,
  SetInstruments,
  SetReview,
  SetStatusNotices,
  SetWarnings,
} from "./measurement-set-sections";
import { ParametersTable } from "./set-parameters-table";
import { SetValueTables } from "./set-value-tables";
import { StateBadge } from "./state-badge";

type MeasurementSetViewProps = {
  device: DeviceSummary;
  set: MeasurementSetDetail;
  organizationName: string;
  viewer: { id: number; canReview: boolean };
};

export function MeasurementSetView({ device, set, organizationName, viewer }: MeasurementSetViewProps) {
  return (
    <>
      <SetBreadcrumb device={device} set={set} />
      <PageHeader
        runningHead={`${organizationName} · ${device.partNumber}`}
        title={`${kindLabel(set.kind)} · set #${set.id}`}
        actions={<StateBadge state={set.state} />}
        lead={<SetLead set={set} />}
      />

      <SetStatusNotices device={device} set={set} />

      <SetReview set={set} viewer={viewer} />

      <section aria-labelledby="conditions-title" className="mb-10">
        <h2 id="conditions-title" className="mb-3 text-xl font-semibold">
          Conditions
        </h2>
        <ConditionsList set={set} />
      </section>

      <div className="mb-12 grid gap-x-12 gap-y-10 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <section aria-labelledby="parameters-title">
          <h2 id="parameters-title" className="mb-3 text-xl font-semibold">
            Derived parameters
          </h2>
          <ParametersTable parameters={set.parameters} />
        </section>
        <SetCurves set={set} />
      </div>

      <SetValueTables tables={set.tables} />

      <div className="grid gap-x-12 gap-y-10 lg:grid-cols-2">
        <section aria-labelledby="warnings-title">
          <SetWarnings warnings={set.warnings} />
          <SetInstruments instruments={set.instruments} />
        </section>

        <section aria-labelledby="history-title">
          <h2 id="history-title" className="mb-3 text-xl font-semibold">
            History
          </h2>
          <SetHistory device={device} set={set} />
          <RawFileFacts set={set} />
        </section>
      </div>
    </>
  );
}

/** File, serial, lot and date under the title. */
function SetLead({ set }: { set: MeasurementSetDetail }) {
  return (
    <p>
      <span className="figure text-ink">{set.fileName}</span> · serial <span className="figure text-ink">{set.conditions.serial ?? "—"}</span>
      {set.conditions.lot ? (
        <>
          {" "}
          · lot <span className="figure text-ink">{set.conditions.lot}</span>
        </>
      ) : null}
      {set.measuredOn ? (
        <>
          {" "}
          · measured <span className="figure text-ink">{formatDate(set.measuredOn)}</span>
        </>
      ) : null}
    </p>
  );
}
