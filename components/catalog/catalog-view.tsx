import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { NumberQuantity, RangeQuantity } from "@/components/ui/quantity";
import { ScrollTable } from "@/components/ui/scroll-table";
import { catalogParameters, conditionText, serializeCatalogQuery, type CatalogQuery, type CatalogQueryIssue, type CatalogSortKey } from "@/lib/catalog/catalog-query";
import { catalogKeyColumns, keyColumnHead } from "@/lib/catalog/key-columns";
import type { CatalogFacet, CatalogHit, CatalogResult } from "@/lib/catalog/types";
import { deviceClasses, deviceClassLabels } from "@/lib/domain/device-classes";
import { formatDate } from "@/lib/format";

type CatalogViewProps = {
  query: CatalogQuery;
  /** What the visitor typed, kept in the form when it could not be read. */
  typed: { q: string; class: string; org: string; covers: string; f: string[] };
  result: CatalogResult | null;
  issues: CatalogQueryIssue[];
};

const CONDITION_FIELDS = 3;

function href(query: CatalogQuery, change: Partial<CatalogQuery>): string {
  const qs = serializeCatalogQuery({ ...query, page: 1, ...change });
  return qs ? `/catalog?${qs}` : "/catalog";
}

/**
 * The public catalog: conditions typed as an engineer writes them, the counts per class and
 * organization for the query, and a dense table of the current released revisions with the class's
 * key figures. Everything is a link or a GET form, so a search is an address to share.
 */
export function CatalogView({ query, typed, result, issues }: CatalogViewProps) {
  return (
    <>
      <PageHeader
        runningHead="Public catalog"
        title="Released datasheets"
        lead="Every sheet an organization has reviewed and released, open to anyone. Search by what a part must do; each row links to the released sheet, fixed as it was signed."
      />
      <CatalogSearchForm typed={typed} query={query} organizations={result?.facets.organization ?? []} />
      {issues.length ? (
        <div className="mb-6 space-y-2" data-testid="catalog-issues">
          {issues.map((issue) => (
            <Notice key={`${issue.field}:${issue.message}`} tone="error">
              <span className="font-semibold">{issue.field}</span>: {issue.message}
            </Notice>
          ))}
        </div>
      ) : null}
      {result ? (
        <div className="grid gap-8 lg:grid-cols-[13rem_1fr]">
          <aside aria-label="Narrow the results" className="space-y-6 text-[0.9375rem]" data-testid="catalog-facets">
            <FacetList title="Device class" facets={result.facets.deviceClass} selected={query.deviceClass} hrefFor={(value) => href(query, { deviceClass: value as CatalogQuery["deviceClass"] })} clearHref={href(query, { deviceClass: null })} />
            <FacetList title="Organization" facets={result.facets.organization} selected={query.organization} hrefFor={(value) => href(query, { organization: value })} clearHref={href(query, { organization: null })} />
          </aside>
          <section aria-labelledby="catalog-results-title" className="min-w-0">
            <h2 id="catalog-results-title" className="mb-3 text-lg font-semibold" data-testid="catalog-total">
              <span className="figure">{result.total}</span> {result.total === 1 ? "sheet" : "sheets"}
              {query.revisions === "current" ? ", current revisions" : ", every revision"}
            </h2>
            {result.hits.length ? <CatalogTable query={query} result={result} /> : <NoHits />}
            <CatalogPager query={query} result={result} />
          </section>
        </div>
      ) : null}
    </>
  );
}

