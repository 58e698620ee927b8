/**
 * How a sheet chart is printed in the PDF: at the size Vega draws it (one unit one point), two
 * figures a row across the A4 text column, scaled down only when a chart is wider than its half
 * of the column. The smallest type a chart carries (lib/charts print sizes) is then printed at
 * `printedTypeScale` of its size, which the tests hold at 7 pt or more.
 */

export const A4_WIDTH_PT = 595.28;
export const A4_HEIGHT_PT = 841.89;
export const PAGE_MARGIN_PT = 42;
/** The gap between the two figures of a row. */
export const FIGURE_GAP_PT = 14;
/** The width of one figure: half the text column, less half the gap. */
export const FIGURE_COLUMN_PT = (A4_WIDTH_PT - 2 * PAGE_MARGIN_PT - FIGURE_GAP_PT) / 2;

/** The printed width of a chart drawn `drawnWidth` units wide. */
export function printedFigureWidthPt(drawnWidth: number): number {
  return Math.min(drawnWidth, FIGURE_COLUMN_PT);
}

/** The factor a chart's type is printed at (1 when it fits its column). */
export function printedTypeScale(drawnWidth: number): number {
  return printedFigureWidthPt(drawnWidth) / drawnWidth;
}
