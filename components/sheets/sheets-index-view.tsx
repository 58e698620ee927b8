import Link from "next/link";
import { deviceClassLabels } from "@/lib/domain/device-classes";
import type { DeviceListQuery, DeviceSortKey } from "@/lib/domain/devices";
import { candidateStateLabels } from "@/lib/domain/reviews";
import type { SheetPage, SheetSummary } from "@/lib/domain/sheets";
import { PagedListTable, SortHeader } from "@/components/devices/device-list-controls";
import { formatDate } from "@/lib/format";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";

type SheetsIndexViewProps = { sheetPage: SheetPage; query: DeviceListQuery; organizationName: string; canEdit: boolean };

const basePath = "/sheets";
const sortWords: Record<DeviceSortKey, string> = { part: "part number", class: "class", updated: "last change" };

/**
 * The organization's draft sheets, one row per device, searched, sorted and paged like the device
 * list. Every figure is a count the database gives; what only the built draft knows (flagged
 * groups, open issues) is on the draft's own page.
 */
export function SheetsIndexView({ sheetPage, query, organizationName, canEdit }: SheetsIndexViewProps) {
  const { rows, total, page, pageCount, organizationTotal } = sheetPage;
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
      {organizationTotal === 0 ? (
        <EmptyState title="No devices yet" testId="sheets-empty">
          <p>A sheet belongs to a device. Once a device is registered and its measurement sets approved, its draft sheet appears here.</p>
        </EmptyState>
      ) : (
        <PagedListTable
          query={query}
          basePath={basePath}
          total={total}
          page={page}
          pageCount={pageCount}
          noun={["draft", "drafts"]}
          sortWords={sortWords}
          testIdPrefix="sheets"
          noMatchText="No sheet matches"
          tableLabel="Draft sheets table"
          pagerLabel="Pages of the sheets index"
        >
          <thead>
            <tr>
              <SortHeader label="Part number" sortKey="part" query={query} basePath={basePath} />
              <SortHeader label="Class" sortKey="class" query={query} basePath={basePath} />
              <th scope="col">Title</th>
              <th scope="col">Sheet</th>
              <th scope="col" className="num">
                Approved sets
              </th>
              <th scope="col" className="num">
                Units
              </th>
              <th scope="col" className="num">
                Awaiting review
              </th>
              <th scope="col" className="num">
                Limits set
              </th>
              <SortHeader label="Last change" sortKey="updated" query={query} basePath={basePath} numeric />
            </tr>
          </thead>
          <tbody>
            {rows.map((sheet) => (
              <tr key={sheet.deviceId} data-testid={`sheet-row-${sheet.partNumber}`}>
                <th scope="row" className="figure whitespace-nowrap font-semibold">
                  <Link href={`/sheets/${sheet.deviceId}`}>{sheet.partNumber}</Link>
                </th>
                <td className="whitespace-nowrap">{deviceClassLabels[sheet.deviceClass]}</td>
                <td className="min-w-[14rem]">{sheet.title}</td>
                <td className="whitespace-nowrap" data-testid="sheet-standing">
                  {sheetStanding(sheet)}
                </td>
                <Count value={sheet.approvedSetCount} testId="approved-sets" />
                <Count value={sheet.unitCount} testId="units" />
                <Count value={sheet.awaitingReviewCount} testId="awaiting-review" strong />
                <Count value={sheet.limitCount} testId="limits-set" />
                <td className="num whitespace-nowrap" data-testid="last-change">
                  <span className="figure">{formatDate(sheet.lastChangeAt)}</span>
                </td>
              </tr>
            ))}
          </tbody>
        </PagedListTable>
      )}
      <p className="mt-4 max-w-prose text-sm text-ink-muted">
        Units are the distinct serials among the approved sets. Limits set counts the spec limits stated on the device. Whether the data support
        those limits, and what a reviewer must see before approving, is worked out on each draft’s page.
      </p>
    </>
  );
}

/** Where the sheet stands, in words: its open review, if any, and its newest revision. */
function sheetStanding(sheet: SheetSummary): string {
  const released = sheet.latestRevision ? `Rev. ${sheet.latestRevision} released` : "Not released";
  return sheet.reviewState ? `${candidateStateLabels[sheet.reviewState]} · ${released}` : released;
}

function Count({ value, testId, strong }: { value: number; testId: string; strong?: boolean }) {
  return (
    <td className="num figure" data-testid={testId}>
      {value === 0 ? <span className="text-ink-muted">0</span> : strong ? <span className="font-semibold">{value}</span> : value}
    </td>
  );
}