function CatalogSearchForm({ typed, query, organizations }: { typed: CatalogViewProps["typed"]; query: CatalogQuery; organizations: CatalogFacet[] }) {
  const conditions = [...typed.f, ...Array<string>(CONDITION_FIELDS).fill("")].slice(0, Math.max(CONDITION_FIELDS, typed.f.length));
  const parameters = [...catalogParameters().values()];
  return (
    <form method="get" action="/catalog" role="search" aria-label="Search the catalog" className="mb-8 space-y-4 border-b border-rule pb-6" data-testid="catalog-search">
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <LabelledInput id="catalog-q" label="Part number or title" name="q" defaultValue={typed.q} placeholder="e.g. doubler" />
        <div className="space-y-1.5">
          <label htmlFor="catalog-class" className="block text-[0.9375rem] font-semibold">
            Device class
          </label>
          <select id="catalog-class" name="class" defaultValue={typed.class} className={selectClass}>
            <option value="">Any class</option>
            {deviceClasses.map((c) => (
              <option key={c} value={c}>
                {deviceClassLabels[c]}
              </option>
            ))}
          </select>
        </div>
        <LabelledInput id="catalog-covers" label="Covers the frequency" name="covers" defaultValue={typed.covers} placeholder="e.g. 2.4 GHz" hint="In the input or output band." />
        {organizations.length ? (
          <div className="space-y-1.5">
            <label htmlFor="catalog-org" className="block text-[0.9375rem] font-semibold">
              Organization
            </label>
            {/* The organizations with sheets for the rest of the query (the facet is counted without its own filter). */}
            <select id="catalog-org" name="org" defaultValue={typed.org} className={selectClass}>
              <option value="">Any organization</option>
              {organizations.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </select>
          </div>
        ) : (
          <LabelledInput id="catalog-org" label="Organization (short name)" name="org" defaultValue={typed.org} placeholder="e.g. kestrine" />
        )}
      </div>
      <fieldset className="space-y-2">
        <legend className="text-[0.9375rem] font-semibold">Conditions</legend>
        <p id="catalog-conditions-hint" className="text-sm text-ink-muted">
          As you would write them: <code>conversion-loss.max &lt;= 10 dB</code>, <code>fundamental-suppression &gt;= 25 dBc</code>, <code>drive &lt;= +13 dBm</code>. Without
          min, typ or max, &lt;= reads the max and &gt;= the min; every condition group of the sheet must meet it.
        </p>
        <div className="grid gap-3 sm:grid-cols-3">
          {conditions.map((value, i) => (
            <div key={i}>
              <label htmlFor={`catalog-f-${i}`} className="sr-only">
                Condition {i + 1}
              </label>
              <input
                id={`catalog-f-${i}`}
                name="f"
                defaultValue={value}
                list="catalog-parameters"
                aria-describedby="catalog-conditions-hint"
                className={selectClass}
                placeholder={["conversion-loss <= 10 dB", "drive <= +13 dBm", "vswr.max <= 1.5"][i] ?? ""}
              />
            </div>
          ))}
        </div>
        <datalist id="catalog-parameters">
          {parameters.map((p) => (
            <option key={p.key} value={`${p.key} <= `}>
              {p.label} ({p.unit})
            </option>
          ))}
        </datalist>
      </fieldset>
      <div className="flex flex-wrap items-center gap-4">
        <label className="flex items-center gap-2 text-[0.9375rem]">
          <input type="checkbox" name="rev" value="all" defaultChecked={query.revisions === "all"} />
          Include superseded and withdrawn revisions
        </label>
        <button type="submit" className={buttonClass.primary}>
          Search
        </button>
        <Link href="/catalog" className={buttonClass.quiet}>
          Clear
        </Link>
      </div>
      <details className="text-sm text-ink-muted">
        <summary className="cursor-pointer">Parameters you can search</summary>
        <ul className="mt-2 grid gap-x-6 gap-y-1 sm:grid-cols-2 lg:grid-cols-3" data-testid="catalog-parameter-list">
          {parameters.map((p) => (
            <li key={p.key}>
              <code className="text-ink">{p.key}</code> {p.label}
              {p.unit ? `, ${p.unit}` : ""}
            </li>
          ))}
        </ul>
      </details>
    </form>
  );
}

function LabelledInput({ id, label, name, defaultValue, placeholder, hint }: { id: string; label: string; name: string; defaultValue: string; placeholder: string; hint?: string }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-[0.9375rem] font-semibold">
        {label}
      </label>
      <input id={id} name={name} defaultValue={defaultValue} placeholder={placeholder} className={selectClass} aria-describedby={hint ? `${id}-hint` : undefined} />
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

function FacetList({ title, facets, selected, hrefFor, clearHref }: { title: string; facets: CatalogFacet[]; selected: string | null; hrefFor: (value: string) => string; clearHref: string }) {
  return (
    <nav aria-label={title}>
      <h2 className="running-head mb-2">{title}</h2>
      {facets.length ? (
        <ul className="space-y-1">
          {facets.map((f) => (
            <li key={f.value} className="flex justify-between gap-3">
              {selected === f.value ? (
                <Link href={clearHref} aria-current="true" aria-label={`${f.label}, selected: show all`} className="font-semibold">
                  ✓ {f.label}
                </Link>
              ) : (
                <Link href={hrefFor(f.value)}>{f.label}</Link>
              )}
              <span className="figure text-ink-muted" aria-label={`${f.count} sheets`}>
                {f.count}
              </span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-ink-muted">None for this search.</p>
      )}
    </nav>
  );
}

function SortLink({ query, sort, label }: { query: CatalogQuery; sort: CatalogSortKey; label: React.ReactNode }) {
  const active = query.sort === sort;
  const dir = active && query.dir === "asc" ? "desc" : "asc";
  return (
    <Link href={href(query, { sort, dir })} className={`no-underline hover:text-ink ${active ? "text-ink" : ""}`}>
      {label}
      <span aria-hidden="true" className="ml-1 inline-block w-2.5">
        {active ? (query.dir === "asc" ? "↑" : "↓") : ""}
      </span>
    </Link>
  );
}

function ariaSort(query: CatalogQuery, sort: CatalogSortKey) {
  return query.sort === sort ? (query.dir === "asc" ? "ascending" : "descending") : undefined;
}

function CatalogTable({ query, result }: { query: CatalogQuery; result: CatalogResult }) {
  const columns = query.deviceClass ? catalogKeyColumns[query.deviceClass] : [];
  const parameters = catalogParameters();
  // A plain GET form: the ticked boxes become /compare?sheets=…&sheets=…, with or without JavaScript.
  return (
    <form method="get" action="/compare" aria-label="Compare the ticked sheets" data-testid="catalog-compare-form">
      <ScrollTable label="Released sheets found" testId="catalog-results">
        <caption className="sr-only">Released sheets matching the search{query.conditions.length ? `: ${query.conditions.map(conditionText).join(", ")}` : ""}</caption>
        <thead>
          <tr>
            <th scope="col" className="w-px">
            {/* Narrow: the button under the table says what the boxes are for, and each box names its sheet. */}
            <span className="sr-only">Compare</span>
          </th>
            <th scope="col" aria-sort={ariaSort(query, "part")}>
              <SortLink query={query} sort="part" label="Part" />
            </th>
            <th scope="col">Organization</th>
            {query.deviceClass ? null : <th scope="col">Class</th>}
            <th scope="col" className="num">Input</th>
            <th scope="col" className="num">Output</th>
            <th scope="col" className="num" aria-sort={ariaSort(query, "drive")}>
              <SortLink query={query} sort="drive" label="Drive" />
            </th>
            {columns.map((c) => {
              const sort = `${c.key}.${c.guarantee}` as CatalogSortKey;
              return (
                <th key={c.key} scope="col" className="num" aria-sort={ariaSort(query, sort)}>
                  <SortLink query={query} sort={sort} label={<abbr title={keyColumnHead(c.key).name}>{keyColumnHead(c.key).symbol}</abbr>} />
                  <span className="block font-normal text-ink-muted">
                    typ · {c.guarantee}, <span className="normal-case">{parameters.get(c.key)?.unit}</span>
                  </span>
                </th>
              );
            })}
            {query.deviceClass ? null : <th scope="col">Key figures</th>}
            <th scope="col" aria-sort={ariaSort(query, "released")}>
              <SortLink query={query} sort="released" label="Revision" />
            </th>
          </tr>
        </thead>
        <tbody>
          {result.hits.map((hit) => (
            <tr key={hit.revisionId} data-testid="catalog-hit">
              <td>
                <input
                  type="checkbox"
                  name="sheets"
                  value={`${hit.organization.slug}/${hit.partNumber}/${hit.letter}`}
                  aria-label={`Compare ${hit.partNumber} Rev. ${hit.letter}`}
                title="Tick to compare"
                  className="h-4 w-4 accent-signal"
                />
              </td>
              <th scope="row">
                <Link href={hit.path} className="whitespace-nowrap font-semibold">
                  {hit.partNumber}
                </Link>
                <span className="block text-sm font-normal text-ink-muted">{hit.title}</span>
              </th>
              <td>{hit.organization.name}</td>
              {query.deviceClass ? null : <td>{deviceClassLabels[hit.deviceClass]}</td>}
              <td className="num">{hit.inputFrequencyHz ? <RangeQuantity min={hit.inputFrequencyHz.min} max={hit.inputFrequencyHz.max} unit="Hz" /> : "—"}</td>
              <td className="num">{hit.outputFrequencyHz ? <RangeQuantity min={hit.outputFrequencyHz.min} max={hit.outputFrequencyHz.max} unit="Hz" /> : "—"}</td>
              <td className="num">{hit.driveLevelDbm !== null ? <NumberQuantity value={hit.driveLevelDbm} unit="dBm" signed digits={{ maxDecimals: 1 }} /> : "—"}</td>
              {columns.map((c) => {
                const figure = hit.figures.find((f) => f.key === c.key);
                return (
                  <td key={c.key} className="num whitespace-nowrap">
                    <FigureValue value={figure?.typ ?? null} />
                    <span className="text-ink-muted"> · </span>
                    <FigureValue value={figure?.limit ?? null} />
                  </td>
                );
              })}
              {query.deviceClass ? null : (
                <td className="text-sm">
                  <KeyFigures hit={hit} />
                </td>
              )}
              <td className="whitespace-nowrap">
                Rev. {hit.letter}
                <span className="block text-sm text-ink-muted">{formatDate(hit.releasedAt)}</span>
              </td>
            </tr>
          ))}
        </tbody>
      </ScrollTable>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <button type="submit" className={buttonClass.secondary}>
          Compare selected
        </button>
        <span className="text-sm text-ink-muted">Tick two to four sheets: their figures side by side and their curves on the same axes.</span>
      </div>
    </form>
  );
}

function FigureValue({ value }: { value: number | null }) {
  return value === null ? <span className="text-ink-muted">—</span> : <NumberQuantity value={value} digits={{ maxDecimals: 2 }} />;
}

function KeyFigures({ hit }: { hit: CatalogHit }) {
  const shown = hit.figures.filter((f) => f.limit !== null || f.typ !== null);
  if (!shown.length) return <span className="text-ink-muted">—</span>;
  return (
    <ul className="space-y-0.5">
      {shown.map((f) => (
        <li key={f.key} className="whitespace-nowrap">
          <abbr title={keyColumnHead(f.key).name}>{keyColumnHead(f.key).symbol}</abbr>{" "}
          {f.limit !== null ? (
            <>
              {f.guarantee} <NumberQuantity value={f.limit} unit={f.unit} digits={{ maxDecimals: 2 }} />
            </>
          ) : (
            <>
              typ <NumberQuantity value={f.typ as number} unit={f.unit} digits={{ maxDecimals: 2 }} />
            </>
          )}
        </li>
      ))}
    </ul>
  );
}

function NoHits() {
  return (
    <EmptyState title="No released sheet matches" testId="catalog-empty">
      <p>Loosen a condition, choose another class or organization, or clear the search. Only released revisions are public; drafts never show here.</p>
    </EmptyState>
  );
}

function CatalogPager({ query, result }: { query: CatalogQuery; result: CatalogResult }) {
  const pageCount = Math.max(1, Math.ceil(result.total / result.pageSize));
  if (pageCount === 1) return null;
  return (
    <nav aria-label="Result pages" className="mt-5 flex items-center gap-5 text-[0.9375rem]" data-testid="catalog-pager">
      {query.page > 1 ? (
        <Link href={href(query, { page: query.page - 1 })} rel="prev">
          ← Previous
        </Link>
      ) : (
        <span className="text-ink-muted">← Previous</span>
      )}
      <span className="text-ink-muted">
        Page <span className="figure text-ink">{query.page}</span> of <span className="figure text-ink">{pageCount}</span>
      </span>
      {query.page < pageCount ? (
        <Link href={href(query, { page: query.page + 1 })} rel="next">
          Next →
        </Link>
      ) : (
        <span className="text-ink-muted">Next →</span>
      )}
    </nav>
  );
}
