/**
 * What the conformity watch shows of a device, as the device page and `GET /api/devices/{id}/conformity`
 * hand it over (lib/server/conformity/get-conformity-watch.ts). Pure types: components import them.
 */

export type ConformityAlertView = {
  id: number;
  measurementSetId: number;
  serial: string;
  revisionLetter: string;
  /** ISO 8601 (UTC). */
  raisedAt: string;
  summary: string;
  /** Each finding in one sentence (the limit and its rule, or the test and the release's centre and sigma). */
  findings: string[];
  closed: { at: string; by: string; reason: string } | null;
};

export type ConformityLimitCount = {
  groupId: string;
  label: string;
  symbol: string;
  conditionsText: string;
  /** The guaranteed limit and the release's decision rule in words. */
  limitText: string;
  inside: number;
  outside: number;
};

export type ConformityChartView = {
  groupId: string;
  label: string;
  conditionsText: string;
  /** Centre line and sigma from the release, printed with their unit. */
  centreText: string;
  sigmaText: string;
  releaseUnitCount: number;
  pointCount: number;
  /** A complete Vega-Lite spec from lib/charts. */
  vegaLite: Record<string, unknown>;
  description: string;
  /** Each signal: which test, at which unit. */
  signals: { rule: number; words: string; serial: string; setId: string }[];
};

export type ConformityWatchView = {
  deviceId: number;
  /** The current revision the watch reads against; null before a release or when the newest is withdrawn. */
  revision: { id: number; letter: string; releasedAt: string } | null;
  /** Sets approved since that release. */
  setCount: number;
  limits: ConformityLimitCount[];
  charts: ConformityChartView[];
  notes: string[];
  /** The method in words: decision rule source, chart type, where centre and sigma come from, the tests. */
  method: string;
  /** Open alerts first, then closed ones, newest first within each. */
  alerts: ConformityAlertView[];
};
