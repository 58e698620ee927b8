import Link from "next/link";
import type { DevicePage } from "@/lib/domain/devices";
import { formatDate, formatNumber } from "@/lib/format";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { NumberQuantity, RangeQuantity } from "@/components/ui/quantity";
import { deviceClassLabels } from "@/lib/domain/device-classes";
import { PagedListTable, SortHeader } from "./device-list-controls";
import type { DeviceListQuery, DeviceSortKey } from "./device-list-query";
import { DeviceForm } from "./device-form";

function Range({ range }: { range?: { min: number; max: number } }) {
  if (!range) return <span className="text-ink-muted">—</span>;
  return <RangeQuantity {...range} unit="Hz" />;
}

type DevicesViewProps = { devicePage: DevicePage; organizationName: string; query: DeviceListQuery; canCreate: boolean };

export function DevicesView({ devicePage, organizationName, query, canCreate }: DevicesViewProps) {
  const { rows, total, page, pageCount, organizationTotal } = devicePage;
  return (
    <>
      <PageHeader
        runningHead={organizationName}
        title="Devices"
        lead="The parts your organization characterizes, with the conditions that identify each one. Only your organization sees this list."
        actions={
          canCreate ? (
            <a href="#new-device" className={buttonClass.secondary}>
              New device
            </a>
          ) : null
        }
      />
      {organizationTotal === 0 ? (
        <EmptyState title="No devices yet">
          <p>Devices your engineers register appear here, one row per part number.</p>
        </EmptyState>
      ) : (
        <PagedListTable
          query={query}
          basePath="/devices"
          total={total}
          page={page}
          pageCount={pageCount}
          noun={["device", "devices"]}
          sortWords={sortWords}
          testIdPrefix="devices"
          noMatchText="No device matches"
          tableLabel="Devices table"
          pagerLabel="Pages of the device list"
        >
          <thead>
            <tr>
              <SortHeader label="Part number" sortKey="part" query={query} basePath="/devices" />
              <SortHeader label="Class" sortKey="class" query={query} basePath="/devices" />
              <th scope="col">Title</th>
              <th scope="col">Input range</th>
              <th scope="col">Output range</th>
              <th scope="col" className="num">
                Drive
              </th>
              <SortHeader label="Updated" sortKey="updated" query={query} basePath="/devices" numeric />
            </tr>
          </thead>
          <tbody>
            {rows.map((device) => {
              const k = device.keyConditions;
              return (
                <tr key={device.id}>
                  <th scope="row" className="figure whitespace-nowrap font-semibold">
                    <Link href={`/devices/${device.id}`}>{device.partNumber}</Link>
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
                      <NumberQuantity value={k.driveLevelDbm} unit="dBm" signed />
                    )}
                  </td>
                  <td className="num whitespace-nowrap">
                    <span className="figure">{formatDate(device.updatedAt)}</span>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </PagedListTable>
      )}
      {canCreate ? (
        <section id="new-device" aria-labelledby="new-device-title" className="mt-14 max-w-3xl scroll-mt-8 border-t border-rule pt-8">
          <h2 id="new-device-title" className="mb-1 text-xl font-semibold">
            New device
          </h2>
          <p className="mb-6 text-ink-muted">
            Register a part by its number; measurement sets are uploaded on its page. Frequencies are entered with their unit and stored in hertz.
          </p>
          <DeviceForm />
        </section>
      ) : null}
    </>
  );
}

const sortWords: Record<DeviceSortKey, string> = { part: "part number", class: "class", updated: "last update" };
