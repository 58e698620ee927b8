
/** The device list's search, sort and page (the sheets index's too), all from the query string so a view can be linked. */
import { deviceSortKeys, type DeviceListQuery, type DeviceSortKey } from "@/lib/domain/devices";
import { parseRecordId } from "@/lib/schemas/decimal";

export { deviceSortKeys, devicesPerPage, type DeviceListQuery, type DeviceSortKey } from "@/lib/domain/devices";

type Params = Record<string, string | string[] | undefined>;

function first(value: string | string[] | undefined): string {
  return (Array.isArray(value) ? value[0] : value) ?? "";
}

export function readDeviceListQuery(params: Params): DeviceListQuery {
  const sortText = first(params.sort);
  const sort = (deviceSortKeys as readonly string[]).includes(sortText) ? (sortText as DeviceSortKey) : "part";
  const dirText = first(params.dir);
  const dir = dirText === "asc" || dirText === "desc" ? dirText : sort === "updated" ? "desc" : "asc";
  const page = parseRecordId(first(params.page)) ?? 1;
  return { q: first(params.q).trim().slice(0, 100), sort, dir, page };
}

/** The link to the list at `basePath` (the device list, or the sheets index that pages the same way) after a change. */
export function deviceListHref(query: DeviceListQuery, change: Partial<DeviceListQuery>, basePath = "/devices"): string {
  const next = { ...query, ...change };
  const search = new URLSearchParams();
  if (next.q) search.set("q", next.q);
  if (next.sort !== "part") search.set("sort", next.sort);
  if (next.dir !== (next.sort === "updated" ? "desc" : "asc")) search.set("dir", next.dir);
  if (next.page > 1) search.set("page", String(next.page));
  const text = search.toString();
  return text ? `${basePath}?${text}` : basePath;
}
