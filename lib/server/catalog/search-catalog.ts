import "server-only";
import { catalogFacts, catalogParameters, type CatalogCondition, type CatalogFact, type CatalogQuery, type SpecField } from "@/lib/catalog/catalog-query";
import { catalogKeyColumns } from "@/lib/catalog/key-columns";
import type { CatalogFigure, CatalogHit, CatalogResult } from "@/lib/catalog/types";
import { deviceClassLabels, deviceClasses, type DeviceClass } from "@/lib/domain/device-classes";
import { datasheetPath } from "@/lib/domain/reviews";
import { publicSelect } from "../db/public-reads";

type Where = { sql: string[]; replacements: unknown[] };
type Facet = "deviceClass" | "organization";

const VALUE_COLUMN: Record<SpecField, string> = { min: "min_value", typ: "typ_value", max: "max_value" };
// The worst case over a sheet's condition groups: the highest max, the lowest min; typ sorts by its mean.
const SORT_AGGREGATE: Record<SpecField, string> = { min: "MIN", typ: "AVG", max: "MAX" };

const CACHE_ENTRIES = 256;
const CACHE_MS = 60_000;
const cache = new Map<string, { version: string; at: number; result: CatalogResult }>();

/**
 * The public catalog's search, in MariaDB over the released-spec index (released_sheets and
 * released_spec_values, written by the release transaction): the page of hits, the total, and the
 * counts per device class and per organization for the same query (each facet counted without its
 * own filter, so the other choices show what they would find). Anyone may search; only released
 * revisions are indexed, so nothing of a draft can come back (the resource `catalog` is public).
 *
 * The last few answers are kept in memory by query for up to a minute, and only while the catalog's
 * version is the same: the highest revision id indexed and the highest withdrawal id. Revisions and
 * withdrawals are only ever added (the tables refuse UPDATE and DELETE), so any release or withdrawal,
 * by any process, changes the version and the next search runs again.
 */
export async function searchCatalog(query: CatalogQuery): Promise<CatalogResult> {
  const key = JSON.stringify(query);
  const kept = cache.get(key);
  if (kept && Date.now() - kept.at < CACHE_MS && kept.version === (await catalogVersion())) {
    cache.delete(key);
    cache.set(key, kept);
    return kept.result;
  }
  const { result, version } = await runSearch(query);
  cache.delete(key);
  if (version !== null) {
    cache.set(key, { version, at: Date.now(), result });
    if (cache.size > CACHE_ENTRIES) cache.delete(cache.keys().next().value as string);
  }
  return result;
}

// The catalog's version, read inside a statement: the search's own statements carry it as columns, so
// an answer is kept under exactly the version its rows were read at (one statement, one read view).
const versionColumns = "(SELECT MAX(revision_id) FROM released_sheets) AS catalog_revision, (SELECT MAX(id) FROM sheet_revision_withdrawals) AS catalog_withdrawal";
type VersionColumns = { catalog_revision: number | null; catalog_withdrawal: number | null };
const versionOf = (row: VersionColumns | undefined) => (row ? `${row.catalog_revision ?? 0}:${row.catalog_withdrawal ?? 0}` : null);

async function catalogVersion(): Promise<string> {
  const [row] = await publicSelect<VersionColumns>(`SELECT ${versionColumns}`);
  return versionOf(row)!;
}

/**
 * The search itself: the page, the facets (the total is read from them) and the page's key figures,
 * with the catalog version the page and the facets were read at; null (keep nothing) when they differ
 * or either read no row, so a search never runs a separate version query.
 */
