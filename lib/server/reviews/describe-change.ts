import "server-only";
import { diffIsEmpty, diffSheetModels, summaryLines, type SheetModel } from "@/lib/sheet";

/**
 * What differs between two sheet models, one change a line, from the review's own diff: the
 * generated release notes, and the reason a candidate went stale. A change the diff does not
 * list (a statistic of the annex, a calibration date in the traceability) is still named.
 */
export function describeSheetChange(before: SheetModel | null, after: SheetModel): string[] {
  const diff = diffSheetModels(before, after);
  return diffIsEmpty(diff) ? ["Changed: the statistics or the traceability behind the sheet"] : summaryLines(diff);
}
