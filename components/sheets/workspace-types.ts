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

/** The design-in lists as stored (figures as typed), the drawing's size, and the class's suggested pins and conditions. */
export interface WorkspaceDesignIn {
  pinFunctions: { pin: string; name: string; function: string }[];
  ordering: { partNumber: string; options: string; packing: string }[];
  recommendedOperatingConditions: { parameter: string; min: string; typ: string; max: string; unit: string }[];
  packageOutline: { widthPx: number; heightPx: number } | null;
  packageOutlineCaption: string;
  templatePins: { pin: string; name: string; function: string }[];
  templateConditions: { parameter: string; unit: string }[];
}
