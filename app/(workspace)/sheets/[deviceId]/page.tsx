import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { allows } from "@/lib/access/matrix";
import { buildSheetModel } from "@/lib/sheet";
import { loadForPage, requirePageUser } from "@/lib/server/auth/require-page-user";
import { renderSheetChartSvgs } from "@/lib/server/charts/render-chart";
import { findDeviceReview } from "@/lib/server/reviews/list-pending-candidates";
import { listDeviceRevisions } from "@/lib/server/reviews/list-revisions";
import { loadDraftSheet } from "@/lib/server/sheets/load-draft-sheet";
import { findSheetTemplate } from "@/templates";
import { SheetView } from "@/components/sheet/sheet-view";
import { SheetViewWithCharts } from "@/components/sheets/sheet-view-with-charts";
import { ReviewReleasePanel } from "@/components/sheets/review-release-panel";
import { SheetWorkspace } from "@/components/sheets/sheet-workspace";
import { parseRecordId } from "@/lib/schemas/decimal";

type Props = { params: Promise<{ deviceId: string }> };

export const metadata: Metadata = { title: "Sheet draft" };

export default async function SheetPage({ params }: Props) {
  const { deviceId: idText } = await params;
  const user = await requirePageUser({ resource: "sheet-drafts", path: `/sheets/${idText}` });
  const deviceId = parseRecordId(idText);
  if (deviceId === undefined) notFound();
  // The same input the JSON and PDF routes build from, loaded once: the model for the preview, the raw text for the editors.
  const [input, review, revisions] = await loadForPage(() =>
    Promise.all([loadDraftSheet(user, deviceId), findDeviceReview({ viewer: user, deviceId }), listDeviceRevisions({ viewer: user, deviceId })]),
  );
  const model = buildSheetModel(input);
  const template = findSheetTemplate(input.device.deviceClass, input.device.keyConditions);
  return (
    <SheetWorkspace
      deviceId={deviceId}
      canEdit={allows(user.role, "sheet-edit")}
      approvedSetCount={model.traceability.measurementSets.length}
      model={{ header: model.header, specifications: model.specifications, statistics: model.statistics, issues: model.issues }}
      content={{
        limits: input.limits,
        prose: input.prose,
        absoluteMaximumRatings: input.absoluteMaximumRatings,
        measurementUncertainty: input.settings.measurementUncertainty ?? {},
      }}
      template={{
        // As the model does: an unwritten description prints the device's own description, if it has one.
        prose: (template?.prose ?? []).map(({ id, title, markdown }) =>
          id === "description" && input.device.description.trim()
            ? { id, title, markdown: input.device.description, defaultSource: "device" as const }
            : { id, title, markdown, defaultSource: "template" as const },
        ),
        absoluteMaximumRatings: template?.absoluteMaximumRatings ?? [],
      }}
      designIn={{
        pinFunctions: input.designData?.pinFunctions ?? [],
        ordering: input.designData?.ordering ?? [],
        recommendedOperatingConditions: input.designData?.recommendedOperatingConditions ?? [],
        packageOutline: input.designData?.packageOutline ? { widthPx: input.designData.packageOutline.widthPx, heightPx: input.designData.packageOutline.heightPx } : null,
        // Saved with the lists, so it is there after a reload also before any drawing is uploaded.
        packageOutlineCaption: input.designData?.packageOutlineCaption ?? input.designData?.packageOutline?.caption ?? "",
        templatePins: template?.designIn?.pins ?? [],
        templateConditions: template?.designIn?.recommendedOperatingConditions ?? [],
      }}
      reviewPanel={
        <ReviewReleasePanel
          deviceId={deviceId}
          review={review}
          revisions={revisions}
          issues={model.issues}
          canRelease={allows(user.role, "sheet-release")}
          canWithdraw={allows(user.role, "revision-withdrawal")}
        />
      }
      sheetView={
        // The charts' SVG is drawn on the server; until it arrives the sheet shows each chart's description.
        <Suspense fallback={<SheetView model={model} />}>
          <SheetViewWithCharts model={model} chartSvgs={renderSheetChartSvgs(model)} />
        </Suspense>
      }
    />
  );
}
