import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { allows } from "@/lib/access/matrix";
import { parseRecordId } from "@/lib/schemas/decimal";
import { loadForPage, requirePageUser } from "@/lib/server/auth/require-page-user";
import { renderSheetChartSvgs } from "@/lib/server/charts/render-chart";
import { getCandidate } from "@/lib/server/reviews/get-candidate";
import { SheetView } from "@/components/sheet/sheet-view";
import { SheetViewWithCharts } from "@/components/sheets/sheet-view-with-charts";
import { CandidateReviewView } from "@/components/review/candidate-review-view";
import { commentAnchorOptions } from "@/components/review/comment-anchors";
import { SheetDiffView, type DiffAnchor } from "@/components/review/sheet-diff";
import { CommentOnButton } from "@/components/review/comment-on-button";
import { diffSheetModels } from "@/lib/sheet/diff";

type Props = { params: Promise<{ candidateId: string }> };

export const metadata: Metadata = { title: "Sheet review" };

export default async function SheetReviewPage({ params }: Props) {
  const { candidateId: idText } = await params;
  const user = await requirePageUser({ resource: "sheet-comments", path: `/review/sheets/${idText}` });
  const candidateId = parseRecordId(idText);
  if (candidateId === undefined) notFound();
  // The same function as GET /api/sheet-candidates/[id]: organization scope and what the viewer may do.
  const candidate = await loadForPage(() => getCandidate({ viewer: user, candidateId }));
  const { model } = candidate;
  const anchors = commentAnchorOptions(model);
  // The change list against the last release's frozen model (or against nothing, for a first release).
  const diff = diffSheetModels(candidate.previousModel, model, {
    previousLabel: candidate.comparedRevision ? `Rev. ${candidate.comparedRevision}` : undefined,
    nextLabel: "Candidate",
  });
  /** "Comment" beside an entry of the change list, when the candidate itself has that row, chart or section. */
  const commentOn = (entry: DiffAnchor) => {
    if (!candidate.can.comment) return null;
    // A chart split by series is one panel per series ("<chart id>--<series>"); a comment sits on the chart.
    const target = anchors.find((a) => a.kind === entry.kind && (a.id === entry.key || (entry.kind === "chart" && entry.key.startsWith(`${a.id}--`))));
    return target ? <CommentOnButton kind={target.kind} id={target.id} label={target.label} /> : null;
  };
  return (
    <CandidateReviewView
      candidate={candidate}
      organizationName={user.organizationName}
      viewerId={user.id}
      isReviewer={allows(user.role, "sheet-review")}
      anchors={anchors}
      sheetView={
        <Suspense fallback={<SheetView model={model} />}>
          <SheetViewWithCharts model={model} chartSvgs={renderSheetChartSvgs(model)} />
        </Suspense>
      }
      changes={<SheetDiffView diff={diff} headingId="review-changes-title" anchorActions={commentOn} dataHref={() => "#sheet-statistics"} />}
    />
  );
}
