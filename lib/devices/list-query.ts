/** The device list's search, sort and page, as read from the query string. */
export const deviceSortKeys = ["part", "class", "updated"] as const;
export type DeviceSortKey = (typeof deviceSortKeys)[number];
export type DeviceListQuery = { q: string; sort: DeviceSortKey; dir: "asc" | "desc"; page: number };

export const devicesPerPage = 25;
