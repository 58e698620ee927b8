import "server-only";
import { buildCompareTable, type CompareInput, type CompareTable } from "@/lib/catalog/compare-table";
import { compareSheetKey, type CompareSheetRef } from "@/lib/catalog/compare-selection";
import { AppError, isAppError } from "@/lib/errors";
import type { SheetModel } from "@/lib/sheet/types";
import { findReleasedRevision, type ReleasedSheet } from "../reviews/list-revisions";

export type Comparison = {
  table: CompareTable;
  /** The compared sheets' frozen models with their labels, in the selection's order (for the curves). */
  models: { label: string; model: SheetModel }[];
  /** The selection with every revision as its letter ("current" resolved): the comparison's lasting address. */
  lettered: CompareSheetRef[];
};

/**
 * Two to four released revisions by their public addresses (the selection is read and counted by
 * parseCompareSelection first), and their compare table. Anyone may read released sheets; nothing
 * of a draft is reachable. Every address that names no released sheet is listed in one 404, and two
 * addresses of one revision ("current" and its letter) are refused as a selection of one.
 */
export async function loadComparison(refs: readonly CompareSheetRef[]): Promise<Comparison> {
  const found = await Promise.all(
    refs.map(async (ref) => {
      try {
        return await findReleasedRevision(ref);
      } catch (error) {
        if (isAppError(error) && error.code === "not-found") return null;
        throw error;
      }
    }),
  );
  const unknown = refs.filter((_, i) => found[i] === null).map(compareSheetKey);
  if (unknown.length) {
    throw new AppError("not-found", `No released sheet at ${unknown.join(", ")}. Use an address from the catalog: organization/part/revision.`, { unknown });
  }
  const sheets = found as ReleasedSheet[];
  sheets.forEach((sheet, i) => {
    const twin = sheets.findIndex((other) => other.summary.id === sheet.summary.id);
    if (twin !== i) {
      throw new AppError(
        "invalid",
        `${compareSheetKey(refs[twin])} and ${compareSheetKey(refs[i])} are the same revision (${sheet.summary.letter}); pick two to four different revisions.`,
      );
    }
  });
  const lettered = refs.map((ref, i) => ({ ...ref, revision: sheets[i].summary.letter }));
  const sharedPart = (part: string) => new Set(sheets.filter((s) => s.model.header.partNumber === part).map((s) => s.model.header.organizationName)).size > 1;
  const inputs: CompareInput[] = sheets.map(({ summary, model }, i) => ({
    sheet: {
      key: compareSheetKey(lettered[i]),
      label: `${sharedPart(model.header.partNumber) ? `${model.header.organizationName} ` : ""}${model.header.partNumber} Rev. ${summary.letter}`,
      organizationName: model.header.organizationName,
      partNumber: model.header.partNumber,
      letter: summary.letter,
      title: model.header.title,
      deviceClassLabel: model.header.deviceClassLabel,
      releasedOn: summary.releasedAt.slice(0, 10),
      standing: summary.standing,
      path: summary.publicPath,
    },
    model,
  }));
  return { table: buildCompareTable(inputs), models: inputs.map(({ sheet, model }) => ({ label: sheet.label, model })), lettered };
}