async function runSearch(query: CatalogQuery): Promise<{ result: CatalogResult; version: string | null }> {
  const from = "FROM released_sheets s JOIN organizations o ON o.id = s.organization_id";
  const all = whereOf(query);
  const facetsWhere = whereOf(query, ["deviceClass", "organization"]);
  const where = (w: Where) => (w.sql.length ? `WHERE ${w.sql.join(" AND ")}` : "");

  const sort = sortExpression(query);
  const offset = (query.page - 1) * query.pageSize;
  const [rows, counts] = await Promise.all([
    publicSelect<HitRow>(
      `SELECT s.revision_id, s.part_number, s.title, s.device_class, s.letter, s.released_at,
              s.input_min_hz, s.input_max_hz, s.output_min_hz, s.output_max_hz, s.drive_dbm,
              o.slug AS organization_slug, o.name AS organization_name, ${sort.select} AS sort_value, ${versionColumns}
         ${from} ${where(all)}
        ORDER BY (sort_value IS NULL), sort_value ${query.dir === "desc" ? "DESC" : "ASC"}, s.part_number ${query.dir === "desc" && query.sort === "part" ? "DESC" : "ASC"}, s.revision_id
        LIMIT ? OFFSET ?`,
      [...sort.replacements, ...all.replacements, query.pageSize, offset],
    ),
    // Both facets from one query: counted per class and organization without either filter, then
    // each facet keeps the other's filter (a class's count within the chosen organization, and back).
    publicSelect<{ device_class: string; slug: string; name: string; count: number } & VersionColumns>(
      `SELECT s.device_class, o.slug, MAX(o.name) AS name, COUNT(*) AS count, ${versionColumns} ${from} ${where(facetsWhere)} GROUP BY s.device_class, o.slug`,
      facetsWhere.replacements,
    ),
  ]);
  const classCounts = sumBy(counts.filter((c) => !query.organization || c.slug === query.organization), (c) => c.device_class, () => "");
  const orgCounts = sumBy(counts.filter((c) => !query.deviceClass || c.device_class === query.deviceClass), (c) => c.slug, (c) => c.name);

  const figures = await keyFigures(rows);
  // The class facet is the query without its class filter: the total is its chosen class's count, or all of it.
  const total = classCounts.filter((c) => !query.deviceClass || c.value === query.deviceClass).reduce((sum, c) => sum + Number(c.count), 0);
  const pageVersion = versionOf(rows[0]);
  const result: CatalogResult = {
    total,
    page: query.page,
    pageSize: query.pageSize,
    hits: rows.map((row) => toHit(row, figures.get(row.revision_id) ?? [])),
    facets: {
      deviceClass: classCounts
        .filter((c) => (deviceClasses as readonly string[]).includes(c.value))
        .map((c) => ({ value: c.value as DeviceClass, label: deviceClassLabels[c.value as DeviceClass], count: c.count })),
      organization: orgCounts.map((c) => ({ value: c.value, label: c.label || c.value, count: c.count })),
    },
  };
  return { result, version: pageVersion !== null && pageVersion === versionOf(counts[0]) ? pageVersion : null };
}

/** Counts summed per key, ordered by key (as the facets list them). */
function sumBy<T extends { count: number }>(rows: T[], key: (row: T) => string, label: (row: T) => string): { value: string; label: string; count: number }[] {
  const sums = new Map<string, { value: string; label: string; count: number }>();
  for (const row of rows) {
    const k = key(row);
    const entry = sums.get(k) ?? { value: k, label: label(row), count: 0 };
    entry.count += Number(row.count);
    sums.set(k, entry);
  }
  return [...sums.values()].sort((a, b) => (a.value < b.value ? -1 : a.value > b.value ? 1 : 0));
}

