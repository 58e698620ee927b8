import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { ScrollTable } from "@/components/ui/scroll-table";
import { deviceListHref, type DeviceListQuery, type DeviceSortKey } from "./device-list-query";

/**
 * The search box, sortable column headers and pager of a list paged like the device list
 * (the device list at /devices, the sheets index at /sheets): the same query string, the same
 * controls, each pointing at its own `basePath`.
 */
type ListControlProps = { query: DeviceListQuery; basePath: string };

export function DeviceListSearch({ query, basePath, label, testId }: ListControlProps & { label: string; testId: string }) {
  const inputId = `${testId}-input`;
  return (
    <form method="get" action={basePath} role="search" className="mb-6 flex flex-wrap items-end gap-3" data-testid={testId}>
      <div className="min-w-[16rem] flex-1 space-y-1.5 sm:max-w-md">
        <label htmlFor={inputId} className="block text-[0.9375rem] font-semibold">
          {label}
        </label>
        <input id={inputId} name="q" type="search" defaultValue={query.q} className={selectClass} placeholder="e.g. C2611 or doubler" />
      </div>
      {query.sort !== "part" ? <input type="hidden" name="sort" value={query.sort} /> : null}
      {query.dir !== (query.sort === "updated" ? "desc" : "asc") ? <input type="hidden" name="dir" value={query.dir} /> : null}
      <button type="submit" className={buttonClass.secondary}>
        Search
      </button>
      {query.q ? (
        <Link href={deviceListHref(query, { q: "", page: 1 }, basePath)} className={buttonClass.quiet}>
          Clear search
        </Link>
      ) : null}
    </form>
  );
}

export function SortHeader({ label, sortKey, query, basePath, numeric }: ListControlProps & { label: string; sortKey: DeviceSortKey; numeric?: boolean }) {
  const active = query.sort === sortKey;
  const nextDir = active ? (query.dir === "asc" ? "desc" : "asc") : sortKey === "updated" ? "desc" : "asc";
  return (
    <th scope="col" className={numeric ? "num" : undefined} aria-sort={active ? (query.dir === "asc" ? "ascending" : "descending") : undefined}>
      <Link
        href={deviceListHref(query, { sort: sortKey, dir: nextDir, page: 1 }, basePath)}
        className={`no-underline hover:text-ink ${active ? "text-ink" : ""}`}
        aria-label={`Sort by ${label.toLowerCase()}${active ? `, now ${query.dir === "asc" ? "ascending" : "descending"}` : ""}`}
      >
        {label}
        <span aria-hidden="true" className="ml-1 inline-block w-2.5">
          {active ? (query.dir === "asc" ? "↑" : "↓") : ""}
        </span>
      </Link>
    </th>
  );
}

export function Pager({ query, basePath, page, pageCount, label, testId }: ListControlProps & { page: number; pageCount: number; label: string; testId: string }) {
  return (
    <nav aria-label={label} className="mt-5 flex items-center gap-5 text-[0.9375rem]" data-testid={testId}>
      {page > 1 ? (
        <Link href={deviceListHref(query, { page: page - 1 }, basePath)} rel="prev">
          ← Previous
        </Link>
      ) : (
        <span className="text-ink-muted">← Previous</span>
      )}
      <span className="text-ink-muted">
        Page <span className="figure text-ink">{page}</span> of <span className="figure text-ink">{pageCount}</span>
      </span>
      {page < pageCount ? (
        <Link href={deviceListHref(query, { page: page + 1 }, basePath)} rel="next">
          Next →
        </Link>
      ) : (
        <span className="text-ink-muted">Next →</span>
      )}
    </nav>
  );
}

type PagedListTableProps = ListControlProps & {
  /** `{ total, page, pageCount }` of the page shown. */
  total: number;
  page: number;
  pageCount: number;
  /** What one row is, as the caption counts it: ["device", "devices"]. */
  noun: [singular: string, plural: string];
  /** How the caption names each sort key ("by part number"). */
  sortWords: Record<DeviceSortKey, string>;
  /** Prefix of the test ids: `${testIdPrefix}-search`, `-no-match`, `-table`, `-pager`. */
  testIdPrefix: string;
  noMatchText: string;
  /** What the table holds, for screen readers ("Devices table"). */
  tableLabel: string;
  pagerLabel: string;
  /** The table's `<thead>` and `<tbody>`. */
  children: React.ReactNode;
};

/**
 * The body of a list paged like the device list: the search box, a "no match" line or the table
 * with its counting caption, and the pager. The caller gives the table's head and rows.
 */
export function PagedListTable({
  query,
  basePath,
  total,
  page,
  pageCount,
  noun,
  sortWords,
  testIdPrefix,
  noMatchText,
  tableLabel,
  pagerLabel,
  children,
}: PagedListTableProps) {
  return (
    <>
      <DeviceListSearch query={query} basePath={basePath} label="Search part number or title" testId={`${testIdPrefix}-search`} />
      {total === 0 ? (
        <p className="border-y border-rule py-4 text-ink-muted" data-testid={`${testIdPrefix}-no-match`}>
          {noMatchText} “{query.q}”.
        </p>
      ) : (
        <ScrollTable label={tableLabel} testId={`${testIdPrefix}-table`}>
          <caption>
            <span className="figure">{total}</span> {total === 1 ? noun[0] : noun[1]}
            {query.q ? <> matching “{query.q}”</> : null}, by {sortWords[query.sort]}
            {query.dir === "desc" ? " (descending)" : ""}
            {pageCount > 1 ? (
              <>
                {" "}
                · page <span className="figure">{page}</span> of <span className="figure">{pageCount}</span>
              </>
            ) : null}
          </caption>
          {children}
        </ScrollTable>
      )}
      {pageCount > 1 ? <Pager query={query} basePath={basePath} page={page} pageCount={pageCount} label={pagerLabel} testId={`${testIdPrefix}-pager`} /> : null}
    </>
  );
}
