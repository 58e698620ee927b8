import type { ProseSection } from "./types";

/**
 * Where a sheet's prose sections stand, the same on the web page and in the PDF: the description
 * and the key features open the sheet beside the key facts; every other section follows the
 * tables and charts, in the model's order.
 */
export function proseLayout(prose: ProseSection[]): { description?: ProseSection; features?: ProseSection; later: ProseSection[] } {
  return {
    description: prose.find((section) => section.id === "description"),
    features: prose.find((section) => section.id === "features"),
    later: prose.filter((section) => section.id !== "description" && section.id !== "features"),
  };
}
