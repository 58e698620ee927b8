export * from "./types";
export { buildSheetModel, PRELIMINARY_BANNER, type BuildSheetModelOptions } from "./build-sheet-model";
export { serializeSheetModel } from "./serialize";
export { renderProse, proseToPlainText, findProseLimitBreach, proseOverLimitNotice, type RenderedProse } from "./render-prose";
export { proseLimits, type ProseLimit, type ProseLimitBreach } from "./prose-limits";
export { makeConditionsKey, parseConditionsKey } from "./conditions";
export { notationSegments, type NotationSegment } from "./notation";
export { proseLayout } from "./prose-layout";
export { releaseSheetModel, revisionLetter, revisionSequence, type ReleaseFacts } from "./release";
export {
  diffSheetModels,
  diffIsEmpty,
  rowMovedWithDataOnly,
  summaryLines,
  diffRowAnchorId,
  diffChartAnchorId,
  diffProseAnchorId,
  type SheetDiff,
  type DiffSheetModelsOptions,
  type SpecRowChange,
  type SpecRowFieldChange,
  type SpecRowFigures,
  type SpecRowRef,
  type LimitFieldChange,
  type LimitField,
  type LimitEffect,
  type ChangeDirection,
  type BasisChange,
  type ProseChange,
  type ProseDiffPart,
  type RatingChange,
  type RatingFigures,
  type MeasurementSetRef,
  type DetailChange,
  type ChartOverlay,
  type ChartOverlayPanel,
} from "./diff";
export { signedAtText, candidateDigestLabel } from "./release-text";
