/** What the catalog search answers, as the page and GET /api/v1/sheets hand it on (pure types). */
import type { DeviceClass } from "../domain/device-classes";

/** One key figure of a result: the typical value and the guaranteed limit, in the unit of the sheet's rows. */
export type CatalogFigure = { key: string; typ: number | null; limit: number | null; guarantee: "min" | "max"; unit: string };

export type CatalogHit = {
  revisionId: number;
  organization: { slug: string; name: string };
  partNumber: string;
  title: string;
  deviceClass: DeviceClass;
  letter: string;
  releasedAt: string;
  inputFrequencyHz: { min: number; max: number } | null;
  outputFrequencyHz: { min: number; max: number } | null;
  driveLevelDbm: number | null;
  /** The value of the column the results are sorted by, when it is a figure. */
  sortValue: number | null;
  figures: CatalogFigure[];
  /** Public address of this revision's sheet page, and of its machine-readable model. */
  path: string;
  apiPath: string;
};

export type CatalogFacet<K extends string = string> = { value: K; label: string; count: number };

export type CatalogResult = {
  total: number;
  page: number;
  pageSize: number;
  hits: CatalogHit[];
  facets: { deviceClass: CatalogFacet<DeviceClass>[]; organization: CatalogFacet[] };
};
