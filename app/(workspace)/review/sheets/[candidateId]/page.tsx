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
import { ReviewChangesSlot } from "@/components/review/review-changes-slot";

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
  return (
    <CandidateReviewView
      candidate={candidate}
      organizationName={user.organizationName}
      viewerId={user.id}
      isReviewer={allows(user.role, "sheet-review")}
      anchors={commentAnchorOptions(model)}
      sheetView={
        <Suspense fallback={<SheetView model={model} />}>
          <SheetViewWithCharts model={model} chartSvgs={renderSheetChartSvgs(model)} />
        </Suspense>
      }
      changes={<ReviewChangesSlot comparedRevision={candidate.comparedRevision} />}
    />
  );
}
