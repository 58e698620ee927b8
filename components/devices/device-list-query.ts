import type { DeviceSummary } from "@/lib/server/devices/device-summary";
import { deviceClassLabels } from "./device-class-label";

/** The device list's search, sort and page, all from the query string so a view can be linked. */
export const deviceSortKeys = ["part", "class", "updated"] as const;
export type DeviceSortKey = (typeof deviceSortKeys)[number];
export type DeviceListQuery = { q: string; sort: DeviceSortKey; dir: "asc" | "desc"; page: number };

export const devicesPerPage = 25;

type Params = Record<string, string | string[] | undefined>;

function first(value: string | string[] | undefined): string {
  return (Array.isArray(value) ? value[0] : value) ?? "";
}

export function readDeviceListQuery(params: Params): DeviceListQuery {
  const sortText = first(params.sort);
  const sort = (deviceSortKeys as readonly string[]).includes(sortText) ? (sortText as DeviceSortKey) : "part";
  const dirText = first(params.dir);
  const dir = dirText === "asc" || dirText === "desc" ? dirText : sort === "updated" ? "desc" : "asc";
  const page = Math.max(1, Math.floor(Number(first(params.page)) || 1));
  return { q: first(params.q).trim().slice(0, 100), sort, dir, page };
}

export function deviceListHref(query: DeviceListQuery, change: Partial<DeviceListQuery>): string {
  const next = { ...query, ...change };
  const search = new URLSearchParams();
  if (next.q) search.set("q", next.q);
  if (next.sort !== "part") search.set("sort", next.sort);
  if (next.dir !== (next.sort === "updated" ? "desc" : "asc")) search.set("dir", next.dir);
  if (next.page > 1) search.set("page", String(next.page));
  const text = search.toString();
  return text ? `/devices?${text}` : "/devices";
}

const collator = new Intl.Collator("en", { numeric: true, sensitivity: "base" });

export function applyDeviceListQuery(devices: DeviceSummary[], query: DeviceListQuery) {
  const needle = query.q.toLowerCase();
  const matching = needle
    ? devices.filter((d) => d.partNumber.toLowerCase().includes(needle) || d.title.toLowerCase().includes(needle))
    : devices;
  const key = (d: DeviceSummary) => (query.sort === "class" ? deviceClassLabels[d.deviceClass] : query.sort === "updated" ? d.updatedAt : d.partNumber);
  const sorted = [...matching].sort((a, b) => {
    const order = collator.compare(key(a), key(b)) || collator.compare(a.partNumber, b.partNumber);
    return query.dir === "asc" ? order : -order;
  });
  const pageCount = Math.max(1, Math.ceil(sorted.length / devicesPerPage));
  const page = Math.min(query.page, pageCount);
  return { total: sorted.length, page, pageCount, rows: sorted.slice((page - 1) * devicesPerPage, page * devicesPerPage) };
}
