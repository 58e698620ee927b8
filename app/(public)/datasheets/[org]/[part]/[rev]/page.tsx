import type { Metadata } from "next";
import { cache, Suspense } from "react";
import { isDeviceClass } from "@/lib/domain/device-classes";
import { loadForPage } from "@/lib/server/auth/require-page-user";
import { getSessionUser } from "@/lib/server/auth/session";
import { renderChartSvgsById, renderSheetChartSvgs } from "@/lib/server/charts/render-chart";
import { serverConfig } from "@/lib/server/config";
import { findReleasedRevision } from "@/lib/server/reviews/list-revisions";
import { releasedPageDescription, releasedPageTitle } from "@/lib/sheet/released-page-words";
import { SheetView } from "@/components/sheet/sheet-view";
import { SheetViewWithCharts } from "@/components/sheets/sheet-view-with-charts";
import { ReleasedSheetView } from "@/components/datasheets/released-sheet-view";
import { FollowButton } from "@/components/subscriptions/follow-button";
import { DesignInCalculator } from "@/components/datasheets/design-in-calculator";
import { ReleasedDownloads } from "@/components/datasheets/released-downloads";
import { listReleasedTouchstone, medianTouchstoneGroups } from "@/lib/server/reviews/released-files";
import { specificationsCsvFileName } from "@/lib/sheet/file-name";
import { datasheetPath, type RevisionSummary } from "@/lib/domain/reviews";
import { designInOutcome, isDesignInDeviceClass, readDesignInCurves } from "@/lib/sheet/design-in";
import { buildDesignInCharts } from "@/lib/sheet/design-in-charts";
import type { SheetModel } from "@/lib/sheet/types";

type Params = { org: string; part: string; rev: string };
type Search = Record<string, string | string[] | undefined>;
type Props = { params: Promise<Params>; searchParams: Promise<Search> };

/** A path segment as the person typed it: "%2F" and "%20" back to their characters (a lone "%" stays as it is). */
function segment(value: string): string {
  try {
    return decodeURIComponent(value);
  } catch {
    return value;
  }
}

// One look-up per request, shared by the title and the page: the revision, its frozen model and the history.
const releasedSheet = cache((org: string, part: string, rev: string) =>
  findReleasedRevision({ organizationSlug: segment(org), partNumber: segment(part), revision: segment(rev) }),
);

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { org, part, rev } = await params;
  const sheet = await releasedSheet(org, part, rev).catch(() => null);
  if (!sheet) return { title: "No such released sheet" };
  const { summary, model, history } = sheet;
  const currentLetter = history.find((r) => r.standing === "current")?.letter ?? null;
  return {
    title: releasedPageTitle(model.header.partNumber, summary),
    description: releasedPageDescription({ title: model.header.title, organizationName: model.header.organizationName, revision: summary, currentLetter }),
    // "current" moves with each release; the lettered address of the revision shown never does.
    alternates: { canonical: new URL(summary.publicPath, serverConfig.appUrl).toString() },
    // A withdrawn revision stays readable for whoever holds its printout, but is not offered to search engines.
    ...(summary.standing === "withdrawn" ? { robots: { index: false, follow: true } } : {}),
  };
}

/** A released revision, public: drawn from its frozen model, never from live data. */
export default async function ReleasedDatasheetPage({ params, searchParams }: Props) {
  const { org, part, rev } = await params;
  const released = await loadForPage(() => releasedSheet(org, part, rev));
  const { summary, model, history } = released;
  const touchstone = await listReleasedTouchstone(released);
  // A withdrawn revision stays readable and downloadable; its standing is known now, never frozen in the model.
  const withdrawn = summary.withdrawal ? { reason: summary.withdrawal.reason, withdrawnOn: summary.withdrawal.withdrawnAt } : undefined;
  // Customers follow a part (the API checks the role again); a visitor is offered the way to sign in.
  const user = await getSessionUser();
  const deviceClass = model.template.deviceClass;
  const follow = isDeviceClass(deviceClass) ? (
    <FollowButton
      organizationSlug={segment(org)}
      organizationName={model.header.organizationName}
      partNumber={model.header.partNumber}
      deviceClass={deviceClass}
      viewer={!user ? "signed-out" : user.role === "customer" ? "customer" : "other"}
      returnPath={summary.publicPath}
    />
  ) : null;
  return (
    <ReleasedSheetView
      summary={summary}
      history={history}
      organizationName={model.header.organizationName}
      partNumber={model.header.partNumber}
      addressedAsCurrent={segment(rev) === "current"}
      follow={follow}
      downloads={
        <ReleasedDownloads
          letter={summary.letter}
          // The lettered address: the files are this revision's, whatever "current" names tomorrow.
          csvPath={summary.pdfPath.replace(/\/pdf$/, "/csv")}
          csvFileName={specificationsCsvFileName(model.header.partNumber, summary.letter)}
          touchstone={touchstone}
          medians={medianTouchstoneGroups(touchstone, { partNumber: model.header.partNumber, letter: summary.letter, basePath: summary.pdfPath.replace(/\/pdf$/, "") })}
        />
      }
      designIn={await designIn({ model, search: await searchParams, action: datasheetPath(segment(org), segment(part), segment(rev)), summary })}
      sheetView={
        <Suspense fallback={<SheetView model={model} withdrawn={withdrawn} />}>
          <SheetViewWithCharts model={model} chartSvgs={renderSheetChartSvgs(model)} withdrawn={withdrawn} />
        </Suspense>
      }
    />
  );
}

function first(value: string | string[] | undefined): string {
  return (Array.isArray(value) ? value[0] : value) ?? "";
}

/**
 * The design-in calculator, from the frozen model and the page's query (?drive=&frequency=): the same
 * function as the API's, its charts drawn to SVG here. A sheet of another class shows none, unless
 * the address asks it something (then it says why not).
 */
async function designIn({ model, search, action, summary }: { model: SheetModel; search: Search; action: string; summary: RevisionSummary }) {
  const typed = { drive: first(search.drive).slice(0, 200), frequency: first(search.frequency).slice(0, 200) };
  if (!isDesignInDeviceClass(model.template.deviceClass) && !typed.drive.trim() && !typed.frequency.trim()) return null;
  const outcome = designInOutcome(model, typed);
  const curves = readDesignInCurves(model);
  const charts = outcome.kind === "answer" ? buildDesignInCharts(model, outcome.answer) : [];
  return (
    <DesignInCalculator
      action={action}
      partNumber={model.header.partNumber}
      revisionLetter={summary.letter}
      standingNote={standingNote(summary)}
      curves={curves.ok ? curves : { ok: false, message: curves.message }}
      typed={typed}
      outcome={outcome}
      charts={charts}
      chartSvgs={charts.length ? await renderChartSvgsById(charts) : {}}
    />
  );
}

/**
 * A design read off a withdrawn revision says so beside the answer (the sheet's own withdrawn notice is
 * further down the page); a superseded one is said just above by the page itself.
 */
function standingNote(summary: RevisionSummary): string | undefined {
  if (summary.standing !== "withdrawn") return undefined;
  return `Rev. ${summary.letter} is withdrawn${summary.withdrawal ? ` (${summary.withdrawal.reason.replace(/[.\s]+$/, "")})` : ""}: these are the curves it was released with, not figures its maker stands by.`;
}
