/**
 * HTML ids of the review diff's entries, so a comment can link to the row, chart or prose section
 * it is about. Every character outside [A-Za-z0-9-] is written as _hex_: two different keys never
 * share an id, and the id needs no escaping in a URL fragment or a CSS selector.
 */
function encodeAnchorKey(key: string): string {
  return key.replace(/[^A-Za-z0-9-]/g, (ch) => `_${ch.charCodeAt(0).toString(16)}_`);
}

/** A spec-table row by its groupId (`${rowId}:${conditionsKey}`). */
export function diffRowAnchorId(groupId: string): string {
  return `diff-row-${encodeAnchorKey(groupId)}`;
}

/** A chart overlay panel by its id (the chart id, with the series when split). */
export function diffChartAnchorId(panelId: string): string {
  return `diff-chart-${encodeAnchorKey(panelId)}`;
}

/** A prose section by its id. */
export function diffProseAnchorId(sectionId: string): string {
  return `diff-prose-${encodeAnchorKey(sectionId)}`;
}
