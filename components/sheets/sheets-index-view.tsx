import Link from "next/link";
import { Suspense } from "react";
import type { DeviceSummary } from "@/lib/domain/devices";
import type { SheetModel } from "@/lib/sheet/types";
import { deviceClassLabels } from "@/lib/domain/device-classes";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";

type SheetsIndexViewProps = {
  devices: DeviceSummary[];
  /** Builds one device's draft model on the server (the page passes lib/server's buildDeviceSheet). */
  loadDraft: (deviceId: number) => Promise<SheetModel>;
  organizationName: string;
  canEdit: boolean;
};

/** Every device of the organization with the state of its draft sheet; each count streams in as its model is built. */
export function SheetsIndexView({ devices, loadDraft, organizationName, canEdit }: SheetsIndexViewProps) {
  return (
    <>
      <PageHeader
        runningHead={organizationName}
        title="Sheets"
        lead={
          canEdit
            ? "Draft datasheets built from each device’s approved measurement sets. Open one to set its limits, write its prose and preview the web page and the PDF."
            : "Draft datasheets built from each device’s approved measurement sets. You can read each draft and the data behind its figures; engineers edit them."
        }
      />
      {devices.length === 0 ? (
        <EmptyState title="No devices yet" testId="sheets-empty">
          <p>A sheet belongs to a device. Once a device is registered and its measurement sets approved, its draft sheet appears here.</p>
        </EmptyState>
      ) : (
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Draft sheets table, scrolls sideways on narrow screens">
          <table className="sheet-table" data-testid="sheets-table">
            <caption>
              <span className="figure">{devices.length}</span> {devices.length === 1 ? "device" : "devices"}, by part number. Counts are
              computed from the draft as it stands now.
            </caption>
            <thead>
              <tr>
                <th scope="col">Part number</th>
                <th scope="col">Class</th>
                <th scope="col">Title</th>
                <th scope="col" className="num">
                  Approved sets
                </th>
                <th scope="col" className="num">
                  Spec rows
                </th>
                <th scope="col" className="num">
                  Flagged groups
                </th>
                <th scope="col" className="num">
                  Open issues
                </th>
              </tr>
            </thead>
            <tbody>
              {devices.map((device) => (
                <tr key={device.id} data-testid={`sheet-row-${device.partNumber}`}>
                  <th scope="row" className="figure whitespace-nowrap font-semibold">
                    <Link href={`/sheets/${device.id}`}>{device.partNumber}</Link>
                  </th>
                  <td className="whitespace-nowrap">{deviceClassLabels[device.deviceClass]}</td>
                  <td className="min-w-[14rem]">{device.title}</td>
                  <Suspense fallback={<PendingCells />}>
                    <SheetStatusCells loadDraft={loadDraft} deviceId={device.id} />
                  </Suspense>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <p className="mt-4 max-w-prose text-sm text-ink-muted">
        A flagged group is a parameter under one set of conditions whose stated limit the data do not support (Cpk below the organization’s
        threshold, or a unit outside the guard-banded limit). Open issues are what a reviewer must see before approving.
      </p>
    </>
  );
}

function PendingCells() {
  return (
    <td colSpan={4} className="num text-sm text-ink-muted">
      <span aria-live="polite">building draft…</span>
    </td>
  );
}

async function SheetStatusCells({ loadDraft, deviceId }: { loadDraft: SheetsIndexViewProps["loadDraft"]; deviceId: number }) {
  let model;
  try {
    model = await loadDraft(deviceId);
  } catch (error) {
    return (
      <td colSpan={4} className="num text-sm text-signal-deep">
        The draft could not be built: {error instanceof Error ? error.message : "unknown error"}
      </td>
    );
  }
  const sets = model.traceability.measurementSets.length;
  const flagged = model.statistics.flaggedGroupCount;
  const issues = model.issues.length;
  return (
    <>
      <td className="num figure" data-testid="approved-sets">
        {sets === 0 ? <span className="text-ink-muted">0</span> : sets}
      </td>
      <td className="num figure" data-testid="spec-rows">
        {model.specifications.rows.length}
      </td>
      <td className="num figure" data-testid="flagged-groups">
        {flagged > 0 ? <span className="font-semibold text-signal-deep">{flagged}</span> : flagged}
      </td>
      <td className="num figure" data-testid="open-issues">
        {issues > 0 ? <span className="font-semibold">{issues}</span> : <span className="text-ink-muted">0</span>}
      </td>
    </>
  );
}
