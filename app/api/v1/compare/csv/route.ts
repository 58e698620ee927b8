import { compareCsvFileName, compareTableCsv } from "@/lib/catalog/compare-csv";
import { parseCompareSelection } from "@/lib/catalog/compare-selection";
import { AppError } from "@/lib/errors";
import { route } from "@/lib/server/auth/guard";
import { loadComparison } from "@/lib/server/catalog/load-comparison";

export const dynamic = "force-dynamic";

/**
 * The compare table of two to four released sheets as CSV (`?sheets=<org>/<part>/<rev>,…`, the
 * compare page's own address), built by the same pure table builder as the page. A selection that
 * cannot be read, or of one sheet or more than four, answers 422 naming the problem; an address that
 * names no released sheet 404. Public, revalidated: "current" moves with each release.
 */
export const GET = route({ resource: "released-sheets" }, async ({ request }) => {
  const parsed = parseCompareSelection(new URL(request.url).searchParams);
  if (!parsed.ok) throw new AppError("invalid", parsed.issues.map((i) => i.message).join(" "), { fields: parsed.issues });
  const { table } = await loadComparison(parsed.sheets);
  return new Response(compareTableCsv(table), {
    headers: {
      "content-type": "text/csv; charset=utf-8; header=present",
      "content-disposition": `attachment; filename="${compareCsvFileName(table)}"`,
      "cache-control": "public, no-cache",
    },
  });
});
