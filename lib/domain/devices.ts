/**
 * A device as pages and client components see it, and the device list's search, sort and page.
 * Pure: lib/server/devices fills these types from the database; components import them.
 */
import type { DeviceClass } from "./device-classes";

/** Conditions that identify the part: ranges in Hz, drive class in dBm. */
export type KeyConditions = {
  inputFrequencyHz?: { min: number; max: number };
  outputFrequencyHz?: { min: number; max: number };
  driveLevelDbm?: number;
  multiplicationFactor?: number;
};

export type DeviceSummary = {
  id: number;
  partNumber: string;
  deviceClass: DeviceClass;
  title: string;
  description: string;
  keyConditions: KeyConditions;
  updatedAt: string;
};

/** The device list's search, sort and page, as read from the query string. */
export const deviceSortKeys = ["part", "class", "updated"] as const;
export type DeviceSortKey = (typeof deviceSortKeys)[number];
export type DeviceListQuery = { q: string; sort: DeviceSortKey; dir: "asc" | "desc"; page: number };

export const devicesPerPage = 25;

/** One page of a searched, sorted list of an organization's devices (the device list, the sheets index). */
export type ListPage<Row> = {
  rows: Row[];
  /** Devices matching the search. */
  total: number;
  /** Devices of the organization, searched or not (0 shows the empty state). */
  organizationTotal: number;
  page: number;
  pageCount: number;
};

export type DevicePage = ListPage<DeviceSummary>;
