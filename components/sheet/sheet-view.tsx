import type { SheetModel } from "@/lib/sheet/types";
import { SheetStatistics, SheetTraceability } from "./sheet-annex";
import { SheetBanner, SheetOverview, SheetTitleBlock } from "./sheet-front";
import { SheetPrintStyle } from "./sheet-print-style";
import { SheetFoot, SheetReleaseRecord } from "./sheet-release";
import { SheetDesignIn } from "./sheet-design-in";
import { SheetCautions, SheetCharts, SheetLaterProse, SheetRatings, SheetReviewNotes, SheetRevisionHistory } from "./sheet-sections";
import { SheetSpecTable } from "./sheet-spec-table";
import { type SheetWithdrawal, SheetWithdrawnNotice } from "./sheet-withdrawn-notice";

export interface SheetViewProps {
  model: SheetModel;
  /**
   * Chart SVG markup by chart id, made on the server from the model's own
   * Vega-Lite specs (lib/server/charts/render-chart.ts renderSheetChartSvgs).
   * A chart without markup shows its text description.
   */
  chartSvgs?: Record<string, string>;
  /**
   * Set when the revision shown was withdrawn: its standing, known at view time (the frozen model
   * never changes). The sheet then opens with a withdrawn notice and its reason.
   */
  withdrawn?: SheetWithdrawal;
}

/** The characterization sheet as a web page; lays out the sheet model and computes nothing. */
export function SheetView({ model, chartSvgs = {}, withdrawn }: SheetViewProps) {
  return (
    <article className="sheet-view mx-auto max-w-page px-4 py-8 text-ink" aria-labelledby="sheet-title">
      <SheetPrintStyle />
      {withdrawn ? <SheetWithdrawnNotice withdrawn={withdrawn} revisionText={model.header.revisionText} /> : null}
      <SheetBanner header={model.header} />
      <SheetTitleBlock model={model} />
      <SheetOverview model={model} />
      <SheetSpecTable model={model} />
      <SheetRatings model={model} />
      <SheetCautions model={model} />
      <SheetDesignIn model={model} />
      <SheetCharts model={model} chartSvgs={chartSvgs} />
      <SheetLaterProse model={model} />
      <SheetTraceability model={model} />
      <SheetStatistics model={model} />
      <SheetRevisionHistory model={model} />
      <SheetReleaseRecord model={model} />
      <SheetReviewNotes model={model} />
      <SheetFoot model={model} />
    </article>
  );
}
