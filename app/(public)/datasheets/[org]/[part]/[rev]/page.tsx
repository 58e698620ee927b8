import type { Metadata } from "next";
import { cache, Suspense } from "react";
import { isDeviceClass } from "@/lib/domain/device-classes";
import { loadForPage } from "@/lib/server/auth/require-page-user";
import { getSessionUser } from "@/lib/server/auth/session";
import { renderSheetChartSvgs } from "@/lib/server/charts/render-chart";
import { serverConfig } from "@/lib/server/config";
import { findReleasedRevision } from "@/lib/server/reviews/list-revisions";
import { releasedPageDescription, releasedPageTitle } from "@/lib/sheet/released-page-words";
import { SheetView } from "@/components/sheet/sheet-view";
import { SheetViewWithCharts } from "@/components/sheets/sheet-view-with-charts";
import { ReleasedSheetView } from "@/components/datasheets/released-sheet-view";
import { FollowButton } from "@/components/subscriptions/follow-button";

type Params = { org: string; part: string; rev: string };
type Props = { params: Promise<Params> };

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
export default async function ReleasedDatasheetPage({ params }: Props) {
  const { org, part, rev } = await params;
  const { summary, model, history } = await loadForPage(() => releasedSheet(org, part, rev));
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
      sheetView={
        <Suspense fallback={<SheetView model={model} withdrawn={withdrawn} />}>
          <SheetViewWithCharts model={model} chartSvgs={renderSheetChartSvgs(model)} withdrawn={withdrawn} />
        </Suspense>
      }
    />
  );
}
