import type { DeviceSummary } from "@/lib/server/devices/list-devices";
import { formatDate, formatFrequencyRange, formatNumber } from "@/components/format-quantity";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { Quantity } from "@/components/ui/quantity";
import { deviceClassLabels } from "./device-class-label";

function Range({ range }: { range?: { min: number; max: number } }) {
  if (!range) return <span className="text-ink-muted">—</span>;
  const { value, unit } = formatFrequencyRange(range);
  return <Quantity value={value} unit={unit} />;
}

export function DevicesView({ devices, organizationName }: { devices: DeviceSummary[]; organizationName: string }) {
  return (
    <>
      <PageHeader
        runningHead={organizationName}
        title="Devices"
        lead="The parts your organization characterizes, with the conditions that identify each one. Only your organization sees this list."
      />
      {devices.length === 0 ? (
        <EmptyState title="No devices yet">
          <p>Devices your engineers register appear here, one row per part number.</p>
        </EmptyState>
      ) : (
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Devices table, scrolls sideways on narrow screens">
          <table className="sheet-table" data-testid="devices-table">
            <caption>
              <span className="figure">{devices.length}</span> {devices.length === 1 ? "device" : "devices"}, by part number
            </caption>
            <thead>
              <tr>
                <th scope="col">Part number</th>
                <th scope="col">Class</th>
                <th scope="col">Title</th>
                <th scope="col">Input range</th>
                <th scope="col">Output range</th>
                <th scope="col" className="num">
                  Drive
                </th>
                <th scope="col" className="num">
                  Updated
                </th>
              </tr>
            </thead>
            <tbody>
              {devices.map((device) => {
                const k = device.keyConditions;
                return (
                  <tr key={device.id}>
                    <th scope="row" className="figure whitespace-nowrap font-semibold">
                      {device.partNumber}
                    </th>
                    <td className="whitespace-nowrap">
                      {deviceClassLabels[device.deviceClass]}
                      {k.multiplicationFactor ? (
                        <span className="figure ml-1.5 text-ink-muted" title={`Multiplication factor ${k.multiplicationFactor}`}>
                          ×{formatNumber(k.multiplicationFactor)}
                        </span>
                      ) : null}
                    </td>
                    <td className="min-w-[16rem]">{device.title}</td>
                    <td className="whitespace-nowrap">
                      <Range range={k.inputFrequencyHz} />
                    </td>
                    <td className="whitespace-nowrap">
                      <Range range={k.outputFrequencyHz} />
                    </td>
                    <td className="num">
                      {k.driveLevelDbm === undefined ? (
                        <span className="text-ink-muted">—</span>
                      ) : (
                        <Quantity value={formatNumber(k.driveLevelDbm, { signed: true })} unit="dBm" />
                      )}
                    </td>
                    <td className="num whitespace-nowrap">
                      <span className="figure">{formatDate(device.updatedAt)}</span>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      <div className="mt-8 max-w-prose">
        <Notice>
          Measurement upload, column mapping and spec limits arrive in a later release. For now this list shows the parts and their
          identifying conditions only.
        </Notice>
      </div>
    </>
  );
}
