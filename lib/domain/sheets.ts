/**
 * The fixed lists of a sheet: where a limit comes from, which prose sections a sheet has, and
 * the states of a sheet revision. Models, schemas, templates, editors and the sheet model derive
 * from these. Pure data: server code and client components both import it.
 */
import type { DeviceClass } from "./device-classes";
import type { ListPage } from "./devices";

/** Where a published limit comes from; printed as a mark beside the limit. */
export const limitBases = ["test", "characterization", "design"] as const;
export type LimitBasis = (typeof limitBases)[number];

/** The mark beside a limit and the legend under the table (the sheet), and the editor's words. */
export const limitBasisWords: Record<LimitBasis, { mark: string; legend: string; choice: string }> = {
  test: { mark: "T", legend: "Tested on every unit before shipment.", choice: "Guaranteed by test" },
  characterization: {
    mark: "C",
    legend: "Set from the characterization data in the statistics annex; not tested on every unit.",
    choice: "Guaranteed by characterization",
  },
  design: { mark: "D", legend: "Guaranteed by design; not tested on every unit.", choice: "Guaranteed by design" },
};

/** The prose sections of a sheet, in the order the sheet prints them. */
export const proseSectionIds = ["description", "features", "applications", "handling", "test-fixture"] as const;
export type ProseSectionId = (typeof proseSectionIds)[number];

/** Each prose section's heading on the sheet, and its name in messages. */
export const proseSectionTitles: Record<ProseSectionId, string> = {
  description: "Description",
  features: "Key features",
  applications: "Applications",
  handling: "Handling and mounting",
  "test-fixture": "Test fixture",
};

/** The states of a sheet revision, in the order a revision passes through them. */
export const revisionStates = ["draft", "in-review", "changes-requested", "approved", "released"] as const;
export type RevisionState = (typeof revisionStates)[number];

export const revisionStateLabels: Record<RevisionState, string> = {
  draft: "Draft",
  "in-review": "In review",
  "changes-requested": "Changes requested",
  approved: "Approved, not released",
  released: "Released",
};

/** What the sheets index shows of a draft, counted by the database without building its model. */
export type SheetSummary = {
  deviceId: number;
  partNumber: string;
  deviceClass: DeviceClass;
  title: string;
  /** Approved, not superseded measurement sets: what the draft is built from. */
  approvedSetCount: number;
  /** Distinct unit serials among those sets. */
  unitCount: number;
  /** Sets submitted and waiting for a reviewer. */
  awaitingReviewCount: number;
  /** Spec limits set on the device. */
  limitCount: number;
  /** The latest change to the device, its sets, its limits or its prose (ISO 8601). */
  lastChangeAt: string;
  /** The state of the sheet's open review (in review, changes requested, approved), or null. */
  reviewState: "in-review" | "changes-requested" | "approved" | null;
  /** The letter of the newest released revision, or null before the first release. */
  latestRevision: string | null;
};

export type SheetPage = ListPage<SheetSummary>;
