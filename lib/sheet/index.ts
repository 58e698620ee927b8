export * from "./types";
export { buildSheetModel, PRELIMINARY_BANNER, type BuildSheetModelOptions } from "./build-sheet-model";
export { serializeSheetModel } from "./serialize";
export { renderProse, proseToPlainText, type RenderedProse } from "./render-prose";
export { makeConditionsKey, parseConditionsKey } from "./conditions";
export { notationSegments, type NotationSegment } from "./notation";