/** The filters of a query as SQL; `except` leaves the facets' own filters out (for their counts). */
function whereOf(query: CatalogQuery, except: Facet[] = []): Where {
  const w: Where = { sql: [], replacements: [] };
  // Only classes this build offers (a test-only class's sheets stay out of a normal build's catalog).
  w.sql.push(`s.device_class IN (${deviceClasses.map(() => "?").join(", ")})`);
  w.replacements.push(...deviceClasses);
  if (query.revisions === "current") {
    w.sql.push(
      "NOT EXISTS (SELECT 1 FROM sheet_revisions n WHERE n.previous_revision_id = s.revision_id)",
      "NOT EXISTS (SELECT 1 FROM sheet_revision_withdrawals x WHERE x.revision_id = s.revision_id)",
    );
  }
  if (query.deviceClass && !except.includes("deviceClass")) {
    w.sql.push("s.device_class = ?");
    w.replacements.push(query.deviceClass);
  }
  if (query.organization && !except.includes("organization")) {
    w.sql.push("o.slug = ?");
    w.replacements.push(query.organization);
  }
  for (const word of query.text.split(/\s+/).filter(Boolean).slice(0, 8)) {
    const like = `%${word.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    w.sql.push("(s.part_number LIKE ? OR s.title LIKE ?)");
    w.replacements.push(like, like);
  }
  if (query.coversHz !== null) {
    w.sql.push("((s.input_min_hz <= ? AND s.input_max_hz >= ?) OR (s.output_min_hz <= ? AND s.output_max_hz >= ?))");
    w.replacements.push(query.coversHz, query.coversHz, query.coversHz, query.coversHz);
  }
  for (const condition of query.conditions) conditionSql(condition, w);
  return w;
}

function conditionSql(condition: CatalogCondition, w: Where): void {
  const parameter = catalogParameters().get(condition.key);
  if (!parameter) return; // the parser admits only known keys
  const op = condition.op === "le" ? "<=" : ">=";
  if (parameter.column === "fact") {
    w.sql.push(`s.${catalogFacts[condition.key as CatalogFact].column} ${op} ?`);
    w.replacements.push(condition.value);
    return;
  }
  const value = VALUE_COLUMN[condition.field ?? (condition.op === "le" ? "max" : "min")];
  // Every condition group that states the figure meets it: its worst case does (a sheet that states
  // none has NULL here, which meets nothing). Correlated, so each candidate row costs one lookup in the
  // covering index (parameter|row_id, revision_id, …) instead of grouping every sheet's rows first.
  const worst = condition.op === "le" ? "MAX" : "MIN";
  w.sql.push(`(SELECT ${worst}(v.${value}) FROM released_spec_values v WHERE v.${parameter.column} = ? AND v.revision_id = s.revision_id) ${op} ?`);
  w.replacements.push(condition.key, condition.value);
}

function sortExpression(query: CatalogQuery): { select: string; replacements: unknown[] } {
  if (query.sort === "part") return { select: "NULL", replacements: [] };
  if (query.sort === "released") return { select: "s.released_at", replacements: [] };
  const [key, field] = query.sort.split(".") as [string, SpecField | undefined];
  const parameter = catalogParameters().get(key);
  if (!parameter) return { select: "NULL", replacements: [] };
  if (parameter.column === "fact") return { select: `s.${catalogFacts[key as CatalogFact].column}`, replacements: [] };
  const f = field ?? "max";
  return {
    select: `(SELECT ${SORT_AGGREGATE[f]}(v.${VALUE_COLUMN[f]}) FROM released_spec_values v WHERE v.revision_id = s.revision_id AND v.${parameter.column} = ?)`,
    replacements: [key],
  };
}

type HitRow = VersionColumns & {
  revision_id: number;
  part_number: string;
  title: string;
  device_class: string;
  letter: string;
  released_at: Date | string;
  input_min_hz: number | null;
  input_max_hz: number | null;
  output_min_hz: number | null;
  output_max_hz: number | null;
  drive_dbm: number | null;
  organization_slug: string;
  organization_name: string;
  sort_value: number | string | Date | null;
};

/** The key figures of the page's hits, in one query over their rows. */
async function keyFigures(rows: HitRow[]): Promise<Map<number, CatalogFigure[]>> {
  const out = new Map<number, CatalogFigure[]>();
  if (!rows.length) return out;
  const groups = await publicSelect<{ revision_id: number; row_id: string; parameter: string; min_value: number | null; typ_value: number | null; max_value: number | null; unit: string }>(
    `SELECT revision_id, row_id, parameter, MIN(min_value) AS min_value, AVG(typ_value) AS typ_value, MAX(max_value) AS max_value, MAX(unit) AS unit
       FROM released_spec_values WHERE revision_id IN (${rows.map(() => "?").join(", ")})
      GROUP BY revision_id, row_id, parameter`,
    rows.map((r) => r.revision_id),
  );
  for (const row of rows) {
    const columns = catalogKeyColumns[row.device_class as DeviceClass] ?? [];
    const mine = groups.filter((g) => g.revision_id === row.revision_id);
    out.set(
      row.revision_id,
      columns.map((column) => {
        const parameter = catalogParameters().get(column.key);
        const matching = mine.filter((g) => (parameter?.column === "row_id" ? g.row_id === column.key : g.parameter === column.key));
        const numbers = (pick: (g: (typeof mine)[number]) => number | null) => matching.map(pick).filter((v): v is number => v !== null).map(Number);
        const typs = numbers((g) => g.typ_value);
        const limits = numbers((g) => (column.guarantee === "max" ? g.max_value : g.min_value));
        return {
          key: column.key,
          guarantee: column.guarantee,
          unit: matching[0]?.unit ?? parameter?.unit ?? "",
          typ: typs.length ? typs.reduce((a, b) => a + b, 0) / typs.length : null,
          limit: limits.length ? (column.guarantee === "max" ? Math.max(...limits) : Math.min(...limits)) : null,
        };
      }),
    );
  }
  return out;
}

function toHit(row: HitRow, figures: CatalogFigure[]): CatalogHit {
  const band = (min: number | null, max: number | null) => (min !== null && max !== null ? { min: Number(min), max: Number(max) } : null);
  const sortValue = row.sort_value === null || row.sort_value instanceof Date ? null : Number(row.sort_value);
  return {
    revisionId: row.revision_id,
    organization: { slug: row.organization_slug, name: row.organization_name },
    partNumber: row.part_number,
    title: row.title,
    deviceClass: row.device_class as DeviceClass,
    letter: row.letter,
    releasedAt: new Date(row.released_at).toISOString(),
    inputFrequencyHz: band(row.input_min_hz, row.input_max_hz),
    outputFrequencyHz: band(row.output_min_hz, row.output_max_hz),
    driveLevelDbm: row.drive_dbm === null ? null : Number(row.drive_dbm),
    sortValue: Number.isFinite(sortValue) ? sortValue : null,
    figures,
    path: datasheetPath(row.organization_slug, row.part_number, row.letter),
    apiPath: `/api/v1/sheets/${encodeURIComponent(row.organization_slug)}/${encodeURIComponent(row.part_number)}/${encodeURIComponent(row.letter)}`,
  };
}
