import type { ProseSectionId, SheetModel, SpecLimitInput } from "@/lib/sheet/types";

/** The parts of the sheet model the interactive workspace reads (the charts and prose stay on the server). */
export type WorkspaceModel = Pick<SheetModel, "header" | "specifications" | "statistics" | "issues">;

/** What the engineer has written, as stored: the editors start from it. */
export interface WorkspaceContent {
  limits: SpecLimitInput[];
  prose: Partial<Record<ProseSectionId, string>>;
  absoluteMaximumRatings: { label: string; value: string; unit: string }[];
  measurementUncertainty: Record<string, number>;
}

/** The device class's defaults: prose shown until the engineer writes a section, and the ratings a sheet must state. */
export interface WorkspaceTemplate {
  /** The text an empty section prints: the template's, or for the description the device's own. */
  prose: { id: ProseSectionId; title: string; markdown: string; defaultSource: "template" | "device" }[];
  absoluteMaximumRatings: { label: string; unit: string }[];
}
