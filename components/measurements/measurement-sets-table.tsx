import type { MeasurementSetSummary } from "@/lib/domain/measurements";
import { NumberQuantity } from "@/components/ui/quantity";
import { kindLabel } from "@/lib/domain/measurements";
import { StateBadge } from "./state-badge";
import { ScrollTable } from "@/components/ui/scroll-table";
import { SetFileCell, SetLink, SetUploadedCell } from "./set-cells";

/** Every set of one device, newest first: what was measured, on which unit, and where it stands. */
export function MeasurementSetsTable({ deviceId, sets }: { deviceId: number; sets: MeasurementSetSummary[] }) {
  return (
    <ScrollTable label="Measurement sets" testId="measurement-sets-table">
      <caption>
        <span className="figure">{sets.length}</span> {sets.length === 1 ? "measurement set" : "measurement sets"}, newest first
      </caption>
      <thead>
        <tr>
          <th scope="col">Set</th>
          <th scope="col">Kind</th>
          <th scope="col">File</th>
          <th scope="col">Serial</th>
          <th scope="col">Lot</th>
          <th scope="col" className="num">
            Temp.
          </th>
          <th scope="col">State</th>
          <th scope="col">Uploaded</th>
          <th scope="col" className="num">
            Warnings
          </th>
          <th scope="col">Instruments</th>
        </tr>
      </thead>
      <tbody>
        {sets.map((set) => (
          <tr key={set.id} data-testid={`set-row-${set.id}`}>
            <th scope="row" className="whitespace-nowrap">
              <SetLink deviceId={deviceId} setId={set.id} />
              {set.supersededById ? <span className="ml-1.5 text-sm text-ink-muted">superseded</span> : null}
            </th>
            <td className="whitespace-nowrap">{kindLabel(set.kind)}</td>
            <SetFileCell fileName={set.fileName} maxWidthClass="max-w-[16rem]" />
            <td className="figure whitespace-nowrap">{set.conditions.serial ?? "—"}</td>
            <td className="figure whitespace-nowrap">{set.conditions.lot ?? <span className="text-ink-muted">—</span>}</td>
            <td className="num">
              {set.conditions.temperatureC === undefined ? (
                <span className="text-ink-muted">—</span>
              ) : (
                <NumberQuantity value={set.conditions.temperatureC} unit="°C" />
              )}
            </td>
            <td>
              <StateBadge state={set.state} />
            </td>
            <SetUploadedCell set={set} />
            <td className="num">
              {set.warnings.length === 0 ? (
                <span className="figure text-ink-muted">0</span>
              ) : (
                <span className="figure font-semibold text-signal-deep" title={set.warnings.join("\n")}>
                  {set.warnings.length}
                </span>
              )}
            </td>
            <td className="text-[0.875rem]">
              {set.instruments.length === 0 ? (
                <span className="text-ink-muted">none stated</span>
              ) : (
                <ul>
                  {set.instruments.map((i) => (
                    <li key={i.id} className="whitespace-nowrap">
                      {i.model} <span className="figure text-ink-muted">{i.serial}</span>
                      {i.calibrationLapsed ? <span className="ml-1.5 font-semibold text-signal-deep">· calibration lapsed</span> : null}
                    </li>
                  ))}
                </ul>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </ScrollTable>
  );
}
